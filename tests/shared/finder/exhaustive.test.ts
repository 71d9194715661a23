import { describe, expect, it } from 'vitest';
import { findDividers } from '../../../shared/finder/index.js';
import type { FinderRequest, StockItem } from '../../../shared/finder/index.js';
import { fixtureSeries, fixtureValuesInRange } from '../../helpers/stored-series.js';

interface Shelf { ohms: number; quantity: number }
interface Brute { errors: number[]; keys: string[] }

/**
 * Every top multiset of `length` values (shelf ascending) with every bottom, scored independently of the finder:
 * R_b' = R_b·R_in/(R_b + R_in), r = R_b'/(S + R_b'), offset I_b·S·R_b'/(S + R_b'),
 * worst case |r/r₀ − 1| + offset/(V·r₀).
 */
function bruteForce(shelf: Shelf[], length: number, request: { targetRatio: number; maxInputVolts: number; inputResistanceOhms?: number; inputBiasAmps?: number; maxVoltsPerResistor?: number }): Brute {
  const { targetRatio, maxInputVolts, inputResistanceOhms = Infinity, inputBiasAmps = 0, maxVoltsPerResistor = Infinity } = request;
  const scored: [number, string][] = [];
  const picked: number[] = [];
  const limited = shelf.some((item) => item.quantity !== Infinity);
  const uses = new Array<number>(shelf.length).fill(0);
  const visit = (from: number, top: number): void => {
    if (picked.length === length) {
      for (let b = 0; b < shelf.length; b++) {
        if (limited && uses[b] + 1 > shelf[b].quantity) continue;
        const bottom = shelf[b].ohms;
        const loaded = inputResistanceOhms === Infinity ? bottom : (bottom * inputResistanceOhms) / (bottom + inputResistanceOhms);
        const amps = maxInputVolts / (top + loaded);
        if (amps * Math.max(shelf[picked[length - 1]].ohms, loaded) > maxVoltsPerResistor) continue;
        const ratio = loaded / (top + loaded);
        const offset = (inputBiasAmps * top * loaded) / (top + loaded);
        const error = Math.abs(ratio / targetRatio - 1) + offset / (maxInputVolts * targetRatio);
        scored.push([error, limited ? `${picked.map((i) => shelf[i].ohms).join('+')}/${bottom}` : '']);
      }
      return;
    }
    for (let index = from; index < shelf.length; index++) {
      if (limited && uses[index] + 1 > shelf[index].quantity) continue;
      picked.push(index);
      uses[index]++;
      visit(index, top + shelf[index].ohms);
      uses[index]--;
      picked.pop();
    }
  };
  visit(0, 0);
  scored.sort((a, b) => a[0] - b[0]);
  return { errors: scored.map(([error]) => error), keys: scored.map(([, key]) => key) };
}

const seriesShelf = (name: 'E6' | 'E12', minOhms: number, maxOhms: number): Shelf[] =>
  fixtureValuesInRange(name, minOhms, maxOhms).map((ohms) => ({ ohms, quantity: Infinity }));

