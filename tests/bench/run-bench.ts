// Benchmark of the measurement-chain engine. Run:
//   npx tsx --tsconfig tsconfig.server.json tests/bench/run-bench.ts
// Targets (never asserted in tests): ≥ 5·10⁶ channel-trials/s on one core (a channel-trial is one
// simulated reading at one evaluation voltage, through divider → converter → isolator → capture →
// reconstruction), and 10⁶ trials of the two-channel pre-charge study in ≤ 1 s on two cores.
import { Piscina } from 'piscina';
import { compileChannel } from '../../shared/chain/index.js';
import { blockCountFor, channelKernel, planChunks, simulateBlocks, summariseChunks, type TrialChunk } from '../../shared/propagation/index.js';
import { readingErrorSamples, summarisePrecharge, type PrechargeDesign } from '../../shared/precharge/index.js';
import { demoChannel } from '../fixtures/demo-channel.js';
import { benchEventLoopDuringStudy } from './event-loop-bench.js';
import { benchInitialBundle } from './bundle-size.js';
import os from 'node:os';

const seconds = (start: number): number => (performance.now() - start) / 1000;
const fmt = (v: number): string => v.toExponential(2);

function benchChannelOneCore(): void {
  const channel = demoChannel();
  for (const gridPoints of [11, 2]) {
    const kernel = channelKernel(compileChannel(channel, gridPoints));
    const boards = 200_000;
    simulateBlocks(kernel, 1, 20_000, 0, 20); // warm-up
    let best = Infinity;
    for (let run = 0; run < 3; run++) {
      const start = performance.now();
      simulateBlocks(kernel, 1 + run, boards, 0, blockCountFor(boards));
      best = Math.min(best, seconds(start));
    }
    console.log(`channel, one core, ${gridPoints} voltages/board: ${fmt(boards / best)} boards/s, ${fmt((boards * gridPoints) / best)} channel-trials (readings)/s`);
  }
  const start = performance.now();
  const kernel = channelKernel(compileChannel(channel, 11));
  summariseChunks([simulateBlocks(kernel, 9, 100_000, 0, 100)], 9);
  console.log(`channel study of 10⁵ boards × 11 voltages incl. sorting/summary: ${seconds(start).toFixed(2)} s`);
}

async function benchPrecharge(): Promise<void> {
  const pack = demoChannel();
  const design: PrechargeDesign = {
    packMinV: 308, packMaxV: 462, prechargeOhm: 1.5e3, prechargeTolerancePct: 5, linkCapacitanceF: 600e-6, capacitanceTolerancePct: 10,
    leakageOhm: 4e6, closingFraction: 0.95, requiredFraction: 0.9, updateIntervalS: 0.01, consecutiveReadings: 3, timeoutS: 10,
    packReading: readingErrorSamples(pack, { seed: 1, trials: 20_000 }),
    linkReading: readingErrorSamples(pack, { seed: 2, trials: 20_000 }),
  };
  const pool = new Piscina({ filename: new URL('./bench-worker.mjs', import.meta.url).href, minThreads: 2, maxThreads: 2 });
  const trials = 1_000_000;
  const runOnce = async (seed: number): Promise<TrialChunk[]> =>
    Promise.all(planChunks(blockCountFor(trials), 2).map((range) =>
      pool.run({ design, seed, totalTrials: trials, ...range }, { name: 'prechargeChunk' }) as Promise<TrialChunk>));
  await runOnce(100); // warm-up: threads start and compile
  let best = Infinity;
  for (let run = 0; run < 3; run++) {
    const start = performance.now();
    const chunks = await runOnce(run);
    const simulated = seconds(start);
    summarisePrecharge(design, chunks, { seed: run, trials });
    const total = seconds(start);
    best = Math.min(best, total);
    console.log(`pre-charge 10⁶ trials, two cores: simulate ${simulated.toFixed(3)} s, with summary ${total.toFixed(3)} s`);
  }
  const faultsStart = performance.now();
  const chunks = await runOnce(7);
  summarisePrecharge(design, chunks, { seed: 7, trials, faults: [{ kind: 'open-precharge' }, { kind: 'bypassed-precharge' }, { kind: 'leakage', resistanceOhm: 20e3 }, { kind: 'missing-capacitance', fraction: 0.3 }] });
  console.log(`pre-charge 10⁶ trials + 4 faults × 10⁴ trials: ${seconds(faultsStart).toFixed(3)} s (best healthy run ${best.toFixed(3)} s)`);
  await pool.destroy();
}

async function benchFinder(): Promise<void> {
  try {
    const finder = (await import('../../shared/finder/index.js')) as { findDividers?: (request: object) => { candidates: unknown[]; notSearched: string[] } };
    if (typeof finder.findDividers !== 'function') throw new Error('findDividers is not exported');
    for (const request of [
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: 'E192', minTopCount: 1, maxTopCount: 4 },
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: 'E192', minTopCount: 1, maxTopCount: 4, mixedTopStrings: true },
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: 'E96', minTopCount: 4, maxTopCount: 4 },
      { maxInputVolts: 462, fullScaleVolts: 1.85, series: 'E24', minTopCount: 1, maxTopCount: 8, mixedTopStrings: true },
      { maxInputVolts: 462, targetRatio: 0.016, series: 'E96', minTopCount: 3, maxTopCount: 3, mixedTopStrings: true, inputResistanceOhms: 10e6, inputBiasAmps: 1e-9 },
    ]) {
      finder.findDividers(request);
      const start = performance.now();
      const found = finder.findDividers(request);
      const skipped = found.notSearched.length ? `, ${found.notSearched.length} kinds of string not searched` : '';
      console.log(`divider finder ${JSON.stringify(request)}: ${(seconds(start) * 1000).toFixed(1)} ms, ${found.candidates.length} candidates${skipped}`);
    }
  } catch (error) {
    console.log(`divider finder not timed: ${(error as Error).message}`);
  }
}

async function benchChannelPool(): Promise<void> {
  const threads = os.availableParallelism();
  const pool = new Piscina({ filename: new URL('./bench-worker.mjs', import.meta.url).href, minThreads: threads, maxThreads: threads });
  const channel = demoChannel();
  const boards = 1_000_000;
  const runOnce = (seed: number) => Promise.all(planChunks(blockCountFor(boards), threads * 4).map((range) =>
    pool.run({ channel, gridPoints: 11, seed, totalTrials: boards, ...range }, { name: 'channelChunk' })));
  await runOnce(1);
  const start = performance.now();
  await runOnce(2);
  const s = seconds(start);
  console.log(`channel, worker pool on ${threads} cores, 11 voltages/board: ${fmt(boards / s)} boards/s, ${fmt((boards * 11) / s)} channel-trials (readings)/s`);
  await pool.destroy();
}

let peakRss = 0;
const sampler = setInterval(() => { peakRss = Math.max(peakRss, process.memoryUsage().rss); }, 50);
benchChannelOneCore();
await benchChannelPool();
await benchPrecharge();
await benchFinder();
await benchEventLoopDuringStudy();
await benchInitialBundle();
clearInterval(sampler);
const maxRssMiB = process.resourceUsage().maxRSS / 1024;
console.log(`peak memory of the bench process (main thread and its workers): ${maxRssMiB.toFixed(0)} MiB max RSS (sampled ${(peakRss / 2 ** 20).toFixed(0)} MiB)`);
