import type { CompiledChannel } from '../chain/compile.js';
import { calibrationLine, readingErrorV } from '../chain/model.js';
import { distributionCode } from '../random/distributions.js';
import type { VariateSource } from '../random/variates.js';
import type { TrialKernel } from './kernel.js';

/**
 * Monte Carlo kernel of one channel. A trial draws one board (all board inputs, once) and then
 * one reading at each grid voltage with its own quantisation phase and isolator edge timing;
 * output g is the reading error V̂ − V (V) at grid voltage g. No allocation per trial.
 * @param c compiled channel
 * @throws never
 * @example runMonteCarlo(channelKernel(compileChannel(channel)), { seed: 1, trials: 20_000 })
 */
export function channelKernel(c: CompiledChannel): TrialKernel {
  const active = c.board.map((_, i) => i).filter((i) => c.board[i].halfWidth > 0);
  const index = Int32Array.from(active);
  const codes = Int32Array.from(active, (i) => distributionCode(c.board[i].distribution));
  const centres = Float64Array.from(active, (i) => c.board[i].centre);
  const halfWidths = Float64Array.from(active, (i) => c.board[i].halfWidth);
  const factors = Float64Array.from(active, (i) => c.board[i].coverageFactor);
  const x = Float64Array.from(c.board, (i) => i.centre);
  const line = new Float64Array(2);
  const edgeHalfS = c.reading[1].halfWidth;
  const gridCount = c.gridV.length;
  const activeCount = active.length;
  return {
    outputCount: gridCount,
    simulate(source: VariateSource, trials: number, out: Float64Array, stride: number, offset: number): void {
      for (let t = 0; t < trials; t++) {
        for (let j = 0; j < activeCount; j++) x[index[j]] = centres[j] + halfWidths[j] * source.unit(codes[j], factors[j]);
        if (c.calibrated) calibrationLine(c, x, line);
        for (let g = 0; g < gridCount; g++) {
          const phase = source.uniform32();
          let startS = 0;
          let endS = 0;
          if (edgeHalfS > 0) {
            startS = edgeHalfS * (2 * source.uniform32() - 1);
            endS = edgeHalfS * (2 * source.uniform32() - 1);
          }
          out[g * stride + offset + t] = readingErrorV(c, x, g, phase, startS, endS, true, line);
        }
      }
    },
  };
}
