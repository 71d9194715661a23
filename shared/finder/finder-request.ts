/**
 * Checks a divider-finder request and turns it into the search inputs:
 * target ratio, sorted candidate values with stock and ratings.
 */
import { decadeValuesInRange } from '../eseries/e-series-values.js';
import { MAX_TOP_RESISTORS } from '../schemas/chain.js';
import type { FinderLimits, FinderRequest } from './finder-types.js';

/** A value the search may use, with its quantity (Infinity for a series) and ratings. */
export interface SearchValue {
  ohms: number;
  quantity: number;
  maxVolts: number;
  maxWatts: number;
}

/** The checked request in the form the search uses. */
export interface SearchPlan {
  maxInputVolts: number;
  targetRatio: number;
  values: SearchValue[];
  minTopCount: number;
  maxTopCount: number;
  mixedTopStrings: boolean;
  limits: Required<Omit<FinderLimits, 'minOhms' | 'maxOhms'>>;
  /** converter input resistance (Ω), Infinity when unloaded */
  inputResistanceOhms: number;
  /** bound of the converter input bias current (A), ≥ 0 */
  inputBiasAmps: number;
  maxRatioErrorFraction: number;
  maxCandidates: number;
}

function positive(value: number | undefined, name: string, fallback: number): number {
  if (value === undefined) return fallback;
  if (!(value > 0) || Number.isNaN(value)) throw new Error(`${name} must be > 0`);
  return value;
}

function nonNegative(value: number | undefined, name: string): number {
  if (value === undefined) return 0;
  if (!(value >= 0) || !Number.isFinite(value)) throw new Error(`${name} must be a finite number ≥ 0`);
  return value;
}

function countBetween(value: number | undefined, name: string, fallback: number, low: number, high: number): number {
  const count = value ?? fallback;
  if (!Number.isInteger(count) || count < low || count > high) throw new Error(`${name} must be an integer from ${low} to ${high}`);
  return count;
}

function targetRatioOf(request: FinderRequest): number {
  const { fullScaleVolts, targetRatio, maxInputVolts } = request;
  if ((fullScaleVolts === undefined) === (targetRatio === undefined)) {
    throw new Error('give exactly one of fullScaleVolts and targetRatio');
  }
  const ratio = targetRatio ?? positive(fullScaleVolts, 'fullScaleVolts', 0) / maxInputVolts;
  if (!(ratio > 0 && ratio < 1)) {
    throw new Error(targetRatio === undefined ? 'fullScaleVolts must be below maxInputVolts' : 'targetRatio must be between 0 and 1');
  }
  return ratio;
}

function valuesOf(request: FinderRequest, limits: FinderLimits): SearchValue[] {
  if ((request.series === undefined) === (request.stock === undefined)) throw new Error('give exactly one of series and stock');
  if (request.series !== undefined) {
    const { name, values } = request.series;
    if (typeof name !== 'string' || name === '') throw new Error('series.name must be given');
    const minOhms = positive(limits.minOhms, 'limits.minOhms', 10);
    const maxOhms = positive(limits.maxOhms, 'limits.maxOhms', 100e6);
    if (maxOhms < minOhms) throw new Error('limits.maxOhms must be ≥ limits.minOhms');
    const unlimited = { quantity: Infinity, maxVolts: Infinity, maxWatts: Infinity };
    let ohms: number[];
    try {
      ohms = decadeValuesInRange(values, minOhms, maxOhms);
    } catch (error) {
      throw new Error(`series ${name}: ${(error as Error).message}`);
    }
    return ohms.map((value) => ({ ohms: value, ...unlimited }));
  }
  const merged = new Map<number, SearchValue>();
  for (const item of request.stock ?? []) {
    if (!(item.ohms > 0 && Number.isFinite(item.ohms))) throw new Error('stock ohms must be finite numbers > 0');
    if (!Number.isInteger(item.quantity) || item.quantity < 0) throw new Error('stock quantity must be a whole number ≥ 0');
    const maxVolts = positive(item.maxVolts, 'stock maxVolts', Infinity);
    const maxWatts = positive(item.maxWatts, 'stock maxWatts', Infinity);
    const known = merged.get(item.ohms);
    merged.set(item.ohms, {
      ohms: item.ohms,
      quantity: (known?.quantity ?? 0) + item.quantity,
      maxVolts: Math.min(known?.maxVolts ?? Infinity, maxVolts),
      maxWatts: Math.min(known?.maxWatts ?? Infinity, maxWatts),
    });
  }
  const minOhms = positive(limits.minOhms, 'limits.minOhms', 0);
  const maxOhms = positive(limits.maxOhms, 'limits.maxOhms', Infinity);
  if (maxOhms < minOhms) throw new Error('limits.maxOhms must be ≥ limits.minOhms');
  const onHand = [...merged.values()].filter((value) => value.quantity > 0);
  if (onHand.length === 0) throw new Error('stock must hold at least one value with quantity > 0');
  return onHand.filter((value) => value.ohms >= minOhms && value.ohms <= maxOhms).sort((a, b) => a.ohms - b.ohms);
}

/**
 * Validate a finder request and derive the search plan (target ratio = fullScaleVolts/maxInputVolts).
 * @param request see FinderRequest; volts in V, ohms in Ω, watts in W, amps in A
 * @throws Error naming the first bad field
 * @example planSearch({ maxInputVolts: 500, fullScaleVolts: 2, series: storedE96 }).targetRatio // 0.004
 */
export function planSearch(request: FinderRequest): SearchPlan {
  if (request === null || typeof request !== 'object') throw new Error('request must be an object');
  const maxInputVolts = positive(request.maxInputVolts, 'maxInputVolts', NaN);
  if (!Number.isFinite(maxInputVolts)) throw new Error('maxInputVolts must be > 0');
  const targetRatio = targetRatioOf(request);
  const limits = request.limits ?? {};
  const minTopCount = countBetween(request.minTopCount, 'minTopCount', 1, 1, MAX_TOP_RESISTORS);
  const maxTopCount = countBetween(request.maxTopCount, 'maxTopCount', Math.max(4, minTopCount), 1, MAX_TOP_RESISTORS);
  if (maxTopCount < minTopCount) throw new Error('maxTopCount must be ≥ minTopCount');
  return {
    maxInputVolts,
    targetRatio,
    values: valuesOf(request, limits),
    minTopCount,
    maxTopCount,
    mixedTopStrings: request.mixedTopStrings ?? false,
    limits: {
      maxVoltsPerResistor: positive(limits.maxVoltsPerResistor, 'limits.maxVoltsPerResistor', Infinity),
      maxWattsPerResistor: positive(limits.maxWattsPerResistor, 'limits.maxWattsPerResistor', Infinity),
      maxBleedAmps: positive(limits.maxBleedAmps, 'limits.maxBleedAmps', Infinity),
      minBleedAmps: positive(limits.minBleedAmps, 'limits.minBleedAmps', Number.MIN_VALUE),
      minTotalOhms: positive(limits.minTotalOhms, 'limits.minTotalOhms', Number.MIN_VALUE),
      maxTotalOhms: positive(limits.maxTotalOhms, 'limits.maxTotalOhms', Infinity),
    },
    inputResistanceOhms: positive(request.inputResistanceOhms, 'inputResistanceOhms', Infinity),
    inputBiasAmps: nonNegative(request.inputBiasAmps, 'inputBiasAmps'),
    maxRatioErrorFraction: positive(request.maxRatioErrorFraction, 'maxRatioErrorFraction', Infinity),
    maxCandidates: countBetween(request.maxCandidates, 'maxCandidates', 20, 1, 1000),
  };
}
