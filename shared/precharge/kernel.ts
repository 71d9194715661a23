import type { TrialKernel } from '../propagation/kernel.js';
import type { VariateSource } from '../random/variates.js';
import type { PrechargeDesign, PrechargeFault, ReadingErrorModel } from './types.js';
import { assertPrechargeDesign } from './validate.js';

/** Kernel outputs, per trial. */
export const PRECHARGE_OUTPUT = { closeTimeS: 0, ratio: 1, stepV: 2, steadyFraction: 3, timeConstantS: 4 } as const;

function drawReading(model: ReadingErrorModel, source: VariateSource, out: Float64Array): void {
  if (model.kind === 'sigma') {
    out[0] = model.gainSigmaFraction * source.normal();
    out[1] = model.offsetSigmaV * source.normal();
  } else {
    const i = Math.min(model.gainErrorFraction.length - 1, Math.floor(source.uniform() * model.gainErrorFraction.length));
    out[0] = model.gainErrorFraction[i];
    out[1] = model.offsetErrorV[i];
  }
}

/**
 * Monte Carlo kernel of a pre-charge: per trial a pack voltage U(min, max), R_p and C within
 * their tolerances (rectangular), and each channel's reading error V̂ = V(1 + g) + o. The link
 * charges as V·s(1 − e^(−t/τ)); readings at t = kΔ; the first k with link reading ≥ closing
 * fraction × pack reading solves k = max(1, ⌈t_x/Δ⌉) with t_x = −τ·ln(1 − x), x the needed
 * fraction of the steady state; closure after N consecutive readings at (k + N − 1)Δ (the link
 * only rises, so later readings stay above). Outputs (see PRECHARGE_OUTPUT): closure time (s),
 * true link/pack ratio and voltage step (V) at closure — all Infinity when never reached
 * before the timeout — and the trial's s and τ (s).
 * @param design pre-charge design (validated here)
 * @param fault optional fault applied to every trial
 * @throws Error naming a bad design input
 * @example runMonteCarlo-like use: simulateBlocks(prechargeKernel(design), seed, trials, 0, blocks)
 */
export function prechargeKernel(design: PrechargeDesign, fault?: PrechargeFault): TrialKernel {
  assertPrechargeDesign(design);
  let prechargeOhm = design.prechargeOhm;
  let prechargeTolerance = design.prechargeTolerancePct / 100;
  let leakageOhm = design.leakageOhm ?? Infinity;
  let capacitanceF = design.linkCapacitanceF;
  if (fault?.kind === 'open-precharge') prechargeOhm = Infinity;
  if (fault?.kind === 'bypassed-precharge') {
    prechargeOhm = fault.residualOhm ?? 0;
    prechargeTolerance = 0;
    if (!(prechargeOhm >= 0)) throw new Error('bypass residual resistance must be ≥ 0 Ω');
  }
  if (fault?.kind === 'leakage') {
    if (!(fault.resistanceOhm > 0)) throw new Error('fault leakage resistance must be > 0 Ω');
    leakageOhm = leakageOhm === Infinity ? fault.resistanceOhm : (leakageOhm * fault.resistanceOhm) / (leakageOhm + fault.resistanceOhm);
  }
  if (fault?.kind === 'missing-capacitance') {
    if (!(fault.fraction >= 0 && fault.fraction < 1)) throw new Error('missing capacitance fraction must be in [0, 1)');
    capacitanceF *= 1 - fault.fraction;
  }
  const leakageS = leakageOhm === Infinity ? 0 : 1 / leakageOhm;
  const capacitanceTolerance = design.capacitanceTolerancePct / 100;
  const { packMinV, packMaxV, closingFraction, updateIntervalS, consecutiveReadings, timeoutS } = design;
  const pack = new Float64Array(2);
  const link = new Float64Array(2);
  return {
    outputCount: 5,
    simulate(source: VariateSource, trials: number, out: Float64Array, stride: number, offset: number): void {
      for (let t = 0; t < trials; t++) {
        const packV = packMinV + (packMaxV - packMinV) * source.uniform();
        const rp = prechargeOhm * (1 + prechargeTolerance * (2 * source.uniform() - 1));
        const cap = capacitanceF * (1 + capacitanceTolerance * (2 * source.uniform() - 1));
        drawReading(design.packReading, source, pack);
        drawReading(design.linkReading, source, link);
        const open = rp === Infinity;
        const steady = open ? 0 : 1 / (1 + rp * leakageS);
        const tau = open ? cap / leakageS : (cap * rp) / (1 + rp * leakageS);
        const packReadingV = packV * (1 + pack[0]) + pack[1];
        const neededV = (closingFraction * packReadingV - link[1]) / (1 + link[0]);
        const x = steady > 0 ? neededV / (packV * steady) : Infinity;
        let closeS = Infinity;
        if (x < 1) {
          const crossS = x <= 0 || tau === 0 ? 0 : -tau * Math.log(1 - x);
          const k = Math.max(1, Math.ceil(crossS / updateIntervalS)) + consecutiveReadings - 1;
          if (k * updateIntervalS <= timeoutS) closeS = k * updateIntervalS;
        }
        const i = offset + t;
        out[i] = closeS;
        const ratio = closeS === Infinity ? Infinity : tau === 0 ? steady : steady * (1 - Math.exp(-closeS / tau));
        out[stride + i] = ratio;
        out[2 * stride + i] = closeS === Infinity ? Infinity : packV * (1 - ratio);
        out[3 * stride + i] = steady;
        out[4 * stride + i] = tau;
      }
    },
  };
}
