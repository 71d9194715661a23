import { http } from './http';
import type { ResistorSeries } from '@shared/schemas/admin-views';

export type { ResistorSeries } from '@shared/schemas/admin-views';

export const seriesApi = {
  list: () => http.get<{ items: ResistorSeries[] }>('/api/series').then((r) => r.items),
};
