import type { CalibrationPointBody, CsvMapping, FitSettings } from './calibration.js';
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
