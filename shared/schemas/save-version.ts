import { z } from 'zod';
import type { PersonRef } from './design-views.js';

/**
 * The version of a record a save was based on. Every save of shared draft content carries it, so a save
 * made from an older copy is refused (409) instead of silently replacing someone else's newer change.
 * 0 means "nothing stored yet" (margin inputs still at their defaults).
 */
export const baseVersionSchema = z
  .number({ error: 'baseVersion is required: send the version you loaded' })
  .int({ error: 'baseVersion must be a whole number' })
  .min(0, { error: 'baseVersion must be ≥ 0' });

/** What was saved over, in the 409 body of a stale save: which version stands now, who saved it and when. */
export interface SaveConflict {
  /** What the save tried to change: 'channels', 'margin inputs' or 'calibration points'. */
  subject: string;
  baseVersion: number;
  version: number;
  savedBy: PersonRef | null;
  /** ISO time of the save that now stands, or null when it is not known. */
  savedAt: string | null;
}
