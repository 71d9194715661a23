import { describe, expect, it } from 'vitest';
import { combinedDecision, guardedAcceptanceRule, guardedDecision } from '../../../shared/fit/index.js';

describe('guardedDecision', () => {
  it('shrinks the tolerance interval by the guard band w = k·u at each side', () => {
    const d = guardedDecision(0.2, 0.1, 2, -1, 1);
    expect(d.guardBand).toBeCloseTo(0.2, 15); // w = U = k·u (JCGM 106:2012 §8.3.2)
    expect([d.acceptanceLow, d.acceptanceHigh]).toEqual([-0.8, 0.8]); // A = [T_L + w, T_U − w] (JCGM 106:2012 §8.3.2)
    expect(d.decision).toBe('accept');
    expect(guardedDecision(0.9, 0.1, 2, -1, 1).decision).toBe('undecided'); // inside T, in the guard band (in this test)
    expect(guardedDecision(-0.85, 0.1, 2, -1, 1).decision).toBe('undecided');
    expect(guardedDecision(1.05, 0.1, 2, -1, 1).decision).toBe('reject'); // outside T (in this test)
    expect(guardedDecision(0, 0.6, 2, -1, 1).decision).toBe('undecided'); // 2w > T_U − T_L: the acceptance interval is empty (in this test)
  });

  it('computes the conformance probability from a normal distribution about the measured value', () => {
    expect(guardedDecision(0, 0.5, 2, -1, 1).conformanceProbability).toBeCloseTo(0.9544997361036416, 12); // 2Φ(2) − 1 (Abramowitz & Stegun Table 26.1)
    expect(guardedDecision(0.9, 0.1, 2, -1, 1).conformanceProbability).toBeCloseTo(0.8413447460685429, 12); // Φ(1) (Abramowitz & Stegun Table 26.1)
    expect(guardedDecision(1, 0.1, 2, -1, 1).conformanceProbability).toBeCloseTo(0.5, 12); // a value on a limit: p_c = 50 % (JCGM 106:2012 §7.2)
    expect(guardedDecision(0.5, 0, 2, -1, 1).conformanceProbability).toBe(1); // no uncertainty: the estimate decides (common practice)
    // an accepted value has p_c ≥ Φ(k) − Φ(−(T_U − T_L)/u + k) ≥ 97.7 % at k = 2 (JCGM 106:2012 §8.3.2 with a normal PDF)
    expect(guardedDecision(0.8, 0.1, 2, -1, 1).conformanceProbability).toBeGreaterThan(0.977);
  });

  it('refuses bad inputs', () => {
    expect(() => guardedDecision(Number.NaN, 0.1, 2, -1, 1)).toThrow(/finite/);
    expect(() => guardedDecision(0, -0.1, 2, -1, 1)).toThrow(/≥ 0/);
    expect(() => guardedDecision(0, 0.1, 0, -1, 1)).toThrow(/coverage factor/);
    expect(() => guardedDecision(0, 0.1, 2, 1, -1)).toThrow(/below/);
  });
});

describe('combinedDecision', () => {
  const accept = guardedDecision(0, 0.1, 2, -1, 1);
  const undecided = guardedDecision(0.9, 0.1, 2, -1, 1);
  const reject = guardedDecision(1.2, 0.1, 2, -1, 1);

  it('accepts only when every quantity is accepted and rejects when any is rejected', () => {
    expect(combinedDecision([accept, accept]).decision).toBe('accept');
    expect(combinedDecision([accept, undecided]).decision).toBe('undecided');
    expect(combinedDecision([undecided, reject]).decision).toBe('reject');
    expect(() => combinedDecision([])).toThrow(/at least one/);
  });

  it('bounds the chance of non-conformance by the sum over quantities', () => {
    const both = combinedDecision([accept, undecided]);
    expect(both.nonConformanceAtMost).toBeCloseTo((1 - accept.conformanceProbability) + (1 - undecided.conformanceProbability), 15); // Bonferroni's inequality (common practice)
  });

  it('states the rule with its coverage factor', () => {
    expect(guardedAcceptanceRule(2)).toMatch(/JCGM 106:2012 §8.*k = 2.*undecided/s);
  });
});
