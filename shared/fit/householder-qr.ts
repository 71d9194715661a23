/**
 * Least squares by Householder QR (Golub & Van Loan, Matrix Computations,
 * Alg. 5.3.2): A = QR, β = R⁻¹(Qᵀy)[0..p), never forming AᵀA.
 */

/** The triangular factor and the rotated right-hand side of a least-squares problem. */
export interface QrLeastSquares {
  /** p×p upper-triangular R, row-major: r[i][j], zero for j < i */
  r: number[][];
  /** Qᵀy, length n; entries p…n−1 hold the residual in the rotated frame */
  qty: number[];
  /** the solution β of min ‖Aβ − y‖ */
  solution: number[];
}

/**
 * Solve min ‖Aβ − y‖₂ for a full-rank n×p matrix given by its columns.
 * @param columns the p columns of A, each of length n (not mutated)
 * @param rhs y, length n (not mutated)
 * @param rankTolerance a column is dependent when its |R_kk| ≤ rankTolerance·‖A_k‖ (default 1e-11)
 * @throws Error when columns are rank deficient or lengths differ
 * @example householderLeastSquares([[1, 1, 1], [0, 1, 2]], [1, 3, 5]).solution // [1, 2]
 */
export function householderLeastSquares(columns: readonly number[][], rhs: readonly number[], rankTolerance = 1e-11): QrLeastSquares {
  const p = columns.length;
  const n = rhs.length;
  if (p === 0 || n < p) throw new Error('least squares needs at least as many rows as columns');
  const work = columns.map((column) => {
    if (column.length !== n) throw new Error('every column must have one entry per row');
    return Float64Array.from(column);
  });
  const qty = Float64Array.from(rhs);
  for (let k = 0; k < p; k++) {
    const column = work[k];
    let originalNorm = 0;
    for (let i = 0; i < n; i++) originalNorm = Math.hypot(originalNorm, columns[k][i]);
    let norm = 0;
    for (let i = k; i < n; i++) norm = Math.hypot(norm, column[i]);
    if (!(norm > rankTolerance * originalNorm)) throw new Error('the fit columns are linearly dependent');
    const alpha = column[k] > 0 ? -norm : norm;
    const v = column.slice(k);
    v[0] -= alpha;
    let vSquared = 0;
    for (let i = 0; i < v.length; i++) vSquared += v[i] * v[i];
    const reflect = (target: Float64Array): void => {
      let dot = 0;
      for (let i = 0; i < v.length; i++) dot += v[i] * target[k + i];
      const factor = (2 * dot) / vSquared;
      for (let i = 0; i < v.length; i++) target[k + i] -= factor * v[i];
    };
    for (let j = k + 1; j < p; j++) reflect(work[j]);
    reflect(qty);
    column.fill(0, k);
    column[k] = alpha;
  }
  const r = Array.from({ length: p }, (_, i) => Array.from({ length: p }, (_, j) => (j >= i ? work[j][i] : 0)));
  const solution = solveUpper(r, Array.from(qty.subarray(0, p)));
  return { r, qty: Array.from(qty), solution };
}

/**
 * Back substitution: the z with R z = b for upper-triangular R.
 * @param r p×p upper-triangular, row-major
 * @param b right-hand side, length p
 * @example solveUpper([[2, 1], [0, 4]], [4, 8]) // [1, 2]
 */
export function solveUpper(r: readonly number[][], b: readonly number[]): number[] {
  const z = [...b];
  for (let i = z.length - 1; i >= 0; i--) {
    for (let j = i + 1; j < z.length; j++) z[i] -= r[i][j] * z[j];
    z[i] /= r[i][i];
  }
  return z;
}

/**
 * Forward substitution: the z with Rᵀ z = b for upper-triangular R.
 * @param r p×p upper-triangular, row-major
 * @param b right-hand side, length p
 * @example solveUpperTransposed([[2, 1], [0, 4]], [2, 9]) // [1, 2]
 */
export function solveUpperTransposed(r: readonly number[][], b: readonly number[]): number[] {
  const z = [...b];
  for (let i = 0; i < z.length; i++) {
    for (let j = 0; j < i; j++) z[i] -= r[j][i] * z[j];
    z[i] /= r[i][i];
  }
  return z;
}
