import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { DesignDetail, DesignList, RevisionDetail } from '@shared/schemas/design-views';
import type { DesignCreateBody, DesignPatchBody, DesignSort } from '@shared/schemas/designs';

export { REVISION_STATE_LABELS, type RevisionState } from '@shared/schemas/designs';

export type { DesignDetail, DesignList, DesignRow, PersonRef, RevisionRef, RevisionSummary } from '@shared/schemas/design-views';

export type { DesignSort } from '@shared/schemas/designs';

export interface DesignListQuery {
  search?: string;
  sort: DesignSort;
  order: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

const path = (id: number) => `/api/designs/${encodeURIComponent(id)}`;

export const designsApi = {
  list: (query: DesignListQuery) => http.get<DesignList>(`/api/designs?${queryString(query)}`),
  create: (body: DesignCreateBody) => http.post<{ design: DesignDetail }>('/api/designs', body).then((r) => r.design),
  get: (id: number) => http.get<{ design: DesignDetail }>(path(id)).then((r) => r.design),
  update: (id: number, patch: DesignPatchBody) => http.patch<{ design: DesignDetail }>(path(id), patch).then((r) => r.design),
  startRevision: (id: number, fromRevisionId: number) =>
    http.post<{ revision: RevisionDetail }>(`${path(id)}/revisions`, { fromRevisionId }).then((r) => r.revision),
};
