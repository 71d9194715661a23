import { normalCoverageFactor } from './coverage-factor.js';
import { inputStandardUncertainty, type UncertainInput } from './inputs.js';
import type { MeasurementFunction } from './functional-model.js';

/** One row of an uncertainty budget. */
export interface BudgetRow {
  key: string;
  label: string;
  where: string;
  unit: string;
  distribution: UncertainInput['distribution'];
  halfWidth: number;
  /** u(x_i), in the input's unit (GUM 4.3). */
  standardUncertainty: number;
  /** c_i = ∂f/∂x_i, output unit per input unit (GUM 5.1.3). */
  sensitivity: number;
  /** |c_i|·u(x_i), in the output's unit (GUM 5.1.3, u_i(y)). */
  contribution: number;
}

/** Law of propagation of uncertainty result for one output. */
export interface GumResult {
  estimate: number;
  combinedStandardUncertainty: number;
  coverageProbability: number;
  coverageFactor: number;
  expandedUncertainty: number;
  interval: { low: number; high: number };
  /** Rows sorted by contribution, largest first. */
  budget: BudgetRow[];
}

/**
 * First-order law of propagation of uncertainty for independent inputs, GUM (JCGM 100) 5.1.2:
 * u_c²(y) = Σ (c_i·u(x_i))², y = f(centres), U = k·u_c with k = Φ⁻¹((1 + p)/2) (G.1.3).
 * Sensitivity coefficients are numerical central differences with step ±u(x_i):
 * c_i = [f(x + u_i e_i) − f(x − u_i e_i)] / (2 u_i) (exact for models quadratic in x_i).
 * @param inputs independent inputs in the order f reads them
 * @param model the measurement function (output unit of your choice)
 * @param coverageProbability p in (0, 1), default 0.95
 * @throws if there are no inputs, p is outside (0, 1) or f returns a non-finite value
 * @example gumPropagation(inputs, (x) => x[0] + x[1]).combinedStandardUncertainty
 */
export function gumPropagation(inputs: readonly UncertainInput[], model: MeasurementFunction, coverageProbability = 0.95): GumResult {
  if (inputs.length === 0) throw new Error('inputs must not be empty');
  const k = normalCoverageFactor(coverageProbability);
  const x = Float64Array.from(inputs, (i) => i.centre);
  const estimate = model(x);
  if (!Number.isFinite(estimate)) throw new Error('model gave a non-finite value at the input centres');
  const budget: BudgetRow[] = inputs.map((input, i) => {
    const u = inputStandardUncertainty(input);
    let sensitivity = 0;
    if (u > 0) {
      x[i] = input.centre + u;
      const up = model(x);
      x[i] = input.centre - u;
      const down = model(x);
      x[i] = input.centre;
      sensitivity = (up - down) / (2 * u);
      if (!Number.isFinite(sensitivity)) throw new Error(`model is not finite around ${input.label}`);
    }
    const { key, label, where, unit, distribution, halfWidth } = input;
    return { key, label, where, unit, distribution, halfWidth, standardUncertainty: u, sensitivity, contribution: Math.abs(sensitivity) * u };
  });
  budget.sort((a, b) => b.contribution - a.contribution);
  const combined = Math.sqrt(budget.reduce((a, r) => a + r.contribution ** 2, 0));
  return {
    estimate,
    combinedStandardUncertainty: combined,
    coverageProbability,
    coverageFactor: k,
    expandedUncertainty: k * combined,
    interval: { low: estimate - k * combined, high: estimate + k * combined },
    budget,
  };
}
