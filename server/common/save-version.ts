import { StaleSaveError } from './errors.js';
import { isoTimeOrNull } from './iso-time.js';

interface Saver { id: number; displayName: string }

/**
 * Refuses a save whose base version is not the stored one. The 409 says who saved the version that
 * stands and when, so the page can tell the person and offer to reload without losing their edits.
 */
export function assertCurrentVersion(
  subject: string, baseVersion: number | undefined, stored: { version: number; savedBy: Saver | null; savedAt: Date | string | null },
): void {
  if (baseVersion === undefined || baseVersion === stored.version) return;
  const who = stored.savedBy?.displayName ?? 'someone else';
  const when = isoTimeOrNull(stored.savedAt);
  throw new StaleSaveError(
    `the ${subject} changed after you loaded them: ${who} saved version ${stored.version}${when ? ` at ${when}` : ''}, `
      + `your save was based on version ${baseVersion} (baseVersion); nothing was saved: reload, then apply your changes again`,
    {
      subject, baseVersion, version: stored.version, savedAt: when,
      savedBy: stored.savedBy ? { id: stored.savedBy.id, displayName: stored.savedBy.displayName } : null,
    },
  );
}
