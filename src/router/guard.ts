import type { RouteLocationNormalized, RouteLocationRaw } from 'vue-router';
import { ROLE_GROUPS } from '@shared/schemas/roles';
import { useSessionStore } from '@/stores/session';
import { notify } from '@/composables/useNotices';

/** Only paths inside this app may be a "next" target; anything else would be an open redirect. */
export function safeNext(value: unknown): string {
  return typeof value === 'string' && value.startsWith('/') && !value.startsWith('//') ? value : '/';
}

export async function sessionGuard(to: RouteLocationNormalized): Promise<true | RouteLocationRaw> {
  const session = useSessionStore();
  try {
    await session.load();
  } catch {
    notify.error('Server unavailable', 'Tallyvolt could not check who is signed in. Try again shortly.');
  }

  if (to.name === 'sign-in' && session.signedIn) return safeNext(to.query.next);
  if (to.meta.public) return true;
  if (!session.signedIn) return { name: 'sign-in', query: { next: to.fullPath } };

  const may = to.meta.may;
  if (may && !session.can(may)) {
    const allowed = ROLE_GROUPS[may].join(' or ');
    notify.warn('Not available to your role', `${to.meta.area ?? 'That page'} is for the ${allowed} role.`);
    return { name: 'home' };
  }
  return true;
}
