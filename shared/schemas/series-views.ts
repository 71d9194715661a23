import type { RowProblem } from './common.js';

/** What the server returns about series; one definition for the server and the client. */

/** A stored series: one decade of values in [1, 10); standard ones (IEC 60063) are read-only. */
export interface ResistorSeries {
  name: string;
  valuesPerDecade: number;
  values: number[];
  standard: boolean;
}

/** A checked series CSV before anything is stored: each row's value, or null where it has a problem. */
export interface SeriesPreview {
  name: string;
  rows: { row: number; value: number | null }[];
  problems: RowProblem[];
  validCount: number;
  invalidCount: number;
}

export interface SeriesImportOutcome {
  series: ResistorSeries;
  imported: number;
  skipped: number;
  problems: RowProblem[];
}
