import type { User } from '../entities/User.js';

/** How long a signed-in person's record is reused between requests. */
const TTL_MS = 2000;

/**
 * Every request of a session needs its user; reading it from the database each time is most of a
 * small request's cost. Entries live two seconds and are dropped at once when this process changes
 * the user (role, deactivation), so a deactivated account is refused on its next request.
 */
export class UserCache {
  private readonly entries = new Map<number, { user: User; until: number }>();

  get(id: number): User | undefined {
    const hit = this.entries.get(id);
    if (!hit) return undefined;
    if (hit.until < Date.now()) {
      this.entries.delete(id);
      return undefined;
    }
    return hit.user;
  }

  set(user: User): void {
    if (this.entries.size > 5000) this.entries.clear();
    this.entries.set(user.id, { user, until: Date.now() + TTL_MS });
  }

  forget(id: number): void {
    this.entries.delete(id);
  }
}

/** One cache per database: the app and the services that change users share it through this map. */
const caches = new WeakMap<object, UserCache>();
export function userCacheFor(dataSource: object): UserCache {
  let cache = caches.get(dataSource);
  if (!cache) caches.set(dataSource, (cache = new UserCache()));
  return cache;
}
