/**
 * Quantiles of the standard normal and Student t distributions, accurate to
 * about 1e-13 relative: AS 241 for the normal; for t with ν < 1e4, a safeguarded
 * Newton iteration on the incomplete-beta tail probability; for ν ≥ 1e4, the
 * Cornish–Fisher series in 1/ν (exact to double precision there).
 */
import { computeNormalQuantile } from './normal-quantile.js';
import { studentTDensity, studentTUpperTail } from './student-t-distribution.js';

/** Above this ν the Cornish–Fisher series (Abramowitz & Stegun 26.7.5) is exact to double precision. */
const SERIES_FROM_NU = 1e4;

/**
 * The z with Φ(z) = p for the standard normal distribution.
 * @param p lower-tail probability, 0 < p < 1 (dimensionless)
 * @throws Error when p is not strictly between 0 and 1
 * @example normalQuantile(0.975) // 1.959963984540054
 */
export function normalQuantile(p: number): number {
  return computeNormalQuantile(p);
}

function cornishFisher(z: number, nu: number): number {
  const z2 = z * z;
  const g1 = (z * (z2 + 1)) / 4;
  const g2 = (z * ((5 * z2 + 16) * z2 + 3)) / 96;
  const g3 = (z * (((3 * z2 + 19) * z2 + 17) * z2 - 15)) / 384;
  const g4 = (z * ((((79 * z2 + 776) * z2 + 1482) * z2 - 1920) * z2 - 945)) / 92160;
  return z + (g1 + (g2 + (g3 + g4 / nu) / nu) / nu) / nu;
}

/** Positive t with P(T > t) = upper, for 0 < upper < ½. */
function upperQuantile(upper: number, nu: number): number {
  let low = 0;
  let high = Math.max(1, cornishFisher(-computeNormalQuantile(upper), Math.max(nu, 1)));
  while (studentTUpperTail(high, nu) > upper) {
    low = high;
    high *= 4;
  }
  let t = 0.5 * (low + high);
  for (let iteration = 0; iteration < 200; iteration++) {
    const excess = studentTUpperTail(t, nu) - upper;
    if (excess > 0) low = t;
    else high = t;
    let next = t + excess / studentTDensity(t, nu);
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    if (Math.abs(next - t) <= 1e-15 * next || high - low <= 1e-15 * high) return next;
    t = next;
  }
  return t;
}

/**
 * The t with P(T ≤ t) = p for Student's t with ν degrees of freedom
 * (the two-sided coverage factor for probability P is studentTQuantile((1+P)/2, ν)).
 * @param p lower-tail probability, 0 < p < 1 (dimensionless)
 * @param nu degrees of freedom ν > 0, non-integer allowed; Infinity gives the normal quantile
 * @throws Error when p is not strictly between 0 and 1 or nu ≤ 0
 * @example studentTQuantile(0.975, 10) // 2.2281388519862744
 */
export function studentTQuantile(p: number, nu: number): number {
  if (!(p > 0 && p < 1)) throw new Error('p must be a probability strictly between 0 and 1');
  if (!(nu > 0)) throw new Error('degrees of freedom nu must be > 0');
  if (nu === Infinity) return computeNormalQuantile(p);
  if (p === 0.5) return 0;
  if (nu >= SERIES_FROM_NU) return cornishFisher(computeNormalQuantile(p), nu);
  return p > 0.5 ? upperQuantile(1 - p, nu) : -upperQuantile(p, nu);
}
