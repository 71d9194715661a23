/**
 * Continued fraction of the regularised incomplete beta function
 * (modified Lentz evaluation), converged to double precision.
 */

const TINY = 1e-300;
const MAX_TERMS = 100_000;

/**
 * The continued fraction F with I_x(a, b) = x^a (1 − x)^b / (a·B(a, b)) · F,
 * which converges quickly for x < (a + 1)/(a + b + 2).
 * @param x argument, 0 ≤ x ≤ 1 (dimensionless)
 * @param a first shape, a > 0
 * @param b second shape, b > 0
 * @throws Error when the fraction does not converge
 * @example betaContinuedFraction(0.1, 2, 0.5)
 */
export function betaContinuedFraction(x: number, a: number, b: number): number {
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let fraction = d;
  for (let m = 1; m <= MAX_TERMS; m++) {
    const m2 = 2 * m;
    const even = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + even * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + even / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    fraction *= d * c;
    const odd = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + odd * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + odd / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const step = d * c;
    fraction *= step;
    if (Math.abs(step - 1) < 1e-16) return fraction;
  }
  throw new Error('incomplete beta continued fraction did not converge');
}
