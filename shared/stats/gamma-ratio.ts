/**
 * The ratio Γ(a + ½) / Γ(a), needed by the Student t density and
 * distribution function without the cancellation of lnΓ differences.
 */

/** Stirling series remainder S(z) of lnΓ(z) = (z − ½)ln z − z + ½ln 2π + S(z). */
function stirlingRemainder(z: number): number {
  const w = 1 / (z * z);
  return (
    (1 / z) *
    (1 / 12 + w * (-1 / 360 + w * (1 / 1260 + w * (-1 / 1680 + w * (1 / 1188 + w * (-691 / 360360))))))
  );
}

const STIRLING_FROM = 15;

/**
 * Natural log of Γ(a + ½)/Γ(a), accurate to about 1e-16 absolute.
 *
 * For a ≥ 15: a·ln(1 + 1/(2a)) + ½ ln a − ½ + S(a + ½) − S(a) (Stirling);
 * below, the recurrence R(a) = R(a + 1)·a/(a + ½).
 * @param a shape, a > 0 (dimensionless)
 * @throws Error when a is not a positive finite number
 * @example logGammaHalfRatio(0.5) // ln(1/√π) = −0.5723649429247001
 */
export function logGammaHalfRatio(a: number): number {
  if (!(a > 0 && Number.isFinite(a))) throw new Error('a must be a positive finite number');
  let shifted = a;
  let logFactor = 0;
  while (shifted < STIRLING_FROM) {
    logFactor += Math.log(shifted / (shifted + 0.5));
    shifted += 1;
  }
  const stirling =
    shifted * Math.log1p(1 / (2 * shifted)) +
    0.5 * Math.log(shifted) -
    0.5 +
    stirlingRemainder(shifted + 0.5) -
    stirlingRemainder(shifted);
  return stirling + logFactor;
}
