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
  /** Rows that match a line already on the shelf (same value, tolerance and package). */
  duplicates: StockDuplicate[];
}

/** A file row that is already on the shelf: its row number, the shelf line and that line's quantity now. */
export interface StockDuplicate {
  row: number;
  partId: number;
  quantityOnShelf: number;
}

/** What to do with rows already on the shelf: a separate new line each, or their quantity added to that line. */
export type StockDuplicateChoice = 'new-line' | 'add-quantity';

export interface StockImportOutcome {
  imported: number;
  /** Shelf lines whose quantity grew because the file repeated them (when that was chosen). */
  addedTo: number;
  skipped: number;
  problems: RowProblem[];
}
