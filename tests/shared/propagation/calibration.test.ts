import { describe, it, expect } from 'vitest';
import { channelSchema } from '../../../shared/schemas/chain.js';
import { channelStudy } from '../../../shared/propagation/index.js';
import { demoChannelInput } from '../../fixtures/demo-channel.js';

const base = {
  ...demoChannelInput,
  converter: { ...demoChannelInput.converter, gainTempcoPpmPerK: 0, offsetDriftHzPerK: 0, nonlinearityPctFs: 0, inputBiasCurrentA: 0 },
  divider: {
    ...demoChannelInput.divider,
    top: demoChannelInput.divider.top.map((r) => ({ ...r, tcrPpmPerK: 0, voltageCoefficientPpmPerV: 0, thermalResistanceKPerW: 0 })),
    bottom: { ...demoChannelInput.divider.bottom, tcrPpmPerK: 0 },
  },
  environment: { minC: 25, maxC: 25, referenceC: 25 },
};

describe('calibrated reconstruction', () => {
  it('removes gain, offset, tolerance and clock errors at the calibration temperature, leaving quantisation', () => {
    const uncalibrated = channelStudy(channelSchema.parse(base), { seed: 5, trials: 5_000, gridPoints: 5 });
    const calibrated = channelStudy(channelSchema.parse({ ...base, reconstruction: { mode: 'calibrated', temperatureC: 25 } }), { seed: 5, trials: 5_000, gridPoints: 5 });
    const top = (s: typeof calibrated) => s.points[4].monteCarlo.standardDeviation;
    expect(top(uncalibrated)).toBeGreaterThan(1); // ±0.5 % gain error on 462 V
    // what is left is ±1 count of ≈ 1.1·10⁵ ticks plus isolator timing: < 0.01 V at 462 V (common practice)
    expect(top(calibrated)).toBeLessThan(0.01);
  });

  it('keeps the calibration reference uncertainty in the budget', () => {
    const channel = channelSchema.parse({ ...base, reconstruction: { mode: 'calibrated', temperatureC: 25, gainUncertaintyFraction: 0.001, offsetUncertaintyV: 0.1, coverageFactor: 2 } });
    const study = channelStudy(channel, { seed: 6, trials: 20_000, gridPoints: 3 });
    const top = study.points[2];
    expect(top.gum.budget[0].label).toBe('calibration gain');
    const expected = Math.hypot(462 * 0.0005, 0.05); // GUM (JCGM 100) 5.1.2 with u = U/k, k = 2
    expect(top.gum.combinedStandardUncertainty / expected).toBeCloseTo(1, 2);
    expect(Math.abs(top.monteCarlo.standardDeviation / expected - 1)).toBeLessThan(0.03); // JCGM 101:2008 7.6, M = 2·10⁴
    // 2·10⁴ trials place a 95 % end only to about ±0.009 V (2s), coarser than δ = 0.005 V of u ≈ 0.24 V (JCGM 101:2008 7.9.2)
    expect(top.gumValidation.verdict).toBe('cannot-tell');
    const longer = channelStudy(channel, { seed: 6, trials: 100_000, gridPoints: 3 }).points[2];
    expect(longer.gumValidation.verdict).toBe('agrees'); // JCGM 101:2008 §8: dominated by normal inputs, 2s ≈ 0.004 V ≤ δ at 10⁵
  });
});
