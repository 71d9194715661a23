import type { Design } from '../../entities/Design.js';
import type { Revision } from '../../entities/Revision.js';
import { compareLetters } from './revision-letters.js';
import { isoTime } from '../../common/iso-time.js';
import type { DesignDetail, DesignRow, RevisionDetail, RevisionSummary } from '../../../shared/schemas/design-views.js';

export function toRevisionSummary(r: Revision): RevisionSummary {
  return {
    id: r.id,
    letter: r.letter,
    state: r.state,
    note: r.note,
    basedOnId: r.basedOnId,
    createdBy: r.createdBy ? { id: r.createdBy.id, displayName: r.createdBy.displayName } : undefined,
    createdAt: isoTime(r.createdAt),
    updatedAt: isoTime(r.updatedAt),
  };
}

export function toDesignRow(d: Design): DesignRow {
  const latest = [...(d.revisions ?? [])].sort((a, b) => compareLetters(a.letter, b.letter)).at(-1);
  return {
    id: d.id,
    name: d.name,
    purpose: d.purpose,
    owner: { id: d.owner.id, displayName: d.owner.displayName },
    latestRevision: latest ? { id: latest.id, letter: latest.letter, state: latest.state } : null,
    createdAt: isoTime(d.createdAt),
    updatedAt: isoTime(d.updatedAt),
  };
}

export function toDesignDetail(d: Design): DesignDetail {
  return { ...toDesignRow(d), revisions: d.revisions.map(toRevisionSummary) };
}

export function toRevisionDetail(r: Revision): RevisionDetail {
  return {
    ...toRevisionSummary(r),
    design: { id: r.design.id, name: r.design.name, owner: { id: r.design.owner.id, displayName: r.design.owner.displayName } },
    channels: r.channels.map((c) => ({ id: c.id, key: c.key, position: c.position, definition: c.definition })),
    version: r.version,
    updatedBy: r.updatedBy ? { id: r.updatedBy.id, displayName: r.updatedBy.displayName } : null,
  };
}
