import { describe, it, expect } from 'vitest';
import {
  runPrechargeStudy, simulatePrechargeChunk, summarisePrecharge, readingErrorSamples, timeToFractionS, type PrechargeDesign,
} from '../../../shared/precharge/index.js';
import { planChunks } from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel } from '../../fixtures/demo-channel.js';

// Invented pre-charge: 308–462 V pack, 1.5 kΩ into 600 µF, 2 MΩ of link-side dividers.
const design: PrechargeDesign = deepFreeze({
  packMinV: 308, packMaxV: 462, prechargeOhm: 1.5e3, prechargeTolerancePct: 5, linkCapacitanceF: 600e-6, capacitanceTolerancePct: 10,
  leakageOhm: 2e6, closingFraction: 0.95, requiredFraction: 0.9, updateIntervalS: 0.01, consecutiveReadings: 3, timeoutS: 10,
  packReading: { kind: 'sigma', gainSigmaFraction: 0.004, offsetSigmaV: 0.5 },
  linkReading: { kind: 'sigma', gainSigmaFraction: 0.004, offsetSigmaV: 0.5 },
});

describe('pre-charge margin study', () => {
  it('never closes early and closes at the closed-form time rounded up to the update interval when readings are exact', () => {
    const exact: PrechargeDesign = {
      ...design, packMinV: 400, packMaxV: 400, prechargeTolerancePct: 0, capacitanceTolerancePct: 0,
      packReading: { kind: 'sigma', gainSigmaFraction: 0, offsetSigmaV: 0 }, linkReading: { kind: 'sigma', gainSigmaFraction: 0, offsetSigmaV: 0 },
    };
    const study = runPrechargeStudy(exact, { seed: 1, trials: 2_000 });
    const crossS = timeToFractionS(0.95, { prechargeOhm: 1.5e3, leakageOhm: 2e6, capacitanceF: 600e-6 });
    const expectedS = (Math.ceil(crossS / 0.01) + 3 - 1) * 0.01; // handbook RC charging, readings every 10 ms, 3 in a row
    expect(study.earlyClosureProbability).toBe(0);
    expect(study.neverReachedProbability).toBe(0);
    for (const q of study.closureTimeS.quantiles) expect(q.value).toBeCloseTo(expectedS, 12);
  });

  it('catches a bypassed resistor as too fast, and an open path or heavy leakage as too slow', () => {
    const study = runPrechargeStudy(design, {
      seed: 4, trials: 50_000, faultTrials: 5_000,
      faults: [{ kind: 'bypassed-precharge' }, { kind: 'open-precharge' }, { kind: 'leakage', resistanceOhm: 15e3 }, { kind: 'missing-capacitance', fraction: 0.05 }],
    });
    expect(study.earlyClosureProbability).toBe(0); // 5 % margin between 95 % closing and 90 % required, readings ±0.4 %
    expect(study.window.tooFastBelowS).toBeLessThan(study.closureTimeS.quantiles[0].value);
    expect(study.faults.map((f) => f.verdict)).toEqual(['too-fast', 'too-slow', 'too-slow', 'not-detected']);
    expect(study.envelope.lowest.every((v, i) => v <= study.envelope.nominal[i] + 1e-12 && study.envelope.nominal[i] <= study.envelope.highest[i] + 1e-12)).toBe(true);
  });

  it('reports early closures when the reading errors eat the margin', () => {
    const sloppy: PrechargeDesign = { ...design, linkReading: { kind: 'sigma', gainSigmaFraction: 0.03, offsetSigmaV: 2 } };
    const study = runPrechargeStudy(sloppy, { seed: 4, trials: 20_000 });
    // the link reads ≥ 5.3 % high with probability ≈ 4 % (1.75σ of the combined gain spread); from memory
    expect(study.earlyClosureProbability).toBeGreaterThan(0.01);
    expect(study.earlyClosureProbability).toBeLessThan(0.1);
  });

  it('gives the same study for any chunking of the same seed', () => {
    const trials = 7_000;
    const whole = runPrechargeStudy(design, { seed: 8, trials });
    const chunks = planChunks(7, 3).map((r) => simulatePrechargeChunk(design, 8, trials, r.firstBlock, r.blockCount));
    expect(summarisePrecharge(design, chunks.reverse(), { seed: 8, trials })).toEqual(whole);
    expect(runPrechargeStudy(design, { seed: 9, trials }).closureTimeS).not.toEqual(whole.closureTimeS);
  });

  it('draws reading errors from the channel model', () => {
    const samples = readingErrorSamples(demoChannel(), { seed: 2, trials: 2_000 });
    expect(samples.gainErrorFraction.length).toBe(2_000);
    const study = runPrechargeStudy({ ...design, packReading: samples, linkReading: samples }, { seed: 3, trials: 5_000 });
    expect(study.earlyClosureProbability).toBeGreaterThanOrEqual(0);
  });

  it('refuses non-physical designs by name', () => {
    expect(() => runPrechargeStudy({ ...design, linkCapacitanceF: 0 }, { seed: 1, trials: 10 })).toThrow('link capacitance must be > 0 F');
    expect(() => runPrechargeStudy({ ...design, packMaxV: 100 }, { seed: 1, trials: 10 })).toThrow('pack voltage range reversed');
    expect(() => runPrechargeStudy({ ...design, updateIntervalS: 0 }, { seed: 1, trials: 10 })).toThrow('update interval must be > 0 s');
    expect(() => runPrechargeStudy({ ...design, consecutiveReadings: 0 }, { seed: 1, trials: 10 })).toThrow('consecutive readings must be a whole number ≥ 1');
  });
});
