import type { EntityManager } from 'typeorm';
import { ConflictError } from '../../common/errors.js';
import { User } from '../../entities/User.js';

/** Names compared as people read them: compatibility forms folded, case ignored. */
const nameKey = (name: string) => name.normalize('NFKC').toLocaleLowerCase('en').replace(/\s+/g, ' ').trim();

/**
 * Refuses a display name someone else already has, ignoring case and spacing, so two people cannot look alike
 * in the People list, sign-offs and the audit trail. Reads the names in JavaScript because SQLite's LOWER folds
 * only ASCII; a team has tens of people, not millions.
 */
export async function assertDisplayNameFree(manager: EntityManager, displayName: string): Promise<void> {
  const wanted = nameKey(displayName);
  const rows = await manager.getRepository(User).find({ select: { id: true, displayName: true } });
  if (rows.some((row) => nameKey(row.displayName) === wanted)) {
    throw new ConflictError(`someone is already called ${displayName}; add an initial or a surname`, {
      displayName: 'someone already has this display name',
    });
  }
}
