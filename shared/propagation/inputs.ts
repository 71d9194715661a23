import type { DistributionName } from '../random/distributions.js';
import { standardUncertaintyOf } from '../random/distributions.js';

/**
 * One uncertain input of a measurement model: X = centre + a·Z, Z of unit half-width
 * (a normal input is bounded by a = k·σ). Units are the input's own (`unit`).
 */
export interface UncertainInput {
  /** Stable identifier, e.g. `divider.top[0].tolerance`. */
  key: string;
  /** Words a person reads in a budget, e.g. `R1 tolerance`. */
  label: string;
  /** Chain stage and field the input belongs to. */
  where: string;
  unit: string;
  distribution: DistributionName;
  /** Half-width a of the bounds (for a normal input: k·σ). */
  halfWidth: number;
  /** Expectation of the input. */
  centre: number;
  /** k for a normal input (a = k·σ); 1 elsewhere. */
  coverageFactor: number;
}

/**
 * Builds an {@link UncertainInput} after checking it.
 * @param spec the input; `coverageFactor` defaults to 2 for normal inputs and 1 otherwise
 * @throws if the half-width is negative or not finite, or the centre is not finite
 * @example uncertainInput({ key: 'x1', label: 'X1', where: 'model', unit: '', distribution: 'normal', halfWidth: 2, centre: 0, coverageFactor: 2 })
 */
export function uncertainInput(
  spec: Omit<UncertainInput, 'coverageFactor'> & { coverageFactor?: number },
): UncertainInput {
  if (!Number.isFinite(spec.halfWidth) || spec.halfWidth < 0) throw new Error(`${spec.label} half-width must be ≥ 0`);
  if (!Number.isFinite(spec.centre)) throw new Error(`${spec.label} centre must be a finite number`);
  const coverageFactor = spec.coverageFactor ?? (spec.distribution === 'normal' ? 2 : 1);
  standardUncertaintyOf(spec.halfWidth, spec.distribution, coverageFactor);
  return { ...spec, coverageFactor };
}

/**
 * Standard uncertainty u(x) of an input from its half-width and shape (GUM 4.3.7, 4.3.9;
 * JCGM 101 6.4.6); in the input's unit.
 * @param input the input
 * @throws if the input's half-width is negative
 * @example inputStandardUncertainty(input) // a/√3 for a rectangular input
 */
export function inputStandardUncertainty(input: UncertainInput): number {
  return standardUncertaintyOf(input.halfWidth, input.distribution, input.coverageFactor);
}
