import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { StockPartBody } from '@shared/schemas/stock';
import type { StockDuplicateChoice, StockImportOutcome, StockPreview } from '@shared/schemas/stock-views';

import { STOCK_PART_LIMIT } from '@shared/schemas/stock';

export { STOCK_CSV_COLUMNS, STOCK_CSV_REQUIRED, STOCK_PART_LIMIT } from '@shared/schemas/stock';

/** A count of parts as people read it, with a thin space between thousands (10 000). */
export const partCountText = (count: number): string => count.toLocaleString('en-GB').replace(/,/g, '\u202f');
export const STOCK_LIMIT_TEXT = partCountText(STOCK_PART_LIMIT);

export interface StockPart extends StockPartBody {
  id: number;
  createdAt: string;
  updatedAt: string;
}

export type StockSort = 'ohms' | 'tolerancePct' | 'quantity' | 'updatedAt';

export interface StockListQuery {
  search?: string;
  sort: StockSort;
  order: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export type { RowProblem } from '@shared/schemas/common';
export type { StockImportOutcome as ImportOutcome, StockPreview as ImportPreview, StockDuplicateChoice } from '@shared/schemas/stock-views';

export type ImportMode = 'preview' | 'all' | 'valid-only';

/** Where the browser downloads the whole stock as CSV. */
export const STOCK_EXPORT_URL = '/api/stock/export.csv';

const path = (id: number) => `/api/stock/${encodeURIComponent(id)}`;

function fileForm(file: File): FormData {
  const form = new FormData();
  form.append('file', file);
  return form;
}

export const stockApi = {
  list: (query: StockListQuery) => http.get<{ items: StockPart[]; total: number }>(`/api/stock?${queryString(query)}`),
  create: (part: StockPartBody) => http.post<{ part: StockPart }>('/api/stock', part).then((r) => r.part),
  update: (id: number, patch: Partial<StockPartBody>) => http.patch<{ part: StockPart }>(path(id), patch).then((r) => r.part),
  remove: (id: number) => http.delete<void>(path(id)),
  preview: (file: File) => http.upload<StockPreview>('/api/stock/import?mode=preview', fileForm(file)),
  import: (file: File, mode: Exclude<ImportMode, 'preview'>, duplicates: StockDuplicateChoice = 'new-line') =>
    http.upload<StockImportOutcome>(`/api/stock/import?mode=${mode}&duplicates=${duplicates}`, fileForm(file)),
};
