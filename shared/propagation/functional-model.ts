import { distributionCode } from '../random/distributions.js';
import type { VariateSource } from '../random/variates.js';
import type { UncertainInput } from './inputs.js';
import type { TrialKernel } from './kernel.js';

/** A scalar measurement function Y = f(X); x holds one value per input, in input order. */
export type MeasurementFunction = (x: Float64Array) => number;

/**
 * A trial kernel for an arbitrary scalar model Y = f(X1…XN) with independent inputs
 * (JCGM 101:2008 7.3–7.4): each trial draws every input from its distribution and evaluates f.
 * The x array is reused between trials; f must not keep it.
 * @param inputs the model's inputs, in the order f reads them
 * @param model the measurement function
 * @throws if there are no inputs
 * @example functionalKernel(inputs, (x) => x[0] + x[1] + x[2] + x[3])
 */
export function functionalKernel(inputs: readonly UncertainInput[], model: MeasurementFunction): TrialKernel {
  if (inputs.length === 0) throw new Error('inputs must not be empty');
  const count = inputs.length;
  const codes = Int32Array.from(inputs, (i) => distributionCode(i.distribution));
  const centres = Float64Array.from(inputs, (i) => i.centre);
  const halfWidths = Float64Array.from(inputs, (i) => i.halfWidth);
  const factors = Float64Array.from(inputs, (i) => i.coverageFactor);
  const x = new Float64Array(count);
  return {
    outputCount: 1,
    simulate(source: VariateSource, trials: number, out: Float64Array, _stride: number, offset: number): void {
      for (let t = 0; t < trials; t++) {
        for (let i = 0; i < count; i++) x[i] = centres[i] + halfWidths[i] * source.unit(codes[i], factors[i]);
        out[offset + t] = model(x);
      }
    },
  };
}
