/**
 * A calibrated board's reading-error samples with the reference instrument's share added as one error per
 * simulated calibration: the same ε moves the gain and the offset together (reference-share.ts), so a reading
 * at V errs by ε·(offset share + gain share·V), the bound at V, rather than by two independent parts.
 */
import { blockStream } from '../random/streams.js';
import { VariateSource } from '../random/variates.js';
import type { ReferenceShare } from './reference-share.js';

/**
 * Adds ε·(gain share, offset share) to each pair (g, o), with ε of unit variance drawn per pair: rectangular on
 * [−√3, √3] for a reference stated as a limit, standard normal for one stated at k.
 * @param samples paired gain errors (fraction) and offset errors (V) of equal length (not mutated)
 * @param share the reference's share of a straight line (referenceShare with degree 1)
 * @param seed integer seed of the draws, so a result is repeatable
 * @throws Error when the lengths differ or the share is not a straight line's
 * @example withCommonReferenceError({ gainErrorFraction: g, offsetErrorV: o }, share, 7)
 */
export function withCommonReferenceError(
  samples: { gainErrorFraction: ArrayLike<number>; offsetErrorV: ArrayLike<number> }, share: ReferenceShare, seed: number,
): { gainErrorFraction: Float64Array; offsetErrorV: Float64Array } {
  const n = samples.gainErrorFraction.length;
  if (samples.offsetErrorV.length !== n) throw new Error('gain and offset samples differ in length');
  if (share.coefficients.length !== 2) throw new Error("the reference share must be a straight line's");
  const [offsetShareV, gainShare] = share.coefficients;
  const source = new VariateSource(blockStream(seed, 0));
  const gain = new Float64Array(n);
  const offset = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    const epsilon = share.distribution === 'rectangular' ? source.rectangular(-Math.sqrt(3), Math.sqrt(3)) : source.normal();
    gain[t] = samples.gainErrorFraction[t] + epsilon * gainShare;
    offset[t] = samples.offsetErrorV[t] + epsilon * offsetShareV;
  }
  return { gainErrorFraction: gain, offsetErrorV: offset };
}
