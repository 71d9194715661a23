import { In, type DataSource } from 'typeorm';
import type { RevisionState } from '../../../shared/schemas/designs.js';
import { REVISION_STATE_LABELS } from '../../../shared/schemas/designs.js';
import { MIN_JUSTIFICATION_CHARS, type ApproveBody, type ReviewListQuery } from '../../../shared/schemas/reviews.js';
import { acknowledgesExactly, failingChecks } from './approval-checks.js';
import { approvalBar, revisionContributors } from './revision-authors.js';
import { recordAudit } from '../../common/audit.js';
import { BadRequestError, ConflictError, ForbiddenError } from '../../common/errors.js';
import type { Mailer, MailMessage } from '../../common/mail.js';
import { AuditEvent } from '../../entities/AuditEvent.js';
import { Revision } from '../../entities/Revision.js';
import { User } from '../../entities/User.js';
import { latestDoneRun, currentRunHash } from '../margin/margin.service.js';
import { getRevision } from '../revisions/revisions.service.js';
import { decisionMessage, submittedMessage } from './reviews.mail.js';
import { isoTime } from '../../common/iso-time.js';
import type { ApprovalCheck, FailingCheck, MailOutcome } from '../../../shared/schemas/review-views.js';
import type { MarginVerdict } from '../../../shared/schemas/margin.js';

/** Audit actions of the review workflow, oldest first in a revision's history. */
export const REVIEW_ACTIONS = ['revision.submit', 'revision.approve', 'revision.request-changes', 'revision.reopen'] as const;
export type ReviewAction = (typeof REVIEW_ACTIONS)[number];


export interface TransitionResult {
  revision: Revision;
  mail: MailOutcome;
}

/** What a submission still needs: each finished study must have used the revision as it is now. */
export async function missingStudies(dataSource: DataSource, revision: Revision): Promise<Record<string, string>> {
  const missing: Record<string, string> = {};
  for (const [kind, field, name] of [['uncertainty', 'uncertaintyStudy', 'uncertainty study'], ['margin', 'marginStudy', 'margin study']] as const) {
    const run = await latestDoneRun(dataSource, revision.id, kind);
    if (!run) missing[field] = `no finished ${name}; run one`;
    else if (run.inputsHash !== await currentRunHash(dataSource, revision, kind)) missing[field] = `the latest finished ${name} used older inputs; run it again`;
  }
  return missing;
}

/**
 * Moves a revision from one state to the next in one transaction, guarded by the state it must be in
 * (a concurrent transition makes this one fail with 409 rather than both succeeding).
 */
async function transition(
  dataSource: DataSource, actor: User, revisionId: number, from: RevisionState[], to: RevisionState, action: ReviewAction, comment: string,
  extra: Record<string, unknown> = {},
): Promise<Revision> {
  await dataSource.transaction(async (m) => {
    const revision = await getRevision(m, revisionId);
    if (!from.includes(revision.state)) {
      throw new ConflictError(`revision ${revision.letter} is ${REVISION_STATE_LABELS[revision.state].toLowerCase()}; this needs it ${from.map((s) => REVISION_STATE_LABELS[s].toLowerCase()).join(' or ')}`);
    }
    const changed = await m.getRepository(Revision).update({ id: revisionId, state: In(from) }, { state: to, updatedAt: new Date() });
    if (!changed.affected) throw new ConflictError(`revision ${revision.letter} changed state meanwhile; reload it`);
    await recordAudit(m, actor.id, action, `revision:${revisionId}`, { from: revision.state, to, ...(comment ? { comment } : {}), ...extra });
  });
  return getRevision(dataSource, revisionId);
}

/** Sends after the commit; a failed send is logged and audited, the transition stands. */
async function sendAll(dataSource: DataSource, mailer: Mailer, actor: User, revisionId: number, messages: MailMessage[]): Promise<MailOutcome> {
  const outcome: MailOutcome = { sent: [], failed: [] };
  for (const message of messages) {
    try {
      await mailer.send(message);
      outcome.sent.push(message.to);
    } catch (err) {
      console.error(`[mail] review message to ${message.to} not sent`, err);
      outcome.failed.push(message.to);
    }
  }
  if (outcome.failed.length) await recordAudit(dataSource.manager, actor.id, 'review.mail-failed', `revision:${revisionId}`, { to: outcome.failed });
  return outcome;
}

const reviewLink = (baseUrl: string, revisionId: number) => `${baseUrl}/revisions/${revisionId}/review`;

export async function submitForReview(dataSource: DataSource, mailer: Mailer, actor: User, revisionId: number, baseUrl: string): Promise<TransitionResult> {
  const revision = await getRevision(dataSource, revisionId);
  if (revision.state === 'draft') {
    const missing = await missingStudies(dataSource, revision);
    if (Object.keys(missing).length) {
      throw new ConflictError(`revision ${revision.letter} cannot go to review yet: ${Object.values(missing).join('; ')}`, missing);
    }
  }
  const submitted = await transition(dataSource, actor, revisionId, ['draft'], 'in_review', 'revision.submit', '');
  const leads = await dataSource.getRepository(User).find({ where: { role: 'lead', active: true }, order: { id: 'ASC' } });
  const link = reviewLink(baseUrl, revisionId);
  const mail = await sendAll(dataSource, mailer, actor, revisionId, leads.map((lead) => submittedMessage(lead.email, submitted, actor.displayName, link)));
  return { revision: submitted, mail };
}

