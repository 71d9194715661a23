import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { nominalReadouts } from '../../shared/chain/index.js';
import { channelStudy } from '../../shared/propagation/index.js';
import { demoChannel } from '../fixtures/demo-channel.js';

/** Every number in a result, however deeply nested. */
function numbersIn(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value);
  else if (Array.isArray(value)) value.forEach((v) => numbersIn(v, out));
  else if (value && typeof value === 'object') Object.values(value).forEach((v) => numbersIn(v, out));
  return out;
}

const physical = fc.oneof(fc.double({ noNaN: false }), fc.constantFrom(0, -1, -1e-12, 1e-300, 1e300, Infinity, -Infinity, NaN));

describe('engine inputs that make no physical sense', () => {
  it('are refused with a message naming the input, or give only finite numbers (never NaN or infinity)', () => {
    const base = demoChannel();
    const paths: ((c: ReturnType<typeof demoChannel>, v: number) => void)[] = [
      (c, v) => { c.divider.bottom.nominalOhm = v; },
      (c, v) => { c.divider.top[0].nominalOhm = v; },
      (c, v) => { c.divider.top[1].tolerancePct = v; },
      (c, v) => { c.converter.gainHzPerV = v; },
      (c, v) => { c.converter.fullScaleHz = v; },
      (c, v) => { c.converter.offsetHz = v; },
      (c, v) => { c.environment.minC = v; },
      (c, v) => { c.environment.maxC = v; },
      (c, v) => { c.rangeV.maxV = v; },
      (c, v) => { c.capture = { method: 'gated', gateS: v, counterBits: 32, clockTolerancePpm: 0 }; },
      (c, v) => { if (c.capture.method === 'period') c.capture.clockHz = v; },
      (c, v) => { if (c.isolator) c.isolator.maxSignalRateBd = v; },
      (c, v) => { c.environment.referenceC = v; },
      (c, v) => { c.divider.top[0].tcrPpmPerK = v; },
      (c, v) => { c.divider.top[2].voltageCoefficientPpmPerV = v; },
      (c, v) => { c.converter.inputResistanceOhm = v; },
      (c, v) => { c.converter.inputResistanceTolerancePct = v; },
      (c, v) => { c.converter.inputResistanceTempcoPpmPerK = v; },
      (c, v) => { c.converter.gainErrorPct = v; },
      (c, v) => { c.capture.clockTolerancePpm = v; },
    ];
    fc.assert(
      fc.property(fc.integer({ min: 0, max: paths.length - 1 }), physical, (which, value) => {
        const channel = structuredClone(base);
        paths[which](channel, value);
        let result: unknown;
        try {
          result = { readouts: nominalReadouts(channel), study: channelStudy(channel, { seed: 1, trials: 1000, gridPoints: 3 }) };
        } catch (err) {
          expect(err).toBeInstanceOf(Error);
          expect((err as Error).message.length).toBeGreaterThan(5);
          return;
        }
        for (const n of numbersIn(result)) expect(Number.isFinite(n)).toBe(true);
      }),
      { numRuns: 300, seed: 7 },
    );
  });
});
