import { compileChannel } from '../chain/compile.js';
import type { ChannelDefinition } from '../chain/types.js';
import { blockCountFor } from '../propagation/blocks.js';
import { channelKernel } from '../propagation/channel-kernel.js';
import { simulateBlocks } from '../propagation/simulate.js';
import type { ReadingErrorModel } from './types.js';
import { DEFAULT_GRID_POINTS } from '../schemas/study-defaults.js';

/**
 * Reading-error samples of a channel for the margin study: for each simulated board, the
 * least-squares line e(V) = o + g·V through its errors on the evaluation grid, so each pair
 * (g, o) is one board's relative gain error and offset error (V).
 * @param channel fully specified channel
 * @param options seed, trials (boards), grid points (default 11)
 * @throws Error naming a bad channel input
 * @example prechargeDesign.packReading = readingErrorSamples(packChannel, { seed: 1, trials: 20_000 })
 */
export function readingErrorSamples(
  channel: ChannelDefinition, options: { seed: number; trials: number; gridPoints?: number },
): Extract<ReadingErrorModel, { kind: 'samples' }> {
  const compiled = compileChannel(channel, options.gridPoints ?? DEFAULT_GRID_POINTS);
  const chunk = simulateBlocks(channelKernel(compiled), options.seed, options.trials, 0, blockCountFor(options.trials));
  const v = compiled.gridV;
  const n = v.length;
  const meanV = v.reduce((a, b) => a + b, 0) / n;
  const sxx = v.reduce((a, b) => a + (b - meanV) ** 2, 0);
  const gain = new Float64Array(chunk.trials);
  const offset = new Float64Array(chunk.trials);
  for (let t = 0; t < chunk.trials; t++) {
    let meanE = 0;
    for (let g = 0; g < n; g++) meanE += chunk.values[g * chunk.trials + t];
    meanE /= n;
    let sxy = 0;
    for (let g = 0; g < n; g++) sxy += (v[g] - meanV) * (chunk.values[g * chunk.trials + t] - meanE);
    gain[t] = sxy / sxx;
    offset[t] = meanE - gain[t] * meanV;
  }
  return { kind: 'samples', gainErrorFraction: gain, offsetErrorV: offset };
}
