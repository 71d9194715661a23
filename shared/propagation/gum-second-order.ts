import type { MeasurementFunction } from './functional-model.js';
import type { UncertainInput } from './inputs.js';

/** One second-order cross term of a pair of inputs (indices into the model's inputs). */
export interface CrossTerm {
  first: number;
  second: number;
  /** ∂²f/∂x_i∂x_j, output unit per (unit_i · unit_j). */
  mixedDerivative: number;
  /** |∂²f/∂x_i∂x_j|·u(x_i)·u(x_j), output unit. */
  contribution: number;
}

/**
 * Second-order cross terms of the law of propagation, JCGM 100:2008 5.1.2 Note: for each pair
 * i < j the Note's double sum holds ½(∂²f/∂x_i∂x_j)²u²(x_i)u²(x_j) twice, so the pair adds
 * (∂²f/∂x_i∂x_j)²u²(x_i)u²(x_j) to u_c². For independent inputs of zero mean about the expansion
 * point this is exactly Var(∂²f/∂x_i∂x_j · X_i X_j) whatever the distributions, and it is
 * uncorrelated with the first-order terms and with every other pair. The mixed derivative is the
 * central difference [f(+,+) − f(+,−) − f(−,+) + f(−,−)]/(4 u_i u_j) with steps ±u, exact for a
 * term bilinear in the pair (temperature × TCR, temperature × gain tempco).
 * The Note's other terms are left out on purpose. Pure terms (i = j) and third-derivative terms
 * f_i·f_ijj vanish for temperature: at the expansion point every coefficient that temperature
 * multiplies (TCRs, tempcos, drift) is zero, so f is constant in temperature there and each
 * ∂f/∂x_i is at most linear in it. For every other input they are of order u_rel² against the
 * first-order term (a divider ratio's curvature is below 2 per unit relative change), under 10⁻⁴
 * of u_c² for relative uncertainties below 1 %.
 * @param inputs independent inputs in the order f reads them
 * @param model the measurement function
 * @param standardUncertainties u(x_i) per input, in the input's unit
 * @returns every pair with a non-zero mixed derivative, in input order
 * @throws if f is not finite near the input centres
 * @example crossTerms(inputs, (x) => x[0] * x[1], [0.1, 0.2])[0].contribution // 0.02
 */
export function crossTerms(inputs: readonly UncertainInput[], model: MeasurementFunction, standardUncertainties: readonly number[]): CrossTerm[] {
  const x = Float64Array.from(inputs, (i) => i.centre);
  const at = (i: number, si: number, j: number, sj: number): number => {
    x[i] = inputs[i].centre + si * standardUncertainties[i];
    x[j] = inputs[j].centre + sj * standardUncertainties[j];
    const y = model(x);
    x[i] = inputs[i].centre;
    x[j] = inputs[j].centre;
    if (!Number.isFinite(y)) throw new Error(`model is not finite around ${inputs[i].label} and ${inputs[j].label}`);
    return y;
  };
  const active = inputs.map((_, i) => i).filter((i) => standardUncertainties[i] > 0);
  const terms: CrossTerm[] = [];
  for (let a = 0; a < active.length; a++) {
    for (let b = a + 1; b < active.length; b++) {
      const i = active[a];
      const j = active[b];
      const difference = at(i, 1, j, 1) - at(i, 1, j, -1) - at(i, -1, j, 1) + at(i, -1, j, -1);
      if (difference === 0) continue;
      const product = standardUncertainties[i] * standardUncertainties[j];
      terms.push({ first: i, second: j, mixedDerivative: difference / (4 * product), contribution: Math.abs(difference) / 4 });
    }
  }
  return terms;
}
