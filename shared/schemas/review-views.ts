import type { PersonRef, RevisionSummary } from './design-views.js';
import type { MarginVerdict } from './margin.js';

/** What the server returns about reviews; one definition for the server and the client. */

export type ReviewListState = 'in_review' | 'changes_requested' | 'approved' | 'all';

export interface ReviewRow {
  revision: RevisionSummary;
  design: { id: number; name: string; owner: PersonRef };
  submittedAt: string | null;
  submittedBy: { id: number | null; displayName: string | null } | null;
  lastEvent: { action: string; at: string; actor: { id: number | null; displayName: string | null } } | null;
  /** The latest finished margin study: its verdict and how many criteria failed. */
  margin: { runId: number; verdict: MarginVerdict | null; failed: number } | null;
}

/** Who the workflow's e-mails reached and who they did not. */
export interface MailOutcome {
  sent: string[];
  failed: string[];
}

/** The answer to submit, approve, request changes and reopen. */
export interface TransitionAnswer {
  revision: RevisionSummary;
  mail?: MailOutcome;
}

/** One check a revision fails at approval time, computed by the server (key stable, label for people). */
export interface FailingCheck {
  key: string;
  label: string;
}

/** What the approve form needs to know before asking: what fails, and whether this person may approve at all. */
export interface ApprovalCheck {
  failing: FailingCheck[];
  /** Why this person may not approve (they created, edited, submitted or reopened it), or null. */
  barred: string | null;
  minJustificationChars: number;
  /** Who took part in the revision's work and what each did; none of them may approve it. */
  contributors: { id: number; displayName: string | null; did: string[] }[];
}
