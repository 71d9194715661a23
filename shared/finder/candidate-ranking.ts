/**
 * Ranking of divider candidates: worst-case error at the highest input (|ratio error| plus the
 * bias offset, to 1e-12), then parts count, then total dissipation, then total resistance — and a
 * bounded best-K list.
 */
import type { DividerCandidate } from './finder-types.js';

/**
 * An error fraction in units of 1e-12, rounded, so that equal ratios from different strings tie.
 * @param errorFraction worst-case error (or ratio error) as a fraction of the target
 * @example errorKey(-2.5e-12) // 3
 */
export function errorKey(errorFraction: number): number {
  return Math.round(Math.abs(errorFraction) * 1e12);
}

/**
 * Order of two candidates: negative when a ranks before b.
 * @example candidates.sort(compareCandidates)
 */
export function compareCandidates(a: DividerCandidate, b: DividerCandidate): number {
  return (
    errorKey(a.worstCaseErrorFraction) - errorKey(b.worstCaseErrorFraction) ||
    a.partCount - b.partCount ||
    a.totalWatts - b.totalWatts ||
    a.totalOhms - b.totalOhms ||
    a.bottomOhms - b.bottomOhms ||
    a.topOhms.join(',').localeCompare(b.topOhms.join(','))
  );
}

/** Keeps the best `capacity` candidates seen (each offered once), sorting only now and then. */
export class CandidateShortlist {
  private kept: DividerCandidate[] = [];
  private worstKey = Infinity;

  constructor(private readonly capacity: number) {}

  /** Whether a candidate with this worst-case error could still enter the list. */
  admits(errorFraction: number): boolean {
    return errorKey(errorFraction) <= this.worstKey;
  }

  /** The largest error fraction still admitted (Infinity until the list is full). */
  bound(): number {
    return this.worstKey === Infinity ? Infinity : (this.worstKey + 0.5) / 1e12;
  }

  add(candidate: DividerCandidate): void {
    this.kept.push(candidate);
    if (this.kept.length > 4 * this.capacity + 64) this.trim();
  }

  /** The best candidates, ranked. */
  best(): DividerCandidate[] {
    this.trim();
    return [...this.kept];
  }

  private trim(): void {
    this.kept.sort(compareCandidates);
    this.kept.length = Math.min(this.kept.length, this.capacity);
    if (this.kept.length === this.capacity) this.worstKey = errorKey(this.kept[this.capacity - 1].worstCaseErrorFraction);
  }
}
