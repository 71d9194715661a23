/**
 * The scaled polynomial basis used for fitting: u = (x − centre)/scale, columns
 * u^k, so the columns are well conditioned; and the map back to powers of x.
 */

/** How x is mapped to u = (x − centre)/scale, and which powers of u are columns. */
export interface PolynomialBasis {
  centre: number;
  scale: number;
  /** powers of u that are columns, e.g. [0, 1, 2] or [1, 2] for no intercept */
  powers: number[];
}

/**
 * The basis row [u^k for k in powers] at x.
 * @param basis centre and scale in the unit of x, and the powers used
 * @param x abscissa, unit of x
 * @example basisRow({ centre: 0, scale: 1, powers: [0, 1] }, 3) // [1, 3]
 */
export function basisRow(basis: PolynomialBasis, x: number): number[] {
  const u = (x - basis.centre) / basis.scale;
  return basis.powers.map((power) => u ** power);
}

function binomial(n: number, k: number): number {
  let result = 1;
  for (let i = 1; i <= k; i++) result = (result * (n - i + 1)) / i;
  return result;
}

/**
 * The matrix T with a = T·β: coefficients a_j of x^j (j = 0…degree) from the
 * coefficients β of the scaled basis, by the binomial expansion of ((x − c)/h)^k.
 * @param basis centre c and scale h in the unit of x, and the powers used
 * @param degree highest power of x
 * @example powerMapping({ centre: 1, scale: 2, powers: [0, 1] }, 1) // [[1, -0.5], [0, 0.5]]
 */
export function powerMapping(basis: PolynomialBasis, degree: number): number[][] {
  const { centre, scale, powers } = basis;
  return Array.from({ length: degree + 1 }, (_, j) =>
    powers.map((k) => (k < j ? 0 : (binomial(k, j) * (-centre) ** (k - j)) / scale ** k)),
  );
}