/** What the approve form shows before asking: the failing checks and whether this person may approve. */
export async function approvalCheck(dataSource: DataSource, actor: User, revisionId: number): Promise<ApprovalCheck> {
  const revision = await getRevision(dataSource, revisionId);
  return {
    failing: await failingChecks(dataSource, revision), barred: await approvalBar(dataSource, revision, actor.id),
    minJustificationChars: MIN_JUSTIFICATION_CHARS, contributors: await revisionContributors(dataSource, revision),
  };
}

/**
 * Nobody who took part in the work approves it, whatever their role. Against failing checks the approval must
 * carry a written justification and acknowledge exactly the checks the server finds failing now; both are stored
 * with the approval as an override.
 */
async function approvalOverride(dataSource: DataSource, actor: User, revision: Revision, body: ApproveBody): Promise<Record<string, unknown>> {
  const bar = await approvalBar(dataSource, revision, actor.id);
  if (bar) throw new ForbiddenError(bar);
  const failing = await failingChecks(dataSource, revision);
  if (!failing.length) return {};
  const named = failing.map((f) => f.label).join('; ');
  if (body.justification.length < MIN_JUSTIFICATION_CHARS) {
    throw new BadRequestError(`revision ${revision.letter} fails ${failing.length === 1 ? 'a check' : `${failing.length} checks`} (${named}); approving it needs a written justification`,
      { justification: `justification is required to approve against failing checks: at least ${MIN_JUSTIFICATION_CHARS} characters saying why` });
  }
  if (!acknowledgesExactly(body.acknowledged, failing)) {
    throw new BadRequestError(`acknowledged must name exactly the checks that fail now: ${failing.map((f) => f.key).join(', ')}`,
      { acknowledged: `acknowledged must name exactly the failing checks: ${named}` });
  }
  return { override: { justification: body.justification, failing } };
}

/** Approves or sends back a revision in review; the revision's creator and the design owner are told. */
export async function decideReview(
  dataSource: DataSource, mailer: Mailer, actor: User, revisionId: number, decision: 'approve' | 'request-changes', body: ApproveBody | { comment: string }, baseUrl: string,
): Promise<TransitionResult> {
  const { comment } = body;
  const before = await getRevision(dataSource, revisionId);
  // Sending one's own work back is harmless (it only returns it to draft), so only approval is barred to its authors.
  const extra = decision === 'approve' && before.state === 'in_review' ? await approvalOverride(dataSource, actor, before, body as ApproveBody) : {};
  const override = extra.override as { justification: string; failing: FailingCheck[] } | undefined;
  const revision = decision === 'approve'
    ? await transition(dataSource, actor, revisionId, ['in_review'], 'approved', 'revision.approve', comment, extra)
    : await transition(dataSource, actor, revisionId, ['in_review'], 'changes_requested', 'revision.request-changes', comment);
  const recipients = await dataSource.getRepository(User).find({ where: { id: In([revision.createdById, revision.design.ownerId]), active: true }, order: { id: 'ASC' } });
  const link = reviewLink(baseUrl, revisionId);
  const mail = await sendAll(dataSource, mailer, actor, revisionId,
    recipients.map((to) => decisionMessage(to.email, revision, decision, actor.displayName, comment, link, override)));
  return { revision, mail };
}

/** Changes requested → draft again, so the designer edits the same letter (the other way on is the next revision). */
export async function reopenRevision(dataSource: DataSource, actor: User, revisionId: number): Promise<Revision> {
  return transition(dataSource, actor, revisionId, ['changes_requested'], 'draft', 'revision.reopen', '');
}

/** Revisions for the leads' list, newest change first, with who submitted them and when. */
export async function listReviews(dataSource: DataSource, query: ReviewListQuery) {
  const states: RevisionState[] = query.state === 'all' ? ['in_review', 'changes_requested', 'approved'] : [query.state];
  const [revisions, total] = await dataSource.getRepository(Revision).findAndCount({
    where: { state: In(states) },
    relations: { design: { owner: true }, createdBy: true },
    order: { updatedAt: 'DESC', id: 'DESC' },
    skip: (query.page - 1) * query.pageSize,
    take: query.pageSize,
  });
  const subjects = revisions.map((r) => `revision:${r.id}`);
  const events = subjects.length
    ? await dataSource.getRepository(AuditEvent).find({ where: { subject: In(subjects), action: In([...REVIEW_ACTIONS]) }, order: { id: 'ASC' } })
    : [];
  const actorIds = [...new Set(events.map((e) => e.actorId).filter((id): id is number => id !== null))];
  const actors = actorIds.length ? await dataSource.getRepository(User).findBy({ id: In(actorIds) }) : [];
  const nameOf = (id: number | null) => actors.find((a) => a.id === id)?.displayName ?? null;
  const margins = await Promise.all(revisions.map((r) => latestDoneRun(dataSource, r.id, 'margin')));
  const items = revisions.map((r, i) => {
    const mine = events.filter((e) => e.subject === `revision:${r.id}`);
    const submit = mine.filter((e) => e.action === 'revision.submit').at(-1);
    const last = mine.at(-1);
    const result = margins[i]?.result as { verdict?: MarginVerdict; summary?: { pass: boolean }[] } | undefined;
    return {
      revision: r,
      submittedAt: submit ? isoTime(submit.at) : null,
      submittedBy: submit ? { id: submit.actorId, displayName: nameOf(submit.actorId) } : null,
      lastEvent: last ? { action: last.action, at: isoTime(last.at), actor: { id: last.actorId, displayName: nameOf(last.actorId) } } : null,
      margin: margins[i] && result
        ? { runId: margins[i]!.id, verdict: result.verdict ?? null, failed: (result.summary ?? []).filter((c) => !c.pass).length }
        : null,
    };
  });
  return { items, total };
}
