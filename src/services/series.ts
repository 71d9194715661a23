import { http } from './http';

export interface ResistorSeries {
  name: string;
  valuesPerDecade: number;
  values: number[];
}

export const seriesApi = {
  list: () => http.get<{ items: ResistorSeries[] }>('/api/series').then((r) => r.items),
};
