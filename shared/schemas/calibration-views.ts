import type { CalibrationPointBody, CalibrationState, CsvMapping, FitSettings, ReferenceSpec } from './calibration.js';
import type { PersonRef } from './design-views.js';
import type { RevisionState } from './designs.js';
import type { RowProblem } from './common.js';
import type { ReferenceTraceability } from './reference-traceability.js';
import type { ReadingUncertainty } from '../fit/reading-uncertainty.js';
import type { AcceptanceDecision, GuardedDecision } from '../fit/guarded-acceptance.js';

export type { RowProblem, ReferenceTraceability };

/** What the server returns about a calibration; one definition for the server and the client. */

/** Fit of frequency on applied voltage: f = Σ b_k·V^k, b_k in Hz per V^k. */
export interface FitView {
  settings: FitSettings;
  pointsUsed: number;
  coefficients: number[];
  standardErrors: number[];
  residualStandardDeviationHz: number;
  /** How the weights were read ('relative' also for an unweighted fit, whose weights are all 1). */
  weighting: 'relative' | 'absolute';
  /** √(χ²/ν) with χ² = Σ(eᵢ/uᵢ)², for a weighted fit; near 1 when the stated u match the scatter. */
  birgeRatio: number | null;
  rSquared: number;
  degreesOfFreedom: number;
  /** Per stored point (excluded ones too): residual and studentised residual, null when excluded. */
  points: { id: number; residualHz: number | null; studentised: number | null; suspect: boolean }[];
  /** Fitted line with 95 % confidence and prediction bands across the fitted range. */
  band: { appliedV: number; fittedHz: number; confidenceLowHz: number; confidenceHighHz: number; predictionLowHz: number; predictionHighHz: number }[];
  /** The firmware's form, volts = Σ c_k·f^k: exact for degree 1, a least-squares inverse for 2–3. */
  inverse: { coefficients: number[]; exact: boolean; maxInverseErrorV: number };
  /**
   * Uncertainty of a voltage read back through this fit, 95 %: the fit and a new reading's scatter (its own u(f),
   * interpolated over the bench points' frequencies, for a weighted fit), the reference, and the inverse polynomial's
   * largest departure for degrees 2–3.
   */
  readingUncertainty: ReadingUncertainty[];
  rangeV: { min: number; max: number };
  rangeHz: { min: number; max: number };
}

export interface Spread {
  low: number;
  high: number;
  median: number;
  histogram: { edges: number[]; counts: number[] };
}

/** The design's simulated boards: uncalibrated reading errors V̂ = V·(1 + g) + o. */
export interface DesignPopulation {
  trials: number;
  ambientC: number;
  /** g as a fraction (0.01 = 1 %). */
  gainError: Spread;
  offsetErrorV: Spread;
}

export interface BoardComparison {
  population: DesignPopulation;
  /** The board's gain error (fraction) and offset error (V), with their expanded uncertainties at coverageFactor. */
  board: { gainError: number; offsetErrorV: number; gainErrorExpanded: number; offsetErrorExpandedV: number; coverageFactor: number };
  /** The estimates alone inside the design's interval (no guard band): where the charts place the board. */
  gainWithin: boolean;
  offsetWithin: boolean;
  within: boolean;
  /** The guarded decision is undecided: a quantity lies in a guard band. */
  undecided: boolean;
  /** Guarded acceptance (JCGM 106:2012 §8) of each quantity and of the board, with the rule as stated. */
  acceptance: {
    rule: string;
    decision: AcceptanceDecision;
    gain: GuardedDecision;
    offset: GuardedDecision;
    /** Probability that the board does not conform, at most (Bonferroni over gain and offset). */
    nonConformanceAtMost: number;
  };
  /** The reference instrument's share of the board's standard uncertainties (one common error, so correlated). */
  referenceShare: { gainFraction: number; offsetV: number };
  likelyCauses: string[];
}

export interface PointsPreview {
  headers: string[];
  delimiter: string;
  decimalSeparator: '.' | ',';
  mapping: CsvMapping | null;
  suggestedMapping: Partial<CsvMapping>;
  rows: { row: number; point: CalibrationPointBody | null }[];
  problems: RowProblem[];
  validCount: number;
  invalidCount: number;
}

export interface SessionSummary {
  id: number;
  boardId: number;
  channelKey: string;
  state: CalibrationState;
  performedOn: string;
  ambientC: number;
  /** The reference instrument's identifier, certificate and due date, flagged when the session came after the due date. */
  traceability: ReferenceTraceability;
  tester?: PersonRef;
  completedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface BoardRow {
  id: number;
  serialNumber: string;
  revisionId: number;
  revisionLetter: string;
  designId: number;
  designName: string;
  buildDate: string;
  note: string;
  /** The revision's state when the board was recorded; null for boards recorded before it was kept. */
  revisionStateAtBuild: RevisionState | null;
  /** Built to a revision that was neither approved nor in review at the time (a draft, or one sent back). */
  builtToDraft: boolean;
  createdAt: string;
  /** The newest session of each channel, by channel key. */
  latestByChannel: Record<string, SessionSummary>;
}

export interface BoardDetail extends BoardRow {
  sessions: SessionSummary[];
}

export interface StoredPoint {
  id: number;
  position: number;
  appliedV: number;
  frequencyHz: number;
  counts: number | null;
  uncertaintyHz: number | null;
  excluded: boolean;
  excludedReason: string;
}

export interface SessionAnalysis {
  fit: FitView | null;
  comparison: BoardComparison | null;
  /** Why there is no fit yet, e.g. "no points yet". */
  reason: string | null;
}

/**
 * A frozen record of a completed session: the fit, the reading coefficients (float and fixed point) and the
 * session's identity, stored once as canonical JSON with its SHA-256. Exports of a completed session come from
 * it; completing again after a reopen adds the next sequence number and leaves the earlier ones as they were.
 */
export interface CalibrationRecordView {
  sequence: number;
  /** SHA-256 of the record's canonical JSON, lower-case hex. */
  sha256: string;
  createdAt: string;
  createdBy: PersonRef;
}

export interface SessionDetail extends SessionSummary {
  reference: ReferenceSpec;
  fit: FitSettings;
  note: string;
  board: { id: number; serialNumber: string; revisionId: number; revisionLetter: string; designId: number; designName: string };
  points: StoredPoint[];
  analysis: SessionAnalysis;
  /** Up by one with every change of the points (replace, import, exclusion); a points save names the version it was based on. */
  pointsVersion: number;
  /** Who changed the points last and when (null before the first change). */
  pointsSavedBy: PersonRef | null;
  pointsSavedAt: string | null;
  /** Frozen records, oldest first; for a completed session, analysis.fit is the latest record's fit. */
  records: CalibrationRecordView[];
}

export interface CalibrationOverview {
  channelKey: string;
  channelName: string;
  /** The decision rule each board's decision follows. */
  rule: string;
  population: DesignPopulation;
  boards: { boardId: number; serialNumber: string; sessionId: number | null; gainError: number | null; offsetErrorV: number | null; within: boolean | null;
    /** Guarded acceptance against the design's interval; null without a completed session. */
    decision: AcceptanceDecision | null;
    /** The latest completed session's reference instrument traceability (overdue: performed after its due date); null without one. */
    traceability: ReferenceTraceability | null }[];
}
