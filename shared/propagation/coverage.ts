/** A coverage interval [low, high] in the output's unit. */
export interface CoverageInterval {
  low: number;
  high: number;
}

/** A coverage interval estimated from M sampled values, with the standard uncertainty of each end. */
export interface SampledInterval extends CoverageInterval {
  lowStandardUncertainty: number;
  highStandardUncertainty: number;
}

/** q of JCGM 101:2008 7.7.1: pM when that is an integer, else ⌊pM + ½⌋. */
function coverageCount(count: number, coverageProbability: number): number {
  const pM = coverageProbability * count;
  return Number.isInteger(pM) ? pM : Math.floor(pM + 0.5);
}

function checkProbability(coverageProbability: number): void {
  if (!(coverageProbability > 0 && coverageProbability < 1)) throw new Error('coverage probability must be in (0, 1)');
}

/**
 * Fewest values from which a coverage interval can be formed at all: the least M with
 * M − q ≥ 1 (q from JCGM 101:2008 7.7.1), about ½/(1 − p). Such an interval is the sample's
 * extremes; see recommendedTrials for what the standard advises.
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1)
 * @example smallestIntervalTrials(0.9999) // 5001
 */
export function smallestIntervalTrials(coverageProbability: number): number {
  checkProbability(coverageProbability);
  // M − q = ⌈(1 − p)M − ½⌉ never decreases with M, so step up from just below ½/(1 − p).
  let count = Math.max(2, Math.floor(0.5 / (1 - coverageProbability)) - 2);
  while (count - coverageCount(count, coverageProbability) < 1) count++;
  return count;
}

// 1 − p carries rounding (1 − 0.9 = 0.09999999999999998); trim it before rounding a count up.
const ceilCount = (x: number): number => Math.ceil(x * (1 - 1e-12));

/**
 * Trials JCGM 101:2008 7.2.2 recommends for a coverage interval at probability p: M large
 * compared with 1/(1 − p), at least 10⁴ times greater, i.e. ⌈10⁴/(1 − p)⌉ (2·10⁵ at 95 %).
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1)
 * @example recommendedTrials(0.95) // 200000
 */
export function recommendedTrials(coverageProbability: number): number {
  checkProbability(coverageProbability);
  return ceilCount(1e4 / (1 - coverageProbability));
}

/**
 * The smallest batch the adaptive procedure of JCGM 101:2008 7.9.4 b) ever summarises,
 * J = ⌈100/(1 − p)⌉: about 50 values beyond each end of a symmetric interval. Below it an
 * interval end rests on a handful of extreme values.
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1)
 * @example minimumBatchTrials(0.999) // 100000
 */
export function minimumBatchTrials(coverageProbability: number): number {
  checkProbability(coverageProbability);
  return ceilCount(100 / (1 - coverageProbability));
}

/**
 * Fewest trials a study should summarise into an interval at probability p: ⌈50/(1 − p)⌉, so
 * about 25 trials lie beyond each end of a symmetric interval and neither end is one of a handful
 * of extremes (1000 at 95 %, 5·10⁴ at 99.9 %). Between this and recommendedTrials a study runs
 * with a warning.
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1)
 * @example minimumStudyTrials(0.999) // 50000
 */
export function minimumStudyTrials(coverageProbability: number): number {
  checkProbability(coverageProbability);
  return ceilCount(50 / (1 - coverageProbability));
}

function coverageCounts(count: number, coverageProbability: number): number {
  checkProbability(coverageProbability);
  const q = coverageCount(count, coverageProbability);
  if (count - q < 1) throw new Error(`at least ${smallestIntervalTrials(coverageProbability)} trials are needed for this coverage probability`);
  return q;
}

/** r of JCGM 101:2008 7.7.1: (M − q)/2 when an integer, else ⌊(M − q + 1)/2⌋. */
function lowRank(count: number, q: number): number {
  const half = (count - q) / 2;
  return Number.isInteger(half) ? half : Math.floor((count - q + 1) / 2);
}

/**
 * Probabilistically symmetric coverage interval from ascending model values, JCGM 101:2008
 * 7.7.1: q = pM (or ⌊pM + ½⌋), r = (M − q)/2 (or ⌊(M − q + 1)/2⌋), interval [y₍ᵣ₎, y₍ᵣ₊q₎].
 * @param sorted model values in ascending order (unit of the output)
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1) or there are too few values
 * @example symmetricInterval(sortedErrors, 0.95)
 */
export function symmetricInterval(sorted: Float64Array, coverageProbability: number): CoverageInterval {
  const count = sorted.length;
  const q = coverageCounts(count, coverageProbability);
  const r = lowRank(count, q);
  return { low: sorted[r - 1], high: sorted[r + q - 1] };
}

/**
 * Shortest coverage interval from ascending model values, JCGM 101:2008 7.7.2: the r* in
 * 1…M − q minimising y₍ᵣ₊q₎ − y₍ᵣ₎ (the first such r on ties).
 * @param sorted model values in ascending order (unit of the output)
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1) or there are too few values
 * @example shortestInterval(sortedErrors, 0.95)
 */
export function shortestInterval(sorted: Float64Array, coverageProbability: number): CoverageInterval {
  const count = sorted.length;
  const q = coverageCounts(count, coverageProbability);
  let best = 1;
  let bestWidth = Infinity;
  for (let r = 1; r <= count - q; r++) {
    const width = sorted[r + q - 1] - sorted[r - 1];
    if (width < bestWidth) {
      bestWidth = width;
      best = r;
    }
  }
  return { low: sorted[best - 1], high: sorted[best + q - 1] };
}

/**
 * Standard uncertainty of the ends of the symmetric interval as estimates of the true quantiles,
 * from the sample alone: an end y₍ᵣ₎ estimates the α-quantile (α = r/M), and the rank of that
 * quantile among M draws is binomial with standard deviation k = √(M·α(1 − α)), so the ends'
 * neighbours k ranks away bracket it with about 68 % probability. The larger of the two one-sided
 * spans y₍ᵣ₊ₖ₎ − y₍ᵣ₎ and y₍ᵣ₎ − y₍ᵣ₋ₖ₎ is taken (ranks clamped to 1…M), so a skewed tail is not
 * understated. Asymptotically √(α(1 − α)/M)/f(y) for a density f.
 * @param sorted model values in ascending order (unit of the output)
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1) or there are too few values
 * @example intervalEndUncertainty(sortedErrors, 0.95).highStandardUncertainty
 */
export function intervalEndUncertainty(sorted: Float64Array, coverageProbability: number): { lowStandardUncertainty: number; highStandardUncertainty: number } {
  const count = sorted.length;
  const q = coverageCounts(count, coverageProbability);
  const r = lowRank(count, q);
  const spread = (rank: number): number => {
    const alpha = rank / count;
    const k = Math.max(1, Math.ceil(Math.sqrt(count * alpha * (1 - alpha))));
    const at = (i: number) => sorted[Math.min(count, Math.max(1, i)) - 1];
    return Math.max(at(rank + k) - at(rank), at(rank) - at(rank - k));
  };
  return { lowStandardUncertainty: spread(r), highStandardUncertainty: spread(r + q) };
}
