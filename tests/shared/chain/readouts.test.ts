import { describe, it, expect } from 'vitest';
import { compileChannel, frequencyResolutionHz, nominalReadouts, readingErrorV } from '../../../shared/chain/index.js';
import { channelSchema } from '../../../shared/schemas/chain.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel, demoChannelInput } from '../../fixtures/demo-channel.js';

describe('nominal readouts', () => {
  it('computes ratio, full-scale frequency, stresses and bleed current without touching the input', () => {
    const channel = deepFreeze(demoChannel());
    const readouts = nominalReadouts(channel);
    const loadedBottom = (4.99e3 * 10e6) / (4.99e3 + 10e6);
    const ratio = loadedBottom / (4e6 + loadedBottom); // handbook voltage divider with a loaded bottom
    expect(readouts.ratio).toBeCloseTo(ratio, 15);
    expect(readouts.fullScaleFrequencyHz).toBeCloseTo(1e3 + 10e3 * ratio * 462, 9); // f = f₀ + G·r·V
    expect(readouts.bleedCurrentA).toBeCloseTo(462 / (4e6 + loadedBottom), 15); // Ohm's law
    expect(readouts.stresses[0].powerW).toBeCloseTo((462 / (4e6 + loadedBottom)) ** 2 * 1e6, 12); // P = I²R
    expect(readouts.grid[0].countsPerReading).toBeCloseTo((16 * 48e6) / 1e3, 6); // N·f_clk/f ticks
    // The fixture's bottom resistor has a power rating but no voltage rating, and its isolator no working-voltage
    // rating: those checks are said not made.
    expect(readouts.warnings.map((w) => `${w.level} ${w.code}@${w.where}`)).toEqual(['info rating-missing@divider.bottom', 'info isolation-not-checked@isolator.ratedWorkingVoltageV']);
  });

  it('says a stress check could not be made when a rating is missing, with the stress it would have checked', () => {
    const channel = channelSchema.parse({
      ...demoChannelInput,
      rangeV: { minV: 0, maxV: 1000 },
      divider: { top: [{ nominalOhm: 990e3 }], bottom: { nominalOhm: 10e3, ratedVoltageV: 50, ratedPowerW: 0.1 } },
      converter: { ...demoChannelInput.converter, inputResistanceOhm: undefined },
    });
    const unrated = nominalReadouts(channel).warnings.filter((w) => w.code === 'rating-missing');
    // I = 1000 V / 1 MΩ = 1 mA; 990 V across 990 kΩ; P = V²/R = 0.99 W (Ohm's law, in the test)
    expect(unrated).toEqual([{
      code: 'rating-missing', level: 'info', where: 'divider.top[0]',
      message: 'top resistor 1 voltage and power ratings not entered: stress not checked (990 V across it, dissipates 0.99 W at 1000 V)',
    }]);
    const rated = channelSchema.parse({ ...channel, divider: { ...channel.divider, top: [{ nominalOhm: 990e3, ratedVoltageV: 1500, ratedPowerW: 0.5 }] } });
    const codes = nominalReadouts(rated).warnings.map((w) => `${w.code}@${w.where}`);
    expect(codes).not.toContain('rating-missing@divider.top[0]');
    expect(codes).toContain('over-power-rating@divider.top[0]'); // 0.99 W > 0.5 W, Ohm's law
  });

  it('warns where a resistor, the converter, the isolator or the counter is overstressed', () => {
    const channel = channelSchema.parse({
      ...demoChannelInput,
      divider: { ...demoChannelInput.divider, top: [{ nominalOhm: 1e6, ratedVoltageV: 300, ratedPowerW: 0.25 }] },
      converter: { ...demoChannelInput.converter, fullScaleHz: 5e3 },
      isolator: { maxSignalRateBd: 10e3 },
      capture: { method: 'period', clockHz: 48e6, periodsAveraged: 1024, counterBits: 16 },
    });
    const codes = nominalReadouts(channel).warnings.map((w) => `${w.code}@${w.where}`);
    expect(codes).toContain('over-voltage-rating@divider.top[0]');
    expect(codes).toContain('over-power-derating@divider.top[0]');
    expect(codes).toContain('converter-over-range@converter.fullScaleHz');
    expect(codes).toContain('isolator-rate-exceeded@isolator.maxSignalRateBd');
    expect(codes).toContain('counter-overflow@capture.counterBits');
  });
});

describe('gated-count quantisation', () => {
  it('resolves frequency to 1/T_gate', () => {
    const capture = channelSchema.shape.capture.parse({ method: 'gated', gateS: 0.25 });
    expect(frequencyResolutionHz(capture, 12_345)).toBe(4); // common practice: gated counter resolution ±1 count = ±1/T_gate
  });

  it('reads within one count of the truth for any phase, in steps of exactly one count', () => {
    const channel = channelSchema.parse({
      rangeV: { minV: 0, maxV: 400 },
      divider: { top: [{ nominalOhm: 396e3, tolerancePct: 0 }], bottom: { nominalOhm: 4e3, tolerancePct: 0 } },
      converter: { gainHzPerV: 10e3, fullScaleHz: 60e3 },
      capture: { method: 'gated', gateS: 0.1 },
      environment: { minC: 25, maxC: 25 },
    });
    const compiled = compileChannel(channel, 7);
    const x = Float64Array.from(compiled.board, (i) => i.centre);
    const voltsPerCount = 1 / (0.1 * 10e3 * 0.01); // 1/(T_gate·G·r)
    for (let g = 1; g < 7; g++) {
      const seen = new Set<number>();
      for (let phase = 0; phase < 1; phase += 1 / 64) {
        const error = readingErrorV(compiled, x, g, phase, 0, 0, true, new Float64Array(2));
        expect(Math.abs(error)).toBeLessThan(voltsPerCount * (1 + 1e-9)); // ±1 count with random phase
        seen.add(Math.round(error / voltsPerCount * 1e6));
      }
      const steps = [...seen].sort((a, b) => a - b);
      expect(steps.length).toBeLessThanOrEqual(2);
      if (steps.length === 2) expect(steps[1] - steps[0]).toBe(1e6); // one count apart
    }
    expect(nominalReadouts(channel).grid[3].voltsPerCount).toBeCloseTo(voltsPerCount, 12);
  });
});
