import type { RevisionChangeRow } from '../compare/compare-types.js';
import type { GumAgreement } from '../propagation/gum-validation.js';
import type { PersonRef } from './design-views.js';
import type { RevisionState } from './designs.js';
import type { MarginInputs, MarginStudyResult } from './margin.js';

/** What the server returns for a revision's review report; one definition for the server, the PDF and the page. */

/** One parameter line of a chain stage: the number, its unit and how it reads. */
export interface ReportChainRow {
  label: string;
  value: number | string;
  unit: string;
  /** The value as the server formatted it, unit included. */
  text: string;
}

export interface ReportBudgetRow {
  label: string;
  where: string;
  unit: string;
  distribution: string;
  halfWidth: number;
  standardUncertainty: number;
  sensitivity: number;
  contributionV: number;
  sharePct: number;
  /** 2 for a second-order cross term of two inputs (JCGM 100 5.1.2 Note), 1 otherwise. */
  order: 1 | 2;
}

/** A design warning of one channel as the editor shows it; 'info' when a check could not be made. */
export interface ReportChainWarning {
  level: 'warning' | 'info';
  message: string;
  where: string;
}

export interface ReportUncertaintyChannel {
  key: string;
  name: string;
  /** Evaluation voltages where some reading wraps the counter (the numbers include the wrap). */
  counterOverflowV?: number[];
  trials: number;
  coverageProbability: number;
  gumAdequate: boolean;
  /** The JCGM 101 §8 check over the channel's voltages; absent in reports of studies stored before it had three outcomes. */
  gumAgreement?: GumAgreement;
  points: {
    voltageV: number;
    monteCarloMeanV: number;
    monteCarloIntervalV: { low: number; high: number };
    gumExpandedUncertaintyV: number;
    worstCaseMaxAbsV: number;
  }[];
  budget: {
    voltageV: number;
    combinedStandardUncertaintyV: number;
    expandedUncertaintyV: number;
    coverageFactor: number;
    rows: ReportBudgetRow[];
  };
}

export interface RunHeader {
  runId: number;
  /** Whether the study used the revision as it is now. */
  current: boolean;
  seed: number;
  trials: number | null;
  finishedAt: string | null;
  requestedBy?: PersonRef | null;
}

export interface ReportChainStage {
  stage: string;
  rows: ReportChainRow[];
}

export interface ReportSignOff {
  at: string;
  action: string;
  label: string;
  actor: { id: number | null; displayName: string | null };
  comment: string;
  /** An approval given against failing checks: the written justification and what failed at that moment. */
  override?: { justification: string; failing: { key: string; label: string }[] };
}

/** The revision under review against an earlier one, every compared value old → new. */
export interface RevisionComparison {
  /** 'previous': the revision this one was started from; 'approved': the last approved revision before it. */
  against: ('previous' | 'approved')[];
  revision: { id: number; letter: string; state: RevisionState; stateLabel: string };
  rows: RevisionChangeRow[];
  changedCount: number;
}

export interface RevisionReport {
  generatedAt: string;
  title: string;
  design: { id: number; name: string; purpose?: string; owner: PersonRef };
  revision: {
    id: number; letter: string; state: RevisionState; stateLabel: string; note: string;
    basedOnId?: number | null; createdBy: PersonRef; createdAt?: string | null; updatedAt?: string | null;
  };
  channels: { key: string; name: string; stages: ReportChainStage[]; warnings?: ReportChainWarning[] }[];
  uncertainty: null | (RunHeader & { channels: ReportUncertaintyChannel[] });
  margin: null | (RunHeader & { inputs: MarginInputs; result: MarginStudyResult });
  marginInputs: MarginInputs;
  signOff: ReportSignOff[];
  caution: { title: string; paragraphs: readonly string[] };
  /** Against the previous and the last approved revision; empty for a first revision. */
  comparisons?: RevisionComparison[];
}
