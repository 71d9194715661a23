import { describe, expect, it } from 'vitest';
import {
  checkProbability, independentTrials, readingErrorDraws, readingErrorSamples, runPrechargeStudy, type PrechargeDesign,
} from '../../../shared/precharge/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel } from '../../fixtures/demo-channel.js';

// Invented pre-charge read through the demo channel uncalibrated; the required ratio sits close enough
// to the 95 % threshold that early closure is rare, around 10⁻⁵ (found by running it, in this test).
const base = deepFreeze({
  packMinV: 308, packMaxV: 462, prechargeOhm: 1.5e3, prechargeTolerancePct: 5, linkCapacitanceF: 600e-6, capacitanceTolerancePct: 10,
  leakageOhm: 2e6, closingFraction: 0.95, requiredFraction: 0.9175, updateIntervalS: 0.01, consecutiveReadings: 3, timeoutS: 10,
});
const allowed = 1e-5;

function designWithBoards(boards: number, seed: number, requiredFraction = base.requiredFraction): PrechargeDesign {
  return {
    ...base, requiredFraction,
    packReading: readingErrorSamples(demoChannel(), { seed: 10 * seed, trials: boards }),
    linkReading: readingErrorSamples(demoChannel(), { seed: 10 * seed + 1, trials: boards }),
  };
}

function earlyCheck(design: PrechargeDesign, seed: number, trials: number) {
  const study = runPrechargeStudy(design, { seed, trials });
  return checkProbability(Math.round(study.earlyClosureProbability * trials), trials, readingErrorDraws(design), allowed);
}

describe('how far a margin study can resolve a small probability', () => {
  it('never calls a 10⁻⁵ criterion met on 500 simulated boards, though the raw count often looks fine', () => {
    const checks = [1, 2, 3, 4].map((seed) => earlyCheck(designWithBoards(500, seed), seed, 200_000));
    expect(checks.some((c) => c.estimate <= allowed)).toBe(true); // the count alone would have passed (issue scenario, found in this test)
    for (const c of checks) {
      expect(c.independentTrials).toBe(500); // the trials reuse 500 boards per channel
      expect(c.outcome).not.toBe('met');
      expect(c.smallestShowable).toBeCloseTo(1 - 0.05 ** (1 / 500), 12); // exact Clopper–Pearson bound after 0 of 500
      expect(c.upperBound).toBeGreaterThan(5e-3); // ≈ 3/500, Hanley & Lippman-Hand 1983 rule of three
    }
  });

  it('finds the same design failing once the boards are many', () => {
    const design = designWithBoards(50_000, 7, 0.92);
    const c = earlyCheck(design, 7, 200_000);
    expect(c.independentTrials).toBe(50_000);
    expect(c.estimate).toBeGreaterThan(allowed); // ≈ 4–6·10⁻⁵ at a 92 % required ratio, found by running it (in this test)
    expect(c.outcome).toBe('not-met');
  });

  it('counts every trial when the reading errors are drawn afresh', () => {
    const sigma = { kind: 'sigma', gainSigmaFraction: 0.004, offsetSigmaV: 0.5 } as const;
    const design: PrechargeDesign = { ...base, packReading: sigma, linkReading: sigma };
    expect(readingErrorDraws(design)).toBeNull();
    expect(independentTrials(1_000_000, null)).toBe(1_000_000);
    expect(independentTrials(1_000_000, 20_000)).toBe(20_000); // Kish design effect with wholly concordant clusters: n = clusters
    expect(independentTrials(1_000, 20_000)).toBe(1_000);
    const met = checkProbability(0, 1_000_000, null, allowed);
    expect(met.upperBound).toBeCloseTo(2.9957e-6, 9); // 1 − 0.05^(10⁻⁶), exact Clopper–Pearson after 0 of 10⁶
    expect(met.outcome).toBe('met');
  });

  it('tells met, not met and not shown apart by the bound and the estimate', () => {
    expect(checkProbability(0, 2_995, null, 1e-3).outcome).toBe('met'); // 1 − 0.05^(1/2995) = 9.998·10⁻⁴, exact
    expect(checkProbability(0, 2_994, null, 1e-3).outcome).toBe('not-shown'); // 1 − 0.05^(1/2994) = 1.0002·10⁻³, exact
    expect(checkProbability(3, 1_000, null, 1e-3).outcome).toBe('not-met'); // estimate 3·10⁻³ above the allowance
    const scaled = checkProbability(3, 1_000_000, 500, 1e-5);
    expect(scaled.outcome).toBe('not-shown'); // issue scenario: 3 in 10⁶ on 500 boards
    expect(scaled.upperBound).toBeGreaterThan(scaled.smallestShowable); // a fractional event count still raises the bound
  });

  it('refuses impossible counts by name', () => {
    expect(() => checkProbability(5, 4, null, 0.1)).toThrow('events must be a whole number in [0, trials]');
    expect(() => checkProbability(0, 10, null, 0)).toThrow('allowed probability must be in (0, 1)');
    expect(() => independentTrials(0, null)).toThrow('trials must be an integer ≥ 1');
    expect(() => independentTrials(10, 0)).toThrow('reading-error draws must be an integer ≥ 1');
  });
});
