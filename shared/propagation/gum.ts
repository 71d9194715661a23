import { normalCoverageFactor } from './coverage-factor.js';
import { inputStandardUncertainty, type UncertainInput } from './inputs.js';
import type { MeasurementFunction } from './functional-model.js';
import { crossTerms } from './gum-second-order.js';
import { DEFAULT_COVERAGE_PROBABILITY } from '../schemas/study-defaults.js';

/**
 * One row of an uncertainty budget: a first-order term of one input, or a second-order cross term
 * of two (JCGM 100 5.1.2 Note), whose key, label and where join the two inputs' with ` × `.
 */
export interface BudgetRow {
  key: string;
  label: string;
  where: string;
  /** The input's unit; for a second-order row their product (a temperature times a per-kelvin coefficient cancels). */
  unit: string;
  /** The input's shape; `product` for a second-order row. */
  distribution: UncertainInput['distribution'] | 'product';
  /** a_i; for a second-order row a_i·a_j. */
  halfWidth: number;
  /** u(x_i), in the input's unit (GUM 4.3); for a second-order row u(x_i)·u(x_j). */
  standardUncertainty: number;
  /** c_i = ∂f/∂x_i, output unit per input unit (GUM 5.1.3); for a second-order row ∂²f/∂x_i∂x_j. */
  sensitivity: number;
  /** |c_i|·u(x_i) (GUM 5.1.3, u_i(y)); for a second-order row |∂²f/∂x_i∂x_j|·u(x_i)·u(x_j); output unit. */
  contribution: number;
  /** 1 for a first-order row, 2 for a second-order cross term. */
  order: 1 | 2;
  /** The row's input, or its two inputs for a second-order row. */
  inputKeys: string[];
}

/** Cross terms smaller than this fraction of u_c are numerical noise or negligible: not listed, not summed. */
export const CROSS_TERM_FLOOR = 1e-3;

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
 * Law of propagation of uncertainty for independent inputs, GUM (JCGM 100) 5.1.2:
 * u_c²(y) = Σ (c_i·u(x_i))² + Σ_{i<j} (∂²f/∂x_i∂x_j)²u²(x_i)u²(x_j), y = f(centres),
 * U = k·u_c with k = Φ⁻¹((1 + p)/2) (G.1.3). The second sum is the 5.1.2 Note's cross terms
 * (see crossTerms for why the Note's other terms are left out); it is what temperature adds when
 * its range is centred on the reference and every first-order temperature term is zero. Pairs
 * below CROSS_TERM_FLOOR·u_c are dropped (together under n²/2·10⁻⁶ of u_c²).
 * Sensitivity coefficients are numerical central differences with step ±u(x_i):
 * c_i = [f(x + u_i e_i) − f(x − u_i e_i)] / (2 u_i) (exact for models quadratic in x_i).
 * @param inputs independent inputs in the order f reads them
 * @param model the measurement function (output unit of your choice)
 * @param coverageProbability p in (0, 1), default 0.95
 * @param secondOrder whether to add the cross terms, default true
 * @throws if there are no inputs, p is outside (0, 1) or f returns a non-finite value
 * @example gumPropagation(inputs, (x) => x[0] + x[1]).combinedStandardUncertainty
 */
export function gumPropagation(inputs: readonly UncertainInput[], model: MeasurementFunction, coverageProbability = DEFAULT_COVERAGE_PROBABILITY, secondOrder = true): GumResult {
  if (inputs.length === 0) throw new Error('inputs must not be empty');
  const k = normalCoverageFactor(coverageProbability);
  const x = Float64Array.from(inputs, (i) => i.centre);
  const estimate = model(x);
  if (!Number.isFinite(estimate)) throw new Error('model gave a non-finite value at the input centres');
  const uncertainties = inputs.map(inputStandardUncertainty);
  const budget: BudgetRow[] = inputs.map((input, i) => {
    const u = uncertainties[i];
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
    return { key, label, where, unit, distribution, halfWidth, standardUncertainty: u, sensitivity, contribution: Math.abs(sensitivity) * u, order: 1, inputKeys: [key] };
  });
  if (secondOrder) {
    const terms = crossTerms(inputs, model, uncertainties);
    const variance = budget.reduce((a, r) => a + r.contribution ** 2, 0) + terms.reduce((a, t) => a + t.contribution ** 2, 0);
    for (const t of terms) {
      if (t.contribution < CROSS_TERM_FLOOR * Math.sqrt(variance)) continue;
      // The later input leads the label, so temperature reads first: `operating temperature × R1 TCR`.
      const [a, b] = [inputs[t.second], inputs[t.first]];
      budget.push({
        key: `${a.key}×${b.key}`, label: `${a.label} × ${b.label}`, where: `${a.where} × ${b.where}`, unit: productUnit(a.unit, b.unit),
        distribution: 'product', halfWidth: a.halfWidth * b.halfWidth, standardUncertainty: uncertainties[t.second] * uncertainties[t.first],
        sensitivity: t.mixedDerivative, contribution: t.contribution, order: 2, inputKeys: [a.key, b.key],
      });
    }
  }
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

/** Unit of a product of two inputs: °C (a temperature difference, K) times a unit per K drops the K. */
function productUnit(a: string, b: string): string {
  const [temperature, other] = a === '°C' ? [a, b] : [b, a];
  if (temperature === '°C' && other.endsWith('/K')) return other.slice(0, -2) || '1';
  if (a === '1') return b;
  if (b === '1') return a;
  return `${a}·${b}`;
}
