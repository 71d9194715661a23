import { http } from './http';
import { ApiError } from './apiError';
import { queryString } from '@/utils/queryString';
import type { CalibrationPointBody, CsvMapping, SessionPatchBody } from '@shared/schemas/calibration';
import type { CalibrationOverview, PointsPreview, RowProblem, SessionDetail } from '@shared/schemas/calibration-views';

export type { BoardComparison as Comparison, DesignPopulation, FitView, PointsPreview, RowProblem, Spread } from '@shared/schemas/calibration-views';

export type { CalibrationOverview, CalibrationRecordView, SessionAnalysis, SessionDetail, StoredPoint } from '@shared/schemas/calibration-views';

export interface PointsImportOutcome {
  imported: number;
  skipped: number;
  problems: RowProblem[];
  session: SessionDetail;
}

export type PointWrite = Pick<CalibrationPointBody, 'appliedV' | 'frequencyHz'> & Partial<Omit<CalibrationPointBody, 'appliedV' | 'frequencyHz'>>;

const path = (id: number) => `/api/calibrations/${encodeURIComponent(id)}`;

function uploadForm(file: File, mapping?: CsvMapping): FormData {
  const form = new FormData();
  form.append('file', file);
  if (mapping) form.append('mapping', JSON.stringify(mapping));
  return form;
}

export const calibrationsApi = {
  get: (id: number) => http.get<{ session: SessionDetail }>(path(id)).then((r) => r.session),
  update: (id: number, patch: SessionPatchBody) => http.patch<{ session: SessionDetail }>(path(id), patch).then((r) => r.session),
  replacePoints: (id: number, points: PointWrite[], baseVersion: number) =>
    http.put<{ session: SessionDetail }>(`${path(id)}/points`, { points, baseVersion }).then((r) => r.session),
  setExclusion: (id: number, pointId: number, excluded: boolean, reason: string, baseVersion: number) =>
    http.patch<{ session: SessionDetail }>(`${path(id)}/points/${encodeURIComponent(pointId)}`, { excluded, reason, baseVersion }).then((r) => r.session),
  complete: (id: number) => http.post<{ session: SessionDetail }>(`${path(id)}/complete`).then((r) => r.session),
  reopen: (id: number) => http.post<{ session: SessionDetail }>(`${path(id)}/reopen`).then((r) => r.session),
  /** Without a mapping the server answers with the header and its suggested mapping only. */
  previewImport: (id: number, file: File, mapping?: CsvMapping) =>
    http.upload<PointsPreview>(`${path(id)}/points/import?mode=preview`, uploadForm(file, mapping)),
  import: (id: number, file: File, mapping: CsvMapping, mode: 'all' | 'valid-only') =>
    http.upload<PointsImportOutcome>(`${path(id)}/points/import?mode=${mode}`, uploadForm(file, mapping)),
  overview: (revisionId: number, channelKey: string) =>
    http.get<CalibrationOverview>(`/api/calibrations/overview?${queryString({ revisionId, channelKey })}`),
  /** Without a record: the latest record of a completed session, or a draft's fit computed now. */
  exportUrl: (id: number, format: 'h' | 'json', record?: number) => `${path(id)}/export.${format}${record === undefined ? '' : `?${queryString({ record })}`}`,
};

/** Fetches an export as a file, so a refusal ("nothing to export yet") reads as a message, not a blank page. */
export async function fetchExport(id: number, format: 'h' | 'json', record?: number): Promise<{ blob: Blob; fileName: string }> {
  let response: Response;
  try {
    response = await fetch(calibrationsApi.exportUrl(id, format, record), { credentials: 'same-origin' });
  } catch {
    throw new ApiError(0, 'The server could not be reached. Check your connection and try again.');
  }
  if (!response.ok) {
    const body = (await response.json().catch(() => ({}))) as { error?: string };
    throw new ApiError(response.status, body.error || `the server answered ${response.status}`);
  }
  const disposition = response.headers.get('Content-Disposition') ?? '';
  const fileName = /filename="?([^";]+)"?/.exec(disposition)?.[1] ?? `calibration-${id}.${format}`;
  return { blob: await response.blob(), fileName };
}
