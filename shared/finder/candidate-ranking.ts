/**
 * Ranking of divider candidates: |ratio error| (to 1e-12), then parts count,
 * then total dissipation, then total resistance — and a bounded best-K list.
 */
import type { DividerCandidate } from './finder-types.js';

/**
 * |ratio error| in units of 1e-12, rounded, so that equal ratios from different strings tie.
 * @param ratioErrorFraction (ratio − target)/target
 * @example ratioErrorKey(-2.5e-12) // 3
 */
export function ratioErrorKey(ratioErrorFraction: number): number {
  return Math.round(Math.abs(ratioErrorFraction) * 1e12);
}

/**
 * Order of two candidates: negative when a ranks before b.
 * @example candidates.sort(compareCandidates)
 */
export function compareCandidates(a: DividerCandidate, b: DividerCandidate): number {
  return (
    ratioErrorKey(a.ratioErrorFraction) - ratioErrorKey(b.ratioErrorFraction) ||
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

  /** Whether a candidate with this ratio error could still enter the list. */
  admits(ratioErrorFraction: number): boolean {
    return ratioErrorKey(ratioErrorFraction) <= this.worstKey;
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
    if (this.kept.length === this.capacity) this.worstKey = ratioErrorKey(this.kept[this.capacity - 1].ratioErrorFraction);
  }
}
