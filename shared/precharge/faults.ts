import { blockCountFor } from '../propagation/blocks.js';
import { outputValues, simulateBlocks } from '../propagation/simulate.js';
import { PRECHARGE_OUTPUT, prechargeKernel } from './kernel.js';
import type { PlausibilityWindow } from './plausibility.js';
import type { FaultVerdict, PrechargeDesign, PrechargeFault } from './types.js';

/** How one injected fault fares against the plausibility window. */
export interface FaultOutcome {
  fault: PrechargeFault;
  tooFastFraction: number;
  tooSlowFraction: number;
  notDetectedFraction: number;
  verdict: FaultVerdict;
}

/**
 * Runs each fault through the pre-charge Monte Carlo and classifies every trial: closed before
 * the window (too fast), closed after it or never (too slow), or inside it (not detected). The
 * verdict is the more frequent detection when at most `missFraction` of trials go undetected,
 * otherwise `not-detected`.
 * @param design healthy design
 * @param window plausibility window from the healthy study
 * @param faults faults to inject
 * @param options seed, trials per fault (default 10⁴), missFraction (default 0.001)
 * @throws Error naming a bad design or fault input
 * @example evaluateFaults(design, study.window, [{ kind: 'open-precharge' }], { seed: 1 })
 */
export function evaluateFaults(
  design: PrechargeDesign, window: PlausibilityWindow, faults: readonly PrechargeFault[],
  options: { seed: number; trials?: number; missFraction?: number },
): FaultOutcome[] {
  const trials = options.trials ?? 10_000;
  const missFraction = options.missFraction ?? 0.001;
  if (!(missFraction >= 0 && missFraction < 1)) throw new Error('miss fraction must be in [0, 1)');
  return faults.map((fault) => {
    const chunk = simulateBlocks(prechargeKernel(design, fault), options.seed, trials, 0, blockCountFor(trials));
    const closeS = outputValues(chunk, PRECHARGE_OUTPUT.closeTimeS);
    let fast = 0;
    let slow = 0;
    for (let i = 0; i < closeS.length; i++) {
      if (closeS[i] < window.tooFastBelowS) fast++;
      else if (closeS[i] > window.tooSlowAboveS) slow++;
    }
    const n = closeS.length;
    const notDetectedFraction = (n - fast - slow) / n;
    const verdict: FaultVerdict = notDetectedFraction > missFraction ? 'not-detected' : fast >= slow ? 'too-fast' : 'too-slow';
    return { fault, tooFastFraction: fast / n, tooSlowFraction: slow / n, notDetectedFraction, verdict };
  });
}
