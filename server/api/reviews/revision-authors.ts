import { In, type DataSource } from 'typeorm';
import { AuditEvent } from '../../entities/AuditEvent.js';
import type { Revision } from '../../entities/Revision.js';
import { User } from '../../entities/User.js';

/** What each authoring action reads as in a refusal ("you … on …"). */
const AUTHORING: Record<string, string> = {
  'revision.start': 'started',
  'revision.edit': 'edited',
  'margin.inputs': 'changed the margin inputs of',
  'revision.submit': 'submitted',
  'revision.reopen': 'reopened',
};

/** State after each review transition, to know what the revision was when a study was asked for. */
const STATE_AFTER: Record<string, string> = {
  'revision.submit': 'in_review', 'revision.approve': 'approved', 'revision.request-changes': 'changes_requested', 'revision.reopen': 'draft',
};

/** Short words for the list of who took part ("created, edited, submitted"). */
const PART: Record<string, string> = {
  'revision.start': 'started it', 'revision.edit': 'edited the channels', 'margin.inputs': 'changed the margin inputs',
  'revision.submit': 'submitted it', 'revision.reopen': 'reopened it',
};

/**
 * Everyone who took part in the revision's work, with what they did, in the order they first did it: the
 * people approvalBar turns away.
 */
export async function revisionContributors(dataSource: DataSource, revision: Revision): Promise<{ id: number; displayName: string | null; did: string[] }[]> {
  const events = await dataSource.getRepository(AuditEvent).find({ where: { subject: `revision:${revision.id}` }, order: { id: 'ASC' } });
  const parts = new Map<number, Set<string>>([[revision.createdById, new Set(['created it'])]]);
  let state = 'draft';
  for (const e of events) {
    const part = PART[e.action] ?? (e.action === 'study.request' && state === 'draft' ? 'ran a study as a draft' : null);
    if (part && e.actorId !== null) parts.set(e.actorId, (parts.get(e.actorId) ?? new Set()).add(part));
    state = STATE_AFTER[e.action] ?? state;
  }
  const people = await dataSource.getRepository(User).findBy({ id: In([...parts.keys()]) });
  return [...parts].map(([id, did]) => ({ id, displayName: people.find((p) => p.id === id)?.displayName ?? null, did: [...did] }));
}

const when = (at: Date) => `${new Date(at).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/**
 * Why this person may not approve the revision, or null. Whoever created, edited, submitted or reopened it,
 * or ran its studies while it was a draft (the studies it was submitted with), took part in the work under
 * review. Studies run while it is in review are the reviewer's own checks and do not count.
 */
export async function approvalBar(dataSource: DataSource, revision: Revision, actorId: number): Promise<string | null> {
  if (revision.createdById === actorId) return `you created revision ${revision.letter}; someone else must approve it`;
  const events = await dataSource.getRepository(AuditEvent).find({ where: { subject: `revision:${revision.id}` }, order: { id: 'ASC' } });
  let state = 'draft';
  let last: string | null = null;
  for (const e of events) {
    if (e.actorId === actorId) {
      if (AUTHORING[e.action]) last = `${AUTHORING[e.action]} revision ${revision.letter} on ${when(e.at)}`;
      else if (e.action === 'study.request' && state === 'draft') last = `ran a study of revision ${revision.letter} while it was a draft, on ${when(e.at)}`;
    }
    state = STATE_AFTER[e.action] ?? state;
  }
  return last ? `you ${last}; someone else must approve it` : null;
}
