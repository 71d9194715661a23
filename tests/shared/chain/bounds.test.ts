import { describe, expect, it } from 'vitest';
import { assertChannel, BOUNDS, boundProblem } from '../../../shared/chain/index.js';
import { channelSchema, type ChannelDefinitionInput } from '../../../shared/schemas/chain.js';
import { demoChannel, demoChannelInput } from '../../fixtures/demo-channel.js';

type Edit = (c: ChannelDefinitionInput & ReturnType<typeof demoChannel>) => void;

/** One non-physical value per engine input: the schema path it lands on and the message both checks give.
 * Expected limits are the product's own choice, each justified beside it in shared/chain/bounds.ts. */
const cases: [string, Edit, string, string, string?][] = [
  ['a tolerance of 300 %', (c) => { c.divider.top[0].tolerancePct = 300; }, 'divider.top.0.tolerancePct', 'tolerance must be ≤ 50 %', 'top resistor 1 tolerance must be ≤ 50 %'],
  ['a resistance of 10 TΩ', (c) => { c.divider.bottom.nominalOhm = 1e13; }, 'divider.bottom.nominalOhm', 'resistance must be ≤ 1 TΩ', 'bottom resistor must be ≤ 1 TΩ'],
  ['a TCR of 10⁴ ppm/K', (c) => { c.divider.top[1].tcrPpmPerK = 1e4; }, 'divider.top.1.tcrPpmPerK', 'TCR must be ≤ 1000 ppm/K', 'top resistor 2 TCR must be ≤ 1000 ppm/K'],
  ['a voltage coefficient of 1000 ppm/V', (c) => { c.divider.top[2].voltageCoefficientPpmPerV = 1000; }, 'divider.top.2.voltageCoefficientPpmPerV', 'voltage coefficient must be ≤ 100 ppm/V', 'top resistor 3 voltage coefficient must be ≤ 100 ppm/V'],
  ['a thermal resistance of 10⁶ K/W', (c) => { c.divider.top[0].thermalResistanceKPerW = 1e6; }, 'divider.top.0.thermalResistanceKPerW', 'thermal resistance must be ≤ 10 000 K/W', 'top resistor 1 thermal resistance must be ≤ 10 000 K/W'],
  ['an environment of −10³⁰⁰ °C', (c) => { c.environment.minC = -1e300; }, 'environment.minC', 'minimum temperature must be ≥ −273.15 °C'],
  ['an environment of +10³⁰⁰ °C', (c) => { c.environment.maxC = 1e300; }, 'environment.maxC', 'maximum temperature must be ≤ 500 °C'],
  ['a reference of 600 °C', (c) => { c.environment.referenceC = 600; }, 'environment.referenceC', 'reference temperature must be ≤ 500 °C'],
  ['a range maximum of 10³⁰⁸ V', (c) => { c.rangeV.maxV = 1e308; }, 'rangeV.maxV', 'range maximum must be ≤ 100 kV'],
  ['a converter gain of 10 GHz/V', (c) => { c.converter.gainHzPerV = 1e10; }, 'converter.gainHzPerV', 'converter gain must be ≤ 1 GHz/V'],
  ['a converter gain of 1 µHz/V', (c) => { c.converter.gainHzPerV = 1e-6; }, 'converter.gainHzPerV', 'converter gain must be ≥ 1 mHz/V'],
  ['a gain error of 80 %', (c) => { c.converter.gainErrorPct = 80; }, 'converter.gainErrorPct', 'gain error must be ≤ 50 %'],
  ['a gain tempco of 2000 ppm/K', (c) => { c.converter.gainTempcoPpmPerK = 2000; }, 'converter.gainTempcoPpmPerK', 'gain tempco must be ≤ 1000 ppm/K'],
  ['a full scale of 2 GHz', (c) => { c.converter.fullScaleHz = 2e9; }, 'converter.fullScaleHz', 'full-scale frequency must be ≤ 1 GHz'],
  ['a nonlinearity of 20 % FS', (c) => { c.converter.nonlinearityPctFs = 20; }, 'converter.nonlinearityPctFs', 'nonlinearity must be ≤ 10 % FS'],
  ['an input bias current of 1 A', (c) => { c.converter.inputBiasCurrentA = 1; }, 'converter.inputBiasCurrentA', 'input bias current must be ≤ 1 mA'],
  ['an input resistance tolerance of 60 %', (c) => { c.converter.inputResistanceTolerancePct = 60; }, 'converter.inputResistanceTolerancePct', 'input resistance tolerance must be ≤ 50 %'],
  ['an input resistance tempco of −1 ppm/K', (c) => { c.converter.inputResistanceTempcoPpmPerK = -1; }, 'converter.inputResistanceTempcoPpmPerK', 'input resistance tempco must be ≥ 0 ppm/K'],
  ['a timer clock of 100 GHz', (c) => { if (c.capture.method === 'period') c.capture.clockHz = 1e11; }, 'capture.clockHz', 'timer clock must be ≤ 10 GHz'],
  ['a clock tolerance of 20 %', (c) => { c.capture.clockTolerancePpm = 2e5; }, 'capture.clockTolerancePpm', 'clock tolerance must be ≤ 100 000 ppm'],
  ['a gate of 1 ns', (c) => { c.capture = { method: 'gated', gateS: 1e-9, counterBits: 32, clockTolerancePpm: 0 }; }, 'capture.gateS', 'gate time must be ≥ 1 µs'],
  ['a signalling rate of 10¹² Bd', (c) => { if (c.isolator) c.isolator.maxSignalRateBd = 1e12; }, 'isolator.maxSignalRateBd', 'isolator signalling rate must be ≤ 100 GBd'],
];

describe('physical bounds on every engine input', () => {
  for (const [what, edit, path, message, engineMessage] of cases) {
    it(`refuses ${what} by name, in the schema and in the engine`, () => {
      const input = structuredClone(demoChannelInput) as Parameters<Edit>[0];
      edit(input);
      const parsed = channelSchema.safeParse(input);
      expect(parsed.success).toBe(false);
      const issue = parsed.error?.issues.find((i) => i.path.join('.') === path);
      expect(issue?.message).toBe(message);
      const direct = demoChannel();
      edit(direct as Parameters<Edit>[0]);
      expect(() => assertChannel(direct)).toThrow(engineMessage ?? message);
    });
  }

  it('keeps the demo channel and the bounds themselves valid', () => {
    expect(channelSchema.safeParse(demoChannelInput).success).toBe(true);
    expect(() => assertChannel(demoChannel())).not.toThrow();
    for (const [name, bound] of Object.entries(BOUNDS)) {
      expect(bound.max, name).toBeGreaterThan(bound.min);
      expect(boundProblem(bound.max, name, bound)).toBeNull(); // the limit itself is allowed
    }
  });

  it('says ≤ for infinity and "a number" for NaN', () => {
    expect(boundProblem(Infinity, 'range maximum', BOUNDS.rangeMax)).toBe('range maximum must be ≤ 100 kV');
    expect(boundProblem(-Infinity, 'tolerance', BOUNDS.tolerance)).toBe('tolerance must be ≥ 0 %');
    expect(boundProblem(Number.NaN, 'tolerance', BOUNDS.tolerance)).toBe('tolerance must be a number');
    expect(boundProblem(0, 'gate time', BOUNDS.gate)).toBe('gate time must be > 0 s');
  });
});
