import type { ReadingErrorModel } from '../../../shared/precharge/index.js';

/** One board's recorded reading errors, per channel key, as the margin study takes them. */
export interface BoardReadingErrors {
  /** Shown in the result, e.g. "board PM-2-001 (revision A), calibrations: pack 2026-11-20, …". */
  description: string;
  channels: Record<string, ReadingErrorModel>;
}
