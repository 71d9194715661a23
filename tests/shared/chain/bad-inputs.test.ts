import { describe, it, expect } from 'vitest';
import { assertChannel, compileChannel, dividerNominal, nominalReadouts } from '../../../shared/chain/index.js';
import { channelSchema, type ChannelDefinition } from '../../../shared/schemas/chain.js';
import { demoChannel } from '../../fixtures/demo-channel.js';

const resistor = { nominalOhm: 1e6, tolerancePct: 0.1, toleranceDistribution: 'rectangular', toleranceCoverageFactor: 2, tcrPpmPerK: 0, voltageCoefficientPpmPerV: 0, thermalResistanceKPerW: 0 } as const;

function broken(change: (c: ChannelDefinition) => void): ChannelDefinition {
  const channel = structuredClone(demoChannel());
  change(channel);
  return channel;
}

describe('channel input checks', () => {
  const cases: [string, (c: ChannelDefinition) => void, string][] = [
    ['a zero bottom resistor', (c) => { c.divider.bottom.nominalOhm = 0; }, 'bottom resistor must be > 0 Ω'],
    ['a negative top resistor', (c) => { c.divider.top[1].nominalOhm = -5; }, 'top resistor 2 must be > 0 Ω'],
    ['a converter gain of 0', (c) => { c.converter.gainHzPerV = 0; }, 'converter gain must be > 0 Hz/V'],
    ['a gate time of 0', (c) => { c.capture = { method: 'gated', gateS: 0, counterBits: 32, clockTolerancePpm: 0 }; }, 'gate time must be > 0 s'],
    ['a reversed temperature range', (c) => { c.environment = { minC: 60, maxC: -20, referenceC: 25 }; }, 'temperature range reversed'],
    ['an empty top string', (c) => { c.divider.top = []; }, 'top string must have at least 1 resistor'],
    ['nine top resistors', (c) => { c.divider.top = Array.from({ length: 9 }, () => ({ ...resistor })); }, 'top string must have at most 8 resistors'],
    ['a negative tolerance', (c) => { c.divider.bottom.tolerancePct = -1; }, 'bottom resistor tolerance must be ≥ 0 %'],
    ['a reversed voltage range', (c) => { c.rangeV = { minV: 400, maxV: 100 }; }, 'voltage range reversed'],
  ];
  for (const [what, change, message] of cases) {
    it(`refuses ${what} by name`, () => {
      const channel = broken(change);
      expect(() => assertChannel(channel)).toThrow(message);
      expect(() => nominalReadouts(channel)).toThrow(message);
      expect(() => compileChannel(channel)).toThrow(message);
    });
  }

  it('refuses the same inputs through the schema with the same words', () => {
    const result = channelSchema.safeParse({
      rangeV: { minV: 0, maxV: 400 },
      divider: { top: [], bottom: { nominalOhm: 0 } },
      converter: { gainHzPerV: 0, fullScaleHz: 1e5 },
      capture: { method: 'gated', gateS: 0 },
      environment: { minC: 60, maxC: -20 },
    });
    expect(result.success).toBe(false);
    const messages = result.error?.issues.map((i) => i.message) ?? [];
    expect(messages).toEqual(expect.arrayContaining([
      'top string must have at least 1 resistor', 'resistance must be > 0 Ω', 'converter gain must be > 0 Hz/V',
      'gate time must be > 0 s', 'temperature range reversed',
    ]));
    const nine = channelSchema.safeParse({ ...demoChannel(), divider: { ...demoChannel().divider, top: Array.from({ length: 9 }, () => resistor) } });
    expect(nine.error?.issues[0].message).toBe('top string must have at most 8 resistors');
  });

  it('refuses period capture that sees no frequency at the bottom of the range', () => {
    const channel = broken((c) => { c.converter.offsetHz = 0; });
    expect(() => compileChannel(channel)).toThrow('frequency at the range minimum must be > 0 Hz for period capture');
  });

  it('refuses a zero resistance in the bare divider helper', () => {
    expect(() => dividerNominal({ top: [{ ...resistor, nominalOhm: 0 }], bottom: resistor })).toThrow('top resistor 1 must be > 0 Ω');
  });
});
