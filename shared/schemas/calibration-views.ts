import type { CalibrationPointBody, CalibrationState, CsvMapping, FitSettings, ReferenceSpec } from './calibration.js';
import type { PersonRef } from './design-views.js';
import type { RowProblem } from './common.js';
import type { ReadingUncertainty } from '../fit/reading-uncertainty.js';

export type { RowProblem };

/** What the server returns about a calibration; one definition for the server and the client. */

/** Fit of frequency on applied voltage: f = Σ b_k·V^k, b_k in Hz per V^k. */
export interface FitView {
  settings: FitSettings;
  pointsUsed: number;
  coefficients: number[];
  standardErrors: number[];
  residualStandardDeviationHz: number;
  rSquared: number;
  degreesOfFreedom: number;
  /** Per stored point (excluded ones too): residual and studentised residual, null when excluded. */
  points: { id: number; residualHz: number | null; studentised: number | null; suspect: boolean }[];
  /** Fitted line with 95 % confidence and prediction bands across the fitted range. */
  band: { appliedV: number; fittedHz: number; confidenceLowHz: number; confidenceHighHz: number; predictionLowHz: number; predictionHighHz: number }[];
  /** The firmware's form, volts = Σ c_k·f^k: exact for degree 1, a least-squares inverse for 2–3. */
  inverse: { coefficients: number[]; exact: boolean; maxInverseErrorV: number };
  /** Uncertainty of a voltage read back through this fit (fit and a new reading's scatter, and the reference), 95 %. */
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
  gainWithin: boolean;
  offsetWithin: boolean;
  within: boolean;
  /** The board's own uncertainty interval reaches across a limit of the design's interval. */
  undecided: boolean;
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

export interface SessionDetail extends SessionSummary {
  reference: ReferenceSpec;
  fit: FitSettings;
  note: string;
  board: { id: number; serialNumber: string; revisionId: number; revisionLetter: string; designId: number; designName: string };
  points: StoredPoint[];
  analysis: SessionAnalysis;
}

export interface CalibrationOverview {
  channelKey: string;
  channelName: string;
  population: DesignPopulation;
  boards: { boardId: number; serialNumber: string; sessionId: number | null; gainError: number | null; offsetErrorV: number | null; within: boolean | null }[];
}