describe('the mixed-string search against trying every combination', () => {
  it.each([
    { series: 'E6', targetRatio: 0.016, inputResistanceOhms: undefined, inputBiasAmps: undefined, label: 'unloaded' },
    { series: 'E12', targetRatio: 0.0123, inputResistanceOhms: 10e6, inputBiasAmps: undefined, label: 'into 10 MΩ' },
    { series: 'E12', targetRatio: 0.031, inputResistanceOhms: 100e3, inputBiasAmps: 1e-6, label: 'into 100 kΩ with ±1 µA bias' },
  ] as const)('finds the same best errors as every three-resistor $series string with every bottom, $label', ({ series, targetRatio, inputResistanceOhms, inputBiasAmps }) => {
    const request = { maxInputVolts: 462, targetRatio, inputResistanceOhms, inputBiasAmps };
    const brute = bruteForce(seriesShelf(series, 1e3, 1e6), 3, request);
    const found = findDividers({ ...request, series: fixtureSeries(series), limits: { minOhms: 1e3, maxOhms: 1e6 }, minTopCount: 3, maxTopCount: 3, mixedTopStrings: true, maxCandidates: 40 });
    expect(found.notSearched).toEqual([]);
    expect(found.candidates[0].worstCaseErrorFraction).toBeCloseTo(brute.errors[0], 15); // exhaustive enumeration over every multiset and bottom (in this test)
    found.candidates.forEach((candidate, i) => expect(candidate.worstCaseErrorFraction).toBeCloseTo(brute.errors[i], 15)); // same enumeration, the 40 best
  });

  it('finds the same best errors as every four-resistor E6 string under a per-resistor voltage limit', () => {
    const request = { maxInputVolts: 462, targetRatio: 0.004, inputResistanceOhms: 10e6, maxVoltsPerResistor: 150 };
    const brute = bruteForce(seriesShelf('E6', 1e3, 10e6), 4, request);
    const found = findDividers({ ...request, series: fixtureSeries('E6'), limits: { minOhms: 1e3, maxOhms: 10e6, maxVoltsPerResistor: 150 }, minTopCount: 4, maxTopCount: 4, mixedTopStrings: true, maxCandidates: 30 });
    expect(found.candidates).toHaveLength(30);
    found.candidates.forEach((candidate, i) => expect(candidate.worstCaseErrorFraction).toBeCloseTo(brute.errors[i], 15)); // exhaustive enumeration (in this test)
  });

  it('lists exactly the dividers a small shelf allows, quantities included', () => {
    const stock: StockItem[] = [
      { ohms: 10e3, quantity: 5 }, { ohms: 12e3, quantity: 1 }, { ohms: 22e3, quantity: 2 },
      { ohms: 470e3, quantity: 2 }, { ohms: 1e6, quantity: 3 }, { ohms: 1.5e6, quantity: 2 },
    ];
    const request = { maxInputVolts: 462, targetRatio: 0.0045, inputResistanceOhms: 10e6, inputBiasAmps: 1e-9 };
    for (const length of [1, 2, 3, 4, 5]) {
      const brute = bruteForce(stock, length, request);
      const found = findDividers({ ...request, stock, minTopCount: length, maxTopCount: length, mixedTopStrings: true, maxCandidates: 1000 });
      expect(found.candidates).toHaveLength(brute.errors.length); // exhaustive enumeration of the shelf (in this test)
      const keys = found.candidates.map((c) => `${c.topOhms.join('+')}/${c.bottomOhms}`);
      expect(new Set(keys)).toEqual(new Set(brute.keys));
      found.candidates.forEach((candidate, i) => expect(candidate.worstCaseErrorFraction).toBeCloseTo(brute.errors[i], 15));
    }
  });
});

describe('mixed strings the search covers and the ones it names', () => {
  const target = 16.2e3 / (1e6 + 2.49e6 + 301e3 + 16.2e3); // 1 MΩ + 2.49 MΩ + 301 kΩ over 16.2 kΩ, all E96 (IEC 60063)

  it('hits a target that a mixed string of three E96 values meets exactly, and says nothing was left out', () => {
    const found = findDividers({ maxInputVolts: 462, targetRatio: target, series: fixtureSeries('E96'), minTopCount: 3, maxTopCount: 3, mixedTopStrings: true });
    expect(found.candidates[0].ratioErrorFraction).toBeCloseTo(0, 12); // by construction of the target
    expect(found.notSearched).toEqual([]);
  });

  it('says so when only equal values were searched', () => {
    const found = findDividers({ maxInputVolts: 462, targetRatio: target, series: fixtureSeries('E96'), minTopCount: 3, maxTopCount: 3 });
    expect(Math.abs(found.candidates[0].ratioErrorFraction)).toBeGreaterThan(1e-4); // three equal E96 values miss it (by this search)
    expect(found.notSearched).toEqual(['Only top strings of equal values were searched; strings of different values were not asked for.']);
  });

  it('names every string length it could not search and still searches its equal strings', () => {
    const request: FinderRequest = { maxInputVolts: 462, fullScaleVolts: 1.85, series: fixtureSeries('E96'), minTopCount: 2, maxTopCount: 8, mixedTopStrings: true, maxCandidates: 1000 };
    const found = findDividers(request);
    const named = found.notSearched.map((line) => Number(/of (\d) resistors/.exec(line)?.[1]));
    expect(named).toEqual([4, 5, 6, 7, 8]); // pairs of E96 values over 10 Ω–100 MΩ: C(674, 2) ≈ 2.3·10⁵ per half, beyond the step budget at 4
    const eight = findDividers({ ...request, minTopCount: 8 });
    expect(eight.candidates.every((c) => c.topOhms.length === 8 && new Set(c.topOhms).size === 1)).toBe(true);
    expect(eight.candidates.length).toBeGreaterThan(0);
  });
});
