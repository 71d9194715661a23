import type { RowProblem } from './common.js';
import type { StockPartBody } from './stock.js';

/** What the server returns about stock imports; one definition for the server and the client. */

/** A checked CSV before anything is stored: each row read as a part, or null where it has a problem. */
export interface StockPreview {
  rows: { row: number; part: StockPartBody | null }[];
  problems: RowProblem[];
  validCount: number;
  invalidCount: number;
  /** How many more parts the stock takes (STOCK_PART_LIMIT less those stored). */
  room: number;
}

export interface StockImportOutcome {
  imported: number;
  skipped: number;
  problems: RowProblem[];
}
