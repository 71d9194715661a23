import type { Plugin } from 'vue';
import { onSessionExpired } from '@/services/http';
import { useSessionStore } from '@/stores/session';
import { notify } from '@/composables/useNotices';
import { router } from '@/router';

/** A 401 from any call other than sign-in or "who am I" means the session ended server-side. */
export const sessionExpiry: Plugin = {
  install() {
    onSessionExpired(() => {
      useSessionStore().forget();
      notify.info('Signed out', 'Your session has ended. Please sign in again.');
      const here = router.currentRoute.value;
      if (here.name !== 'sign-in') {
        void router.replace({ name: 'sign-in', query: { next: here.fullPath } });
      }
    });
  },
};
