import 'vue-router';
import type { RoleGroup } from '@shared/schemas/roles';

export {};

declare module 'vue-router' {
  interface RouteMeta {
    /** Shown in the browser tab, before "· Tallyvolt". */
    title?: string;
    /** Reachable without signing in. */
    public?: boolean;
    /** Drawn without the top bar (sign-in, invitation). */
    bare?: boolean;
    /** The role group allowed in; absent means any signed-in person. */
    may?: RoleGroup;
    /** Uses the full window width (editors, wide tables) instead of the reading measure. */
    wide?: boolean;
    /** How the page is named when someone without the role is turned away. */
    area?: string;
  }
}
