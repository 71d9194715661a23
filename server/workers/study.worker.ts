import os from 'node:os';
import { channelAnalytic, channelStudy } from '../../shared/propagation/channel-study.js';
import { compileChannel } from '../../shared/chain/compile.js';
import { channelKernel } from '../../shared/propagation/channel-kernel.js';
import { simulateBlocksInto } from '../../shared/propagation/simulate.js';
import { summariseValues } from '../../shared/propagation/summary.js';
import { computeMarginStudy } from '../api/margin/margin-study.js';
import { ADAPTIVE_MAX_TRIALS, type StudyTask } from './study-task.js';

// Studies are background work: on Linux a nice value set here applies to this thread alone, so the
// kernel lets the request-serving main thread in first when the cores are busy.
try {
  os.setPriority(10);
} catch {
  // Not permitted or not supported: run at normal priority.
}

/** Runs one task in a worker thread; errors travel back to the pool as rejections. */
export default function runStudyTask(task: StudyTask) {
  if (task.kind === 'fault') {
    if (task.mode === 'exit') process.exit(3);
    throw new Error('fault task asked to fail');
  }
  if (task.kind === 'warm') return null;
  if (task.kind === 'channel-summary') {
    return task.outputs.map((o) => summariseValues(
      new Float64Array(task.values, o * task.totalTrials * 8, task.totalTrials), task.coverageProbability, 40, true,
    ));
  }
  if (task.kind === 'channel-analytic') return channelAnalytic(task.channel, task.gridPoints, task.coverageProbability);
  let last = -1;
  const report = (progress: number) => {
    if (progress - last < 0.01 && progress < 1) return;
    last = progress;
    task.port?.postMessage({ progress });
  };
  report(0);
  if (task.kind === 'channel-blocks') {
    const kernel = channelKernel(compileChannel(task.channel, task.gridPoints));
    simulateBlocksInto(kernel, task.seed, task.totalTrials, task.firstBlock, task.blockCount, new Float64Array(task.values, 0, task.totalTrials * task.outputCount),
      (done, count) => { if (done % 20 === 0) report(done / count); }, { first: task.firstOutput, count: task.outputCount });
    report(1);
    task.port?.close();
    return null;
  }
  if (task.kind === 'margin') {
    const margin = computeMarginStudy(task.data, (f) => report(Math.min(0.99, f)));
    report(1);
    task.port?.close();
    return margin;
  }
  const result = channelStudy(task.channel, {
    seed: task.seed,
    trials: task.trials,
    ndig: task.ndig,
    coverageProbability: task.coverageProbability,
    gridPoints: task.gridPoints,
    // Every trial's errors are kept for exact quantiles: 10⁶ trials × 11 voltages is 88 MB per channel.
    maxTrials: ADAPTIVE_MAX_TRIALS,
    onProgress: (f) => report(0.95 * f),
  });
  report(1);
  task.port?.close();
  return result;
}
