import { http } from './http';
import type { RevisionReport } from '@shared/schemas/report-views';

export type { ReportBudgetRow, ReportChainRow, ReportSignOff, ReportUncertaintyChannel, RevisionComparison, RevisionReport } from '@shared/schemas/report-views';

const path = (id: number) => `/api/revisions/${encodeURIComponent(id)}`;

export const reportsApi = {
  get: (revisionId: number) => http.get<{ report: RevisionReport }>(`${path(revisionId)}/report`).then((r) => r.report),
  pdfUrl: (revisionId: number) => `${path(revisionId)}/report.pdf`,
};
