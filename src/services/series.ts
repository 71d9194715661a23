import { http } from './http';
import type { SeriesCreateBody } from '@shared/schemas/series';
import type { ResistorSeries, SeriesImportOutcome, SeriesPreview } from '@shared/schemas/series-views';

export type { ResistorSeries, SeriesImportOutcome, SeriesPreview } from '@shared/schemas/series-views';
export { MAX_SERIES_VALUES, seriesCreateSchema } from '@shared/schemas/series';

const path = (name: string) => `/api/series/${encodeURIComponent(name)}`;
const importPath = (name: string, mode: 'preview' | 'all' | 'valid-only') =>
  `/api/series/import?mode=${mode}&name=${encodeURIComponent(name)}`;

function fileForm(file: File): FormData {
  const form = new FormData();
  form.append('file', file);
  return form;
}

export const seriesApi = {
  list: () => http.get<{ items: ResistorSeries[] }>('/api/series').then((r) => r.items),
  create: (body: SeriesCreateBody) => http.post<{ series: ResistorSeries }>('/api/series', body).then((r) => r.series),
  remove: (name: string) => http.delete<void>(path(name)),
  preview: (name: string, file: File) => http.upload<SeriesPreview>(importPath(name, 'preview'), fileForm(file)),
  import: (name: string, file: File, mode: 'all' | 'valid-only') =>
    http.upload<SeriesImportOutcome>(importPath(name, mode), fileForm(file)),
};
