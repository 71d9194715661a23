import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { DesignCreateBody, DesignPatchBody, RevisionState } from '@shared/schemas/designs';
import type { RevisionDetail } from './revisions';

export { REVISION_STATE_LABELS, type RevisionState } from '@shared/schemas/designs';

export interface PersonRef {
  id: number;
  displayName: string;
}

export interface RevisionRef {
  id: number;
  letter: string;
  state: RevisionState;
}

export interface DesignRow {
  id: number;
  name: string;
  purpose: string;
  owner: PersonRef;
  latestRevision: RevisionRef | null;
  createdAt: string;
  updatedAt: string;
}

export interface RevisionSummary extends RevisionRef {
  note: string;
  basedOnId: number | null;
  createdBy?: PersonRef;
  createdAt: string;
  updatedAt: string;
}

export interface DesignDetail extends DesignRow {
  revisions: RevisionSummary[];
}

export type DesignSort = 'name' | 'updatedAt' | 'createdAt';

export interface DesignListQuery {
  search?: string;
  sort: DesignSort;
  order: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export interface DesignList {
  items: DesignRow[];
  total: number;
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
