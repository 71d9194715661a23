/**
 * Request and result shapes of the divider finder.
 */
import type { ESeriesName } from '../eseries/e-series-tables.js';

/** A resistor value on hand, with how many are in stock and optional ratings. */
export interface StockItem {
  ohms: number;
  quantity: number;
  /** rated working voltage of this part (V); the stricter of this and the request limit applies */
  maxVolts?: number;
  /** rated power of this part (W) */
  maxWatts?: number;
}

/** Limits every candidate must respect, all at the maximum input voltage. */
export interface FinderLimits {
  /** highest voltage across any one resistor (V) */
  maxVoltsPerResistor?: number;
  /** highest dissipation in any one resistor (W) */
  maxWattsPerResistor?: number;
  /** highest current through the divider (A) */
  maxBleedAmps?: number;
  /** lowest current through the divider (A), e.g. to swamp leakage */
  minBleedAmps?: number;
  /** total resistance bounds (Ω) */
  minTotalOhms?: number;
  maxTotalOhms?: number;
  /** range of each resistor value (Ω); for a series the default is 10 Ω … 100 MΩ, for stock no bound */
  minOhms?: number;
  maxOhms?: number;
}

/** What the divider must do and which parts it may use. */
export interface FinderRequest {
  /** highest voltage at the measured node (V) */
  maxInputVolts: number;
  /** converter input at full scale (V); the target ratio is fullScaleVolts / maxInputVolts */
  fullScaleVolts?: number;
  /** or the wanted ratio Vout/Vin = bottom / (top + bottom), 0 < ratio < 1 */
  targetRatio?: number;
  /** an IEC 60063 series to draw values from … */
  series?: ESeriesName;
  /** … or a stock list (exactly one of series and stock) */
  stock?: readonly StockItem[];
  /** bounds of the number of resistors in the top string, 1…8 (defaults 1 and 4) */
  minTopCount?: number;
  maxTopCount?: number;
  /** also try top strings of different values (default false: n equal values) */
  mixedTopStrings?: boolean;
  limits?: FinderLimits;
  /** drop candidates whose |ratio error| exceeds this fraction */
  maxRatioErrorFraction?: number;
  /** how many candidates to return, 1…1000 (default 20) */
  maxCandidates?: number;
}

/** One divider: a top string and a bottom resistor, with its figures at maxInputVolts. */
export interface DividerCandidate {
  /** top-string values, ascending (Ω) */
  topOhms: number[];
  bottomOhms: number;
  /** bottom / (top + bottom) */
  ratio: number;
  /** (ratio − target) / target */
  ratioErrorFraction: number;
  totalOhms: number;
  /** current through the divider (A) */
  bleedAmps: number;
  /** total dissipation (W) */
  totalWatts: number;
  /** highest voltage across one resistor (V) */
  maxVoltsPerResistor: number;
  /** highest dissipation in one resistor (W) */
  maxWattsPerResistor: number;
  /** output voltage at maxInputVolts (V) */
  outputVolts: number;
  partCount: number;
}
