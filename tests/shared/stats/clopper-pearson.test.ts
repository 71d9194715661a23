import { describe, expect, it } from 'vitest';
import { clopperPearsonLower, clopperPearsonUpper, trialsToShow } from '../../../shared/stats/index.js';

/** P(X ≤ x) for X ~ Binomial(n, p), summed term by term in logs (integer x, n). */
function binomialCdf(x: number, n: number, p: number): number {
  let logC = 0;
  let sum = 0;
  for (let i = 0; i <= x; i++) {
    if (i > 0) logC += Math.log((n - i + 1) / i);
    sum += Math.exp(logC + i * Math.log(p) + (n - i) * Math.log1p(-p));
  }
  return sum;
}

describe('Clopper–Pearson bounds', () => {
  it('gives 1 − 0.05^(1/n) after no events, close to the rule of three', () => {
    for (const n of [10, 500, 20_000, 1e6]) {
      expect(clopperPearsonUpper(0, n)).toBeCloseTo(1 - 0.05 ** (1 / n), 15); // exact: (1 − p)^n = 0.05
      expect(Math.abs(clopperPearsonUpper(0, n) * n - 3) / 3).toBeLessThan(n >= 500 ? 0.005 : 0.14); // Hanley & Lippman-Hand 1983, rule of three: ≈ 3/n
    }
    expect(clopperPearsonUpper(0, 10)).toBeCloseTo(0.2589, 4); // from memory: 0 of 10, 95 % one-sided upper 0.2589
  });

  it('matches tabulated exact binomial limits', () => {
    expect(clopperPearsonUpper(1, 10)).toBeCloseTo(0.39416, 5); // from memory: 1 of 10, 95 % one-sided upper 0.394
    expect(clopperPearsonUpper(5, 10, 0.975)).toBeCloseTo(0.81291, 5); // from memory: 5 of 10, 95 % two-sided interval 0.187 to 0.813
    expect(clopperPearsonLower(5, 10, 0.975)).toBeCloseTo(0.18709, 5); // from memory: same interval, lower end
    expect(clopperPearsonLower(10, 10)).toBeCloseTo(0.05 ** 0.1, 14); // exact: p^10 = 0.05
  });

  it('puts exactly 5 % binomial probability at or below the observed count', () => {
    for (const [x, n] of [[1, 20], [3, 100], [3, 1_000_000], [55, 1_000_000], [40, 400]] as const) {
      const upper = clopperPearsonUpper(x, n);
      expect(binomialCdf(x, n, upper)).toBeCloseTo(0.05, 8); // definition of the exact (Clopper–Pearson 1934) upper limit, summed in this test
      const lower = clopperPearsonLower(x, n);
      expect(1 - binomialCdf(x - 1, n, lower)).toBeCloseTo(0.05, 8); // definition of the exact lower limit, summed in this test
    }
  });

  it('is monotone in a fractional event count and ends at 1', () => {
    expect(clopperPearsonUpper(0.5, 100)).toBeGreaterThan(clopperPearsonUpper(0, 100)); // common practice: more events, higher bound
    expect(clopperPearsonUpper(0.5, 100)).toBeLessThan(clopperPearsonUpper(1, 100));
    expect(clopperPearsonUpper(7, 7)).toBe(1); // exact: every trial an event
    expect(clopperPearsonLower(0, 7)).toBe(0);
  });

  it('counts the trials needed to show a probability with no events', () => {
    expect(trialsToShow(0.001)).toBe(2995); // exact: least n with 0.999^n ≤ 0.05 (ln 0.05/ln 0.999 = 2994.2)
    expect(trialsToShow(1e-5)).toBe(299_572); // exact: ln 0.05/ln(1 − 10⁻⁵) = 299 571.8
    for (const p of [0.3, 0.01, 1e-4]) {
      const n = trialsToShow(p);
      expect(clopperPearsonUpper(0, n)).toBeLessThanOrEqual(p); // the defining property, in this test
      expect(clopperPearsonUpper(0, n - 1)).toBeGreaterThan(p);
    }
  });

  it('refuses impossible counts by name', () => {
    expect(() => clopperPearsonUpper(1, 0)).toThrow('trials must be > 0');
    expect(() => clopperPearsonUpper(-1, 10)).toThrow('events must be in [0, trials]');
    expect(() => clopperPearsonUpper(11, 10)).toThrow('events must be in [0, trials]');
    expect(() => clopperPearsonUpper(1, 10, 1)).toThrow('confidence must be in (0, 1)');
    expect(() => trialsToShow(0)).toThrow('probability must be in (0, 1)');
  });
});
