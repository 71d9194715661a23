/**
 * Request and result shapes of the divider finder.
 */
/** A stored series of preferred values: one decade, ascending in [1, 10) (an IEC 60063 series or a team's own). */
export interface SeriesValues {
  name: string;
  values: readonly number[];
}

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
  /** a stored series to draw values from, in every decade … */
  series?: SeriesValues;
  /** … or a stock list (exactly one of series and stock) */
  stock?: readonly StockItem[];
  /** bounds of the number of resistors in the top string, 1…8 (defaults 1 and 4) */
  minTopCount?: number;
  maxTopCount?: number;
  /** also try top strings of different values (default false: n equal values) */
  mixedTopStrings?: boolean;
  limits?: FinderLimits;
  /** converter input resistance (Ω), in parallel with the bottom resistor; omit for an unloaded divider */
  inputResistanceOhms?: number;
  /** bound of the converter's input bias current, either sign (A); default 0 */
  inputBiasAmps?: number;
  /** the asked tolerance: candidates whose worst-case error exceeds this fraction are not listed as meeting it */
  maxRatioErrorFraction?: number;
  /** how many candidates to return, 1…1000 (default 20) */
  maxCandidates?: number;
}

/** One divider: a top string and a bottom resistor, with its figures at maxInputVolts. */
export interface DividerCandidate {
  /** top-string values, ascending (Ω) */
  topOhms: number[];
  bottomOhms: number;
  /** bottom resistor in parallel with the converter input, R_b' = R_b‖R_in (Ω) */
  loadedBottomOhms: number;
  /** the ratio the converter sees, R_b'/(ΣR_top + R_b'): the editor's ratio readout */
  ratio: number;
  /** (ratio − target) / target */
  ratioErrorFraction: number;
  /** source resistance the converter sees, ΣR_top‖R_b' (Ω) */
  theveninOhms: number;
  /** bound of the bias current's offset at the converter input, I_b·(ΣR_top‖R_b') (V), either sign */
  biasOffsetVolts: number;
  /** ranking figure: |ratio error| + biasOffsetVolts/(maxInputVolts·target), the worst case at maxInputVolts */
  worstCaseErrorFraction: number;
  /** resistance the input sees, ΣR_top + R_b' (Ω) */
  totalOhms: number;
  /** current through the top string (A) */
  bleedAmps: number;
  /** total dissipation (W) */
  totalWatts: number;
  /** highest voltage across one resistor (V) */
  maxVoltsPerResistor: number;
  /** highest dissipation in one resistor (W) */
  maxWattsPerResistor: number;
  /** output voltage at maxInputVolts without bias current (V) */
  outputVolts: number;
  partCount: number;
}

/** What a search found, and what it did not try. */
export interface FinderResult {
  /** target ratio the candidates are measured against */
  targetRatio: number;
  /** the highest input voltage every figure is evaluated at (V) */
  maxInputVolts: number;
  /** the asked tolerance on the worst-case error (fraction), null when none was asked */
  toleranceFraction: number | null;
  /** candidates within the asked tolerance (all kept ones when none was asked), best first */
  candidates: DividerCandidate[];
  /** when none is within the asked tolerance: the nearest ones found, outside it, best first */
  closest: DividerCandidate[];
  /** plain sentences naming every kind of top string the search did not try, and why */
  notSearched: string[];
}
