import { describe, expect, it } from 'vitest';
import { findDividers as findAll } from '../../../shared/finder/index.js';
import type { DividerCandidate, FinderRequest } from '../../../shared/finder/index.js';
import { fixtureSeries } from '../../helpers/stored-series.js';

/** The candidates within the tolerance (all kept ones when none is asked). */
const findDividers = (request: FinderRequest): DividerCandidate[] => findAll(request).candidates;

function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const inner of Object.values(value as object)) deepFreeze(inner);
    Object.freeze(value);
  }
  return value;
}

/** Figures recomputed from the values alone: I = V/ΣR, V_i = I·R_i, P_i = I²·R_i. */
function recompute(candidate: DividerCandidate, maxInputVolts: number) {
  const all = [...candidate.topOhms, candidate.bottomOhms];
  const totalOhms = all.reduce((sum, r) => sum + r, 0);
  const amps = maxInputVolts / totalOhms;
  return {
    totalOhms,
    amps,
    ratio: candidate.bottomOhms / totalOhms,
    maxVolts: Math.max(...all.map((r) => amps * r)),
    maxWatts: Math.max(...all.map((r) => amps * amps * r)),
  };
}

describe('findDividers with an E-series', () => {
  it('finds the exact E96 divider of four 1 MΩ resistors over 16.2 kΩ', () => {
    const targetRatio = 16.2e3 / (4e6 + 16.2e3); // 16.2 is an E96 value, IEC 60063 (via refdata e-series.json)
    const request = deepFreeze<FinderRequest>({ maxInputVolts: 462, targetRatio, series: fixtureSeries('E96'), minTopCount: 4, maxTopCount: 4, maxCandidates: 50 });
    const candidates = findDividers(request);
    expect(candidates[0].ratioErrorFraction).toBe(0);
    const exact = candidates.find((c) => c.topOhms.every((r) => r === 1e6) && c.bottomOhms === 16.2e3);
    expect(exact).toBeDefined();
    expect(exact?.ratioErrorFraction).toBe(0);
    expect(exact?.partCount).toBe(5);
    expect(exact?.bleedAmps).toBeCloseTo(462 / 4.0162e6, 15); // Ohm's law
  });

  it('derives the target ratio from the converter full scale', () => {
    const candidates = findDividers({ maxInputVolts: 400, fullScaleVolts: 2, series: fixtureSeries('E24'), minTopCount: 1, maxTopCount: 2 });
    expect(candidates.length).toBeGreaterThan(0);
    candidates.forEach((c) => expect(c.ratioErrorFraction).toBeCloseTo(c.ratio / (2 / 400) - 1, 12));
    candidates.forEach((c) => expect(c.outputVolts).toBeCloseTo(400 * c.ratio, 12));
  });

  it('reports figures that agree with Ohm’s law', () => {
    for (const c of findDividers({ maxInputVolts: 462, fullScaleVolts: 1.9, series: fixtureSeries('E48'), maxTopCount: 3 })) {
      const figures = recompute(c, 462);
      expect(c.totalOhms).toBeCloseTo(figures.totalOhms, 6); // Ohm's law
      expect(c.ratio).toBeCloseTo(figures.ratio, 14);
      expect(c.maxVoltsPerResistor).toBeCloseTo(figures.maxVolts, 9);
      expect(c.maxWattsPerResistor).toBeCloseTo(figures.maxWatts, 12);
    }
  });

  it('keeps every candidate within the voltage, power, bleed and resistance limits', () => {
    const limits = { maxVoltsPerResistor: 150, maxWattsPerResistor: 0.02, maxBleedAmps: 200e-6, minBleedAmps: 50e-6, minTotalOhms: 2e6, maxTotalOhms: 8e6 };
    const candidates = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, series: fixtureSeries('E96'), minTopCount: 1, maxTopCount: 6, limits, maxCandidates: 200 });
    expect(candidates.length).toBeGreaterThan(0);
    for (const c of candidates) {
      const figures = recompute(c, 462);
      expect(figures.maxVolts).toBeLessThanOrEqual(150 * (1 + 1e-12));
      expect(figures.maxWatts).toBeLessThanOrEqual(0.02 * (1 + 1e-12));
      expect(figures.amps).toBeLessThanOrEqual(200e-6 * (1 + 1e-12));
      expect(figures.amps).toBeGreaterThanOrEqual(50e-6 * (1 - 1e-12));
      expect(figures.totalOhms).toBeGreaterThanOrEqual(2e6);
      expect(figures.totalOhms).toBeLessThanOrEqual(8e6);
      expect(c.topOhms.length).toBeGreaterThanOrEqual(4); // 462 V over ≤ 150 V per resistor needs ≥ 4 in the top string
    }
  });

  it('ranks by ratio error, then parts count, then power, when the converter draws no bias current', () => {
    const candidates = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, series: fixtureSeries('E24'), maxTopCount: 4, maxCandidates: 100 });
    for (let i = 1; i < candidates.length; i++) {
      const [a, b] = [candidates[i - 1], candidates[i]];
      const errorA = Math.abs(a.ratioErrorFraction);
      const errorB = Math.abs(b.ratioErrorFraction);
      expect(errorA).toBeLessThanOrEqual(errorB + 1e-12);
      if (Math.abs(errorA - errorB) < 1e-13) {
        expect(a.partCount).toBeLessThanOrEqual(b.partCount);
        if (a.partCount === b.partCount) expect(a.totalWatts).toBeLessThanOrEqual(b.totalWatts);
      }
    }
  });

  it('finds at least as good a ratio with mixed top strings', () => {
    const base: FinderRequest = { maxInputVolts: 462, fullScaleVolts: 2.048, series: fixtureSeries('E12'), minTopCount: 2, maxTopCount: 3 };
    const equal = findDividers(base)[0];
    const mixed = findDividers({ ...base, mixedTopStrings: true })[0];
    expect(Math.abs(mixed.ratioErrorFraction)).toBeLessThanOrEqual(Math.abs(equal.ratioErrorFraction));
  });

  it('drops candidates beyond the ratio error allowed and returns none when the limits cannot be met', () => {
    const close = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, series: fixtureSeries('E12'), maxRatioErrorFraction: 1e-3, maxCandidates: 100 });
    close.forEach((c) => expect(Math.abs(c.ratioErrorFraction)).toBeLessThanOrEqual(1e-3));
    expect(findDividers({ maxInputVolts: 462, fullScaleVolts: 2, series: fixtureSeries('E12'), limits: { maxTotalOhms: 1e3, maxBleedAmps: 1e-3 } })).toEqual([]);
  });

  it('stays within the decade range of resistor values', () => {
    const candidates = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, series: fixtureSeries('E96'), limits: { minOhms: 10e3, maxOhms: 1e6 }, maxCandidates: 100 });
    candidates.flatMap((c) => [...c.topOhms, c.bottomOhms]).forEach((r) => {
      expect(r).toBeGreaterThanOrEqual(10e3);
      expect(r).toBeLessThanOrEqual(1e6);
    });
  });
});

