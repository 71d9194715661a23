import { describe, it, expect } from 'vitest';
import { channelSchema, type ChannelDefinitionInput } from '../../../shared/schemas/chain.js';
import { compileChannel } from '../../../shared/chain/index.js';
import {
  channelErrorFunction, channelKernel, channelWorstCase, runMonteCarlo, type MeasurementFunction, type UncertainInput,
} from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel, demoChannelInput } from '../../fixtures/demo-channel.js';

/** Every corner of the bounded inputs, temperature at its two ends, in Gray-code order. */
function everyCorner(inputs: readonly UncertainInput[], model: MeasurementFunction) {
  const bounded = inputs.map((_, i) => i).filter((i) => inputs[i].halfWidth > 0);
  const x = Float64Array.from(inputs, (input) => input.centre - input.halfWidth);
  const signs = new Int8Array(bounded.length).fill(-1);
  const temperature = bounded.findIndex((i) => inputs[i].key === 'environment.temperature');
  let maximum = model(x);
  let minimum = maximum;
  let hotMaximum = signs[temperature] > 0;
  for (let k = 1; k < 2 ** bounded.length; k++) {
    const j = 31 - Math.clz32(k & -k);
    signs[j] = -signs[j];
    const input = inputs[bounded[j]];
    x[bounded[j]] = input.centre + signs[j] * input.halfWidth;
    const y = model(x);
    if (y > maximum) { maximum = y; hotMaximum = signs[temperature] > 0; }
    if (y < minimum) minimum = y;
  }
  return { maximum, minimum, count: bounded.length, hotMaximum };
}

const chain = (input: ChannelDefinitionInput) => deepFreeze(channelSchema.parse(input));
const withoutVoltageCoefficients = demoChannelInput.divider.top.map((r) => ({ ...r, voltageCoefficientPpmPerV: 0 }));

/** Eight 470 kΩ top resistors at 0.5 %, TCR on all, period capture, −40…85 °C: the cold corner is the extreme. */
const eightTop = chain({
  name: 'eight top resistors',
  rangeV: { minV: 0, maxV: 462 },
  divider: {
    top: Array.from({ length: 8 }, () => ({ nominalOhm: 470e3, tolerancePct: 0.5, tcrPpmPerK: 100, thermalResistanceKPerW: 150 })),
    bottom: { nominalOhm: 4.7e3, tolerancePct: 0.5, tcrPpmPerK: 100 },
  },
  converter: { gainHzPerV: 10e3, offsetHz: 1e3, gainErrorPct: 0.5, gainTempcoPpmPerK: 50, fullScaleHz: 7e3 },
  capture: { method: 'period', clockHz: 48e6, prescaler: 1, periodsAveraged: 16 },
  environment: { minC: -40, maxC: 85, referenceC: 25 },
});

const smallChains: Record<string, ReturnType<typeof chain>> = {
  'period capture, three top resistors': chain({
    ...demoChannelInput, isolator: undefined, divider: { ...demoChannelInput.divider, top: withoutVoltageCoefficients.slice(0, 3) },
  }),
  'gated count, two top resistors': chain({
    ...demoChannelInput, isolator: undefined, divider: { ...demoChannelInput.divider, top: demoChannelInput.divider.top.slice(0, 2) },
    capture: { method: 'gated', gateS: 0.1, clockTolerancePpm: 50 },
  }),
  'calibrated read-back at 25 °C': chain({
    ...demoChannelInput, isolator: undefined, divider: { ...demoChannelInput.divider, top: withoutVoltageCoefficients.slice(0, 3) },
    converter: { ...demoChannelInput.converter, nonlinearityPctFs: 0.2, inputBiasCurrentA: 0 },
    reconstruction: { mode: 'calibrated', temperatureC: 25, gainUncertaintyFraction: 2e-4, offsetUncertaintyV: 0.05, coverageFactor: 2 },
    environment: { minC: -40, maxC: 85, referenceC: 25 },
  }),
  // At 0 V a bias current's effect is nil until the TCRs move the divider's resistance: a pair.
  'calibrated at 40 °C, large bias current': chain({
    name: 'bias current', rangeV: { minV: 0, maxV: 462 },
    divider: {
      top: [{ nominalOhm: 2.2e6, tolerancePct: 1, tcrPpmPerK: 25 }, { nominalOhm: 470e3, tolerancePct: 0.5, tcrPpmPerK: 100 }, { nominalOhm: 100e3, tolerancePct: 1, tcrPpmPerK: 200 }],
      bottom: { nominalOhm: 20e3, tolerancePct: 1, tcrPpmPerK: 100, thermalResistanceKPerW: 150 },
    },
    converter: { gainHzPerV: 10e3, offsetErrorHz: 50, fullScaleHz: 200e3, inputBiasCurrentA: 1e-7 },
    capture: { method: 'gated', gateS: 0.1, clockTolerancePpm: 50 },
    reconstruction: { mode: 'calibrated', temperatureC: 40, gainUncertaintyFraction: 1e-4, offsetUncertaintyV: 0, coverageFactor: 2 },
    environment: { minC: -20, maxC: 85, referenceC: 20 },
  }),
  'calibrated cold, self-heated, five top resistors': chain({
    ...eightTop, divider: { ...eightTop.divider, top: eightTop.divider.top.slice(0, 5).map((r) => ({ ...r, thermalResistanceKPerW: 400 })) },
    converter: { ...eightTop.converter, offsetErrorHz: 50 },
    reconstruction: { mode: 'calibrated', temperatureC: 0, gainUncertaintyFraction: 0, offsetUncertaintyV: 0, coverageFactor: 2 },
  }),
};

