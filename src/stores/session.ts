import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import { authApi, type SignInRequest } from '@/services/auth';
import { isApiError } from '@/services/apiError';
import { resetSessionExpiry, silenceSessionExpiry } from '@/services/http';
import { ROLE_GROUPS, type RoleGroup } from '@shared/schemas/roles';
import type { Role, User } from '@/services/users';

export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null);
  const loaded = ref(false);
  let pending: Promise<void> | null = null;

  const role = computed<Role | null>(() => user.value?.role ?? null);
  const signedIn = computed(() => user.value !== null);

  /** Asks the server who is signed in; repeated calls share the first answer. */
  function load(): Promise<void> {
    if (loaded.value) return Promise.resolve();
    pending ??= authApi
      .session()
      .then((found) => (found ? adopt(found) : forget()))
      .catch((error: unknown) => {
        user.value = null;
        // 401 simply means nobody is signed in; anything else is worth telling the person.
        if (!isApiError(error) || error.status !== 401) throw error;
      })
      .finally(() => {
        loaded.value = true;
        pending = null;
      });
    return pending;
  }

  async function signIn(request: SignInRequest): Promise<User> {
    const signedInUser = await authApi.signIn(request);
    adopt(signedInUser);
    return signedInUser;
  }

  async function signOut(): Promise<void> {
    // A deliberate sign-out is not an expired session: a request still in flight may get a 401, and that must
    // not tell the person their session has ended. Signing in again re-arms the notice.
    silenceSessionExpiry();
    try {
      await authApi.signOut();
    } finally {
      forget();
    }
  }

  /** Takes a user the server has just signed in (sign-in, accepted invitation). */
  function adopt(next: User): void {
    user.value = next;
    loaded.value = true;
    resetSessionExpiry();
  }

  function forget(): void {
    user.value = null;
    loaded.value = true;
  }

  /** Whether the signed-in person may do what the group names; the API's route rules read the same groups. */
  function can(group: RoleGroup): boolean {
    return role.value !== null && (ROLE_GROUPS[group] as readonly Role[]).includes(role.value);
  }

  return { user, role, signedIn, loaded, load, signIn, signOut, adopt, forget, can };
});