describe('findDividers with a stock list', () => {
  const stock = deepFreeze([
    { ohms: 1e6, quantity: 3 },
    { ohms: 1.5e6, quantity: 8, maxVolts: 200 },
    { ohms: 10e3, quantity: 5 },
    { ohms: 12e3, quantity: 1 },
    { ohms: 6.8e3, quantity: 0 },
  ]);

  it('never uses more parts of a value than are on hand', () => {
    const candidates = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, stock, minTopCount: 1, maxTopCount: 8, mixedTopStrings: true, maxCandidates: 1000 });
    expect(candidates.length).toBeGreaterThan(0);
    for (const c of candidates) {
      const counts = new Map<number, number>();
      for (const r of [...c.topOhms, c.bottomOhms]) counts.set(r, (counts.get(r) ?? 0) + 1);
      for (const [ohms, count] of counts) expect(count).toBeLessThanOrEqual(stock.find((item) => item.ohms === ohms)?.quantity ?? 0);
      expect([...c.topOhms, c.bottomOhms]).not.toContain(6.8e3);
    }
  });

  it('uses only stock values inside the resistor range', () => {
    const candidates = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, stock, maxTopCount: 8, limits: { minOhms: 1.2e6 }, maxCandidates: 1000 });
    expect(candidates.length).toBeGreaterThan(0);
    candidates.forEach((c) => expect([...c.topOhms, c.bottomOhms].every((r) => r === 1.5e6)).toBe(true)); // only 1.5 MΩ is in range
    const wide = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, stock, maxTopCount: 8, limits: { maxOhms: 1.2e6 }, maxCandidates: 1000 });
    wide.forEach((c) => expect(c.topOhms).not.toContain(1.5e6));
  });

  it('respects a part’s own voltage rating', () => {
    const candidates = findDividers({ maxInputVolts: 462, fullScaleVolts: 2, stock, maxTopCount: 8, mixedTopStrings: true, maxCandidates: 1000 });
    for (const c of candidates) {
      const amps = 462 / c.totalOhms;
      c.topOhms.filter((r) => r === 1.5e6).forEach((r) => expect(amps * r).toBeLessThanOrEqual(200));
    }
  });

  it('picks the best combination from the shelf', () => {
    const request: FinderRequest = { maxInputVolts: 300, targetRatio: 12e3 / 2.512e6, stock, maxTopCount: 3, mixedTopStrings: true };
    const [best] = findDividers(request);
    expect(best.topOhms).toEqual([1e6, 1.5e6]); // 1 MΩ + 1.5 MΩ over 12 kΩ is exact by construction
    expect(best.bottomOhms).toBe(12e3);
    const [equalOnly] = findDividers({ ...request, mixedTopStrings: false });
    expect(Math.abs(equalOnly.ratioErrorFraction)).toBeGreaterThan(1e-3);
    expect(best.ratioErrorFraction).toBeCloseTo(0, 14);
  });
});

