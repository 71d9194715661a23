/**
 * Leverages and studentised residuals of a weighted least-squares fit
 * (Belsley, Kuh & Welsch, Regression Diagnostics, 1980, §2.1).
 */
import { solveUpperTransposed } from './householder-qr.js';

/** Hat-matrix diagonal and internally / externally studentised residuals. */
export interface ResidualDiagnostics {
  leverages: number[];
  studentisedResiduals: (number | null)[];
  externallyStudentisedResiduals: (number | null)[];
}

const FULL_LEVERAGE = 1 - 1e-12;

/**
 * hᵢᵢ = ‖R⁻ᵀaᵢ‖² for each weighted basis row aᵢ; internally studentised
 * rᵢ = √wᵢ·eᵢ / (s√(1 − hᵢᵢ)); externally tᵢ = rᵢ·√((ν − 1)/(ν − rᵢ²)).
 * @param weightedRows rows √wᵢ·aᵢ of the fit matrix
 * @param r the R factor of those rows
 * @param residuals eᵢ, unit of y
 * @param rootWeights √wᵢ
 * @param residualStandardDeviation s, unit of y
 * @param residualDegreesOfFreedom ν = n − p ≥ 1
 * @example residualDiagnostics(rows, r, residuals, rootWeights, s, nu)
 */
export function residualDiagnostics(
  weightedRows: readonly number[][],
  r: readonly number[][],
  residuals: readonly number[],
  rootWeights: readonly number[],
  residualStandardDeviation: number,
  residualDegreesOfFreedom: number,
): ResidualDiagnostics {
  const leverages = weightedRows.map((row) => solveUpperTransposed(r, row).reduce((sum, z) => sum + z * z, 0));
  const studentisedResiduals = residuals.map((e, i) =>
    leverages[i] >= FULL_LEVERAGE || residualStandardDeviation === 0
      ? null
      : (rootWeights[i] * e) / (residualStandardDeviation * Math.sqrt(1 - leverages[i])),
  );
  const nu = residualDegreesOfFreedom;
  const externallyStudentisedResiduals = studentisedResiduals.map((internal) => {
    if (internal === null || nu < 2) return null;
    const remaining = nu - internal * internal;
    return remaining > 0 ? internal * Math.sqrt((nu - 1) / remaining) : null;
  });
  return { leverages, studentisedResiduals, externallyStudentisedResiduals };
}
