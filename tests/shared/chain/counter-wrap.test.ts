import { describe, expect, it } from 'vitest';
import { compileChannel, counterOverflow, nominalReadouts, readCount, readingErrorV } from '../../../shared/chain/index.js';
import { channelStudy } from '../../../shared/propagation/index.js';
import { channelSchema, type ChannelDefinitionInput } from '../../../shared/schemas/chain.js';

/** r = 10 kΩ / 1 MΩ = 0.01 exactly, f = 1 kHz + 10 kHz/V · r · V, a 16-bit counter on a 48 MHz clock over 16 periods; no spread. */
const wrapping: ChannelDefinitionInput = {
  rangeV: { minV: 0, maxV: 1000 },
  divider: { top: [{ nominalOhm: 990e3, tolerancePct: 0 }], bottom: { nominalOhm: 10e3, tolerancePct: 0 } },
  converter: { gainHzPerV: 10e3, offsetHz: 1e3, fullScaleHz: 200e3 },
  capture: { method: 'period', clockHz: 48e6, periodsAveraged: 16, counterBits: 16 },
  environment: { minC: 25, maxC: 25 },
};

/** What the firmware reads back from a count n on an endless counter: V̂ = (N·f_tick/(n mod 2^16) − f₀)/(G·r). */
const readBackV = (n: number) => ((16 * 48e6) / (n % 65_536) - 1e3) / (10e3 * 0.01);

describe('a counter that overflows', () => {
  it('reads the count modulo 2^bits', () => {
    const c = compileChannel(channelSchema.parse(wrapping), 11);
    expect(readCount(c, 768_000)).toBe(47_104); // arithmetic, in the test: 768 000 − 11·65 536
    expect(readCount(c, 65_535)).toBe(65_535); // arithmetic, in the test: the largest 16-bit count
    expect(readCount(c, 65_536)).toBe(0); // arithmetic, in the test: 2^16 mod 2^16
  });

  it('gives the wrapped reading at 0 V in the Monte Carlo and the analytic model', () => {
    const c = compileChannel(channelSchema.parse(wrapping), 11);
    const x = Float64Array.from(c.board, (i) => i.centre);
    const expected = readBackV(16 * 48e6 / 1e3); // arithmetic, in the test: 16·48e6/1 kHz = 768 000 counts, reads 153.04 V
    expect(expected).toBeCloseTo(153.043, 3); // arithmetic, in the test
    expect(readingErrorV(c, x, 0, 0.5, 0, 0, true, new Float64Array(2))).toBeCloseTo(expected, 9);
    expect(readingErrorV(c, x, 0, 0, 0, 0, false, new Float64Array(2))).toBeCloseTo(expected, 9);
  });

  it('wraps a gated count too', () => {
    const gated = channelSchema.parse({ ...wrapping, capture: { method: 'gated', gateS: 1, counterBits: 16 } });
    const c = compileChannel(gated, 11);
    const x = Float64Array.from(c.board, (i) => i.centre);
    // arithmetic, in the test: 101 kHz · 1 s = 101 000 counts, reads 35 464, V̂ = (35 464 − 1000)/100
    expect(readingErrorV(c, x, 10, 0, 0, 0, false, new Float64Array(2))).toBeCloseTo((101_000 - 65_536 - 1e3) / 100 - 1000, 9);
  });

  it('carries the wrap through every method of a study and flags the voltages where it happens', () => {
    const study = channelStudy(channelSchema.parse(wrapping), { seed: 3, trials: 2000, gridPoints: 11 });
    // arithmetic, in the test: ticks = 768e6/(1 kHz + 100 Hz/V·V) pass 65 535 below 107.2 V, so at 0 and 100 V only
    expect(study.points.map((p) => p.counterOverflow)).toEqual([true, true, false, false, false, false, false, false, false, false, false]);
    const zero = study.points[0];
    expect(zero.monteCarlo.mean).toBeCloseTo(readBackV(768_000), 9); // arithmetic, in the test: an exact count, no phase effect
    expect(zero.gum.estimate).toBeCloseTo(readBackV(768_000), 9); // arithmetic, in the test
    expect(zero.worstCase.maxAbs).toBeGreaterThan(153); // arithmetic, in the test: at least the wrapped reading
    // arithmetic, in the test: 768e6/11 kHz = 69 818.18 ticks, read as 69 818 or 69 819 (mod 2^16), minus the 100 V applied
    const [low, high] = [readBackV(69_819) - 100, readBackV(69_818) - 100];
    expect(study.points[1].monteCarlo.mean).toBeGreaterThanOrEqual(low);
    expect(study.points[1].monteCarlo.mean).toBeLessThanOrEqual(high);
    expect(Math.abs(study.points[2].monteCarlo.mean)).toBeLessThan((21e3 ** 2 / 768e6) / 100); // common practice: within one count, Δf = f²/(N·f_clk)
  });

  it('flags a voltage whose nominal count fits but a count within the tolerance box does not', () => {
    const edge = { ...wrapping, rangeV: { minV: 110, maxV: 200 } };
    const nominal = counterOverflow(compileChannel(channelSchema.parse(edge), 2));
    expect(nominal[0].nominalCounts).toBeCloseTo(64_000, 6); // arithmetic, in the test: 768e6 / 12 kHz
    expect(nominal[0].overflows).toBe(false);
    const spread = channelSchema.parse({ ...edge, converter: { ...edge.converter, gainErrorPct: 5 } });
    const boxed = counterOverflow(compileChannel(spread, 2));
    // arithmetic, in the test: lowest f = 1 kHz + 11 kHz·0.95 = 11 450 Hz → 67 074.2 ticks, +1 count of quantisation
    expect(boxed[0].highestCounts).toBeCloseTo(768e6 / 11_450 + 1, 6);
    expect(boxed[0].overflows).toBe(true);
    expect(boxed[1].overflows).toBe(false);
  });

  it('says in the editor where the counter overflows and what it reads', () => {
    const warning = nominalReadouts(channelSchema.parse(wrapping)).warnings.find((w) => w.code === 'counter-overflow');
    // arithmetic, in the test: 768 000 counts at 0 V, read as 47 104; the next grid voltage (250 V) fits
    expect(warning?.message).toBe('counter overflows at 0 V: 768000 counts at 0 V pass a 16-bit counter, which reads 47104; the studies include the wrap');
  });
});