describe('findDividers rejects bad requests', () => {
  const good: FinderRequest = { maxInputVolts: 462, fullScaleVolts: 2, series: fixtureSeries('E24') };
  it.each([
    [{ ...good, maxInputVolts: 0 }, 'maxInputVolts must be > 0'],
    [{ ...good, maxInputVolts: NaN }, 'maxInputVolts must be > 0'],
    [{ ...good, fullScaleVolts: undefined }, 'give exactly one of fullScaleVolts and targetRatio'],
    [{ ...good, targetRatio: 0.1 }, 'give exactly one of fullScaleVolts and targetRatio'],
    [{ ...good, fullScaleVolts: 500 }, 'fullScaleVolts must be below maxInputVolts'],
    [{ ...good, fullScaleVolts: undefined, targetRatio: 1.2 }, 'targetRatio must be between 0 and 1'],
    [{ ...good, series: undefined }, 'give exactly one of series and stock'],
    [{ ...good, stock: [{ ohms: 1e3, quantity: 2 }] }, 'give exactly one of series and stock'],
    [{ ...good, series: { name: 'E7', values: [] } }, 'series E7: series values must hold at least one value'],
    [{ ...good, series: { name: 'odd', values: [4.7, 2.2] } }, 'series odd: series values must be strictly ascending'],
    [{ ...good, series: { name: 'big', values: [10] } }, 'series big: series value 10 must be ≥ 1 and < 10'],
    [{ ...good, series: undefined, stock: [] }, 'stock must hold at least one value'],
    [{ ...good, series: undefined, stock: [{ ohms: -1, quantity: 1 }] }, 'stock ohms must be finite numbers > 0'],
    [{ ...good, series: undefined, stock: [{ ohms: 1e3, quantity: 1.5 }] }, 'stock quantity must be a whole number'],
    [{ ...good, minTopCount: 0 }, 'minTopCount must be an integer from 1 to 8'],
    [{ ...good, maxTopCount: 9 }, 'maxTopCount must be an integer from 1 to 8'],
    [{ ...good, minTopCount: 5, maxTopCount: 3 }, 'maxTopCount must be ≥ minTopCount'],
    [{ ...good, limits: { maxVoltsPerResistor: -5 } }, 'limits.maxVoltsPerResistor must be > 0'],
    [{ ...good, limits: { minOhms: 1e6, maxOhms: 1e3 } }, 'limits.maxOhms must be ≥ limits.minOhms'],
    [{ ...good, maxCandidates: 0 }, 'maxCandidates must be an integer from 1 to 1000'],
    [{ ...good, inputResistanceOhms: 0 }, 'inputResistanceOhms must be > 0'],
    [{ ...good, inputBiasAmps: -1e-9 }, 'inputBiasAmps must be a finite number ≥ 0'],
    [{ ...good, maxRatioErrorFraction: -0.01 }, 'maxRatioErrorFraction must be > 0'],
  ])('rejects %o', (request, message) => {
    expect(() => findAll(request as FinderRequest)).toThrow(message);
  });
});
