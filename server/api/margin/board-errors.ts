import type { DataSource } from 'typeorm';
import type { ReadingErrorModel } from '../../../shared/precharge/index.js';

/** One board's recorded reading errors, per channel key, as the margin study takes them. */
export interface BoardReadingErrors {
  /** Shown in the result, e.g. "board PM-2 #3, session of 2031-04-02". */
  description: string;
  channels: Record<string, ReadingErrorModel>;
}

export type BoardReadingErrorsFn = (dataSource: DataSource, boardId: number) => Promise<BoardReadingErrors>;

let provider: BoardReadingErrorsFn | null = null;

/**
 * The calibration work registers its `boardReadingErrors(dataSource, boardId)` here (e.g. in
 * app.ts); until then margin studies refuse the `board` reading-error mode.
 */
export function registerBoardReadingErrors(fn: BoardReadingErrorsFn | null): void {
  provider = fn;
}

export const boardReadingErrorsProvider = (): BoardReadingErrorsFn | null => provider;
