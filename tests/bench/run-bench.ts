// Benchmark of Tallyvolt's studies. Run: npm run bench (a quiet machine gives the figures the README quotes).
// Every figure is named in the units a reader compares: boards (one draw of every board input) per second, readings
// (one simulated reading at one evaluation voltage) per second, and end-to-end study time through the running server,
// which runs the same code (the bundled study worker) as `npm start`. Each target is printed beside its figure with
// whether it holds; nothing here is asserted in a test.
import { fixtureSeries } from '../helpers/stored-series.js';
import { compileChannel } from '../../shared/chain/index.js';
import { blockCountFor, channelAnalytic, channelKernel, simulateBlocks } from '../../shared/propagation/index.js';
import { summariseValues } from '../../shared/propagation/summary.js';
import { distributionCode, VariateSource, blockStreams } from '../../shared/random/index.js';
import { radixSortFloat64 } from '../../shared/stats/index.js';
import { demoChannel } from '../fixtures/demo-channel.js';
import { benchInitialBundle } from './bundle-size.js';
import { benchServer } from './server-bench.js';
import { verdict } from './verdict.js';

const seconds = (start: number): number => (performance.now() - start) / 1000;
const fmt = (v: number): string => v.toExponential(2);

/** Boards per second in one thread, `gridPoints` readings per board, best of three. */
function boardsPerSecond(gridPoints: number, boards: number): number {
  const kernel = channelKernel(compileChannel(demoChannel(), gridPoints));
  simulateBlocks(kernel, 1, 20_000, 0, 20); // warm-up: the optimiser settles
  let best = Infinity;
  for (let run = 0; run < 3; run++) {
    const start = performance.now();
    simulateBlocks(kernel, 2 + run, boards, 0, blockCountFor(boards));
    best = Math.min(best, seconds(start));
  }
  return boards / best;
}

/**
 * The generator alone: per board the same variates the channel kernel draws (one per varying board input, by its
 * distribution, and a 32-bit phase and two edge times per reading), into a typed array, with no model.
 */
function generatorFloorPerSecond(gridPoints: number, boards: number): number {
  const compiled = compileChannel(demoChannel(), gridPoints);
  const active = compiled.board.filter((i) => i.halfWidth > 0);
  const codes = Int32Array.from(active, (i) => distributionCode(i.distribution));
  const factors = Float64Array.from(active, (i) => i.coverageFactor);
  const edges = compiled.reading[1].halfWidth > 0;
  const out = new Float64Array(1000);
  let best = Infinity;
  for (let run = 0; run < 3; run++) {
    const start = performance.now();
    const streams = blockStreams(run, 0);
    for (let b = 0; b < boards / 1000; b++) {
      const source = new VariateSource(streams.next());
      for (let t = 0; t < 1000; t++) {
        let acc = 0;
        for (let j = 0; j < codes.length; j++) acc += source.unit(codes[j], factors[j]);
        for (let g = 0; g < gridPoints; g++) acc += source.uniform32() + (edges ? source.uniform32() + source.uniform32() : 0);
        out[t] = acc;
      }
    }
    best = Math.min(best, seconds(start));
  }
  return boards / best;
}

function benchEngine(): void {
  const smallest = boardsPerSecond(2, 200_000);
  const floor = generatorFloorPerSecond(2, 200_000);
  console.log(`engine, one thread, 2 readings per board (the smallest grid): ${fmt(smallest)} boards/s, ${fmt(2 * smallest)} readings/s`);
  console.log(`  the generator alone drawing the same variates: ${fmt(floor)} boards/s; the model costs ${(100 * (1 - smallest / floor)).toFixed(0)} % of the time`);
  console.log(`  target ≥ 6·10⁶ trials/s (one board and one reading each; here two readings): ${verdict(smallest >= 6e6)}`);
  const full = boardsPerSecond(11, 100_000);
  console.log(`engine, one thread, 11 readings per board (an uncertainty study): ${fmt(full)} boards/s, ${fmt(11 * full)} readings/s`);

  const values = simulateBlocks(channelKernel(compileChannel(demoChannel(), 2)), 3, 1_000_000, 0, 1000).values.slice(0, 1_000_000);
  const sortTimes = { builtIn: Infinity, radix: Infinity, summary: Infinity };
  for (let run = 0; run < 3; run++) {
    let copy = Float64Array.from(values);
    let start = performance.now();
    copy.sort();
    sortTimes.builtIn = Math.min(sortTimes.builtIn, seconds(start));
    copy = Float64Array.from(values);
    start = performance.now();
    radixSortFloat64(copy);
    sortTimes.radix = Math.min(sortTimes.radix, seconds(start));
    copy = Float64Array.from(values);
    start = performance.now();
    summariseValues(copy, 0.95, 40, true);
    sortTimes.summary = Math.min(sortTimes.summary, seconds(start));
  }
  const ms = (s: number) => `${(s * 1000).toFixed(0)} ms`;
  console.log(`10⁶ readings at one voltage, best of 3: radix sort ${ms(sortTimes.radix)}, built-in typed-array sort ${ms(sortTimes.builtIn)} (${(sortTimes.builtIn / sortTimes.radix).toFixed(1)}×); whole summary with exact quantiles, sorted in place ${ms(sortTimes.summary)}`);

  channelAnalytic(demoChannel(), 11, 0.95);
  const start = performance.now();
  channelAnalytic(demoChannel(), 11, 0.95);
  console.log(`GUM with second-order terms, worst case over temperature and counter overflow, one channel, 11 voltages: ${(seconds(start) * 1000).toFixed(0)} ms (one thread, beside the simulation)`);
}

async function benchFinder(): Promise<void> {
  try {
    const finder = (await import('../../shared/finder/index.js')) as { findDividers?: (request: object) => { candidates: unknown[]; notSearched: string[] } };
    if (typeof finder.findDividers !== 'function') throw new Error('findDividers is not exported');
    for (const request of [
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: fixtureSeries('E192'), minTopCount: 1, maxTopCount: 4 },
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: fixtureSeries('E192'), minTopCount: 1, maxTopCount: 4, mixedTopStrings: true },
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: fixtureSeries('E96'), minTopCount: 4, maxTopCount: 4 },
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: fixtureSeries('E24'), minTopCount: 1, maxTopCount: 8, mixedTopStrings: true },
      { maxInputVolts: 462, targetRatio: 0.016, series: fixtureSeries('E96'), minTopCount: 3, maxTopCount: 3, mixedTopStrings: true, inputResistanceOhms: 10e6, inputBiasAmps: 1e-9 },
    ]) {
      finder.findDividers(request);
      const start = performance.now();
      const found = finder.findDividers(request);
      const skipped = found.notSearched.length ? `, ${found.notSearched.length} kinds of string not searched` : '';
      console.log(`divider finder ${JSON.stringify({ ...request, series: request.series.name })}: ${(seconds(start) * 1000).toFixed(1)} ms, ${found.candidates.length} candidates${skipped}`);
    }
  } catch (error) {
    console.log(`divider finder not timed: ${(error as Error).message}`);
  }
}

benchEngine();
await benchFinder();
await benchInitialBundle();
await benchServer();