describe('worst case against every corner', () => {
  it('finds the cold extreme of eight TCR-matched top resistors, as every one of the 2^22 corners shows', () => {
    const compiled = compileChannel(eightTop, 3);
    const { inputs, model } = channelErrorFunction(compiled, 2);
    const truth = everyCorner(inputs, model); // exhaustive enumeration over all 2^n corners (in this test)
    const engine = channelWorstCase(compiled)[2];
    expect(truth.count).toBe(22);
    expect(truth.hotMaximum).toBe(false); // the largest error is at −40 °C (exhaustive enumeration, in this test)
    expect(engine.boundedInputs).toBe(truth.count);
    expect(engine.maximum).toBeCloseTo(truth.maximum, 9); // exhaustive enumeration over all 2^22 corners (in this test)
    expect(engine.minimum).toBeCloseTo(truth.minimum, 9); // exhaustive enumeration over all 2^22 corners (in this test)
  }, 120_000);

  for (const [name, channel] of Object.entries(smallChains)) {
    it(`equals the extreme corner at every voltage: ${name}`, () => {
      const compiled = compileChannel(channel, 3);
      const engine = channelWorstCase(compiled);
      for (let g = 0; g < compiled.gridV.length; g++) {
        const { inputs, model } = channelErrorFunction(compiled, g);
        const truth = everyCorner(inputs, model);
        expect(engine[g].method).toBe('signs-and-flips');
        expect(engine[g].maximum).toBeCloseTo(truth.maximum, 9); // exhaustive enumeration over all 2^n corners (in this test)
        expect(engine[g].minimum).toBeCloseTo(truth.minimum, 9); // exhaustive enumeration over all 2^n corners (in this test)
      }
    }, 120_000);
  }
});

describe('worst case against Monte Carlo trials', () => {
  const chains: Record<string, ReturnType<typeof chain>> = {
    'demo channel': deepFreeze(demoChannel()),
    'eight top resistors over −40…85 °C': eightTop,
    // Rectangular inputs only: a normal input enters the worst case at ±k·σ, which a trial may pass.
    'calibrated read-back': chain({
      ...demoChannelInput, environment: { minC: -40, maxC: 85, referenceC: 25 },
      reconstruction: { mode: 'calibrated', temperatureC: 20, gainUncertaintyFraction: 0, offsetUncertaintyV: 0, coverageFactor: 2 },
    }),
    'gated count, self-heated': chain({
      ...demoChannelInput, capture: { method: 'gated', gateS: 0.05, clockTolerancePpm: 100 },
      divider: { ...demoChannelInput.divider, top: demoChannelInput.divider.top.map((r) => ({ ...r, thermalResistanceKPerW: 600 })) },
    }),
  };
  for (const [name, channel] of Object.entries(chains)) {
    it(`bounds every trial at every voltage: ${name}`, () => {
      const compiled = compileChannel(channel, 11);
      const mc = runMonteCarlo(channelKernel(compiled), { seed: 23, trials: 20_000 });
      channelWorstCase(compiled).forEach((point, g) => {
        expect(point.maximum).toBeGreaterThanOrEqual(mc.outputs[g].maximum); // a worst case bounds every trial (definition)
        expect(point.minimum).toBeLessThanOrEqual(mc.outputs[g].minimum); // a worst case bounds every trial (definition)
      });
    });
  }
});
