import { describe, expect, it } from 'vitest';
import { effectiveDegreesOfFreedom } from '../../../shared/stats/index.js';

// JCGM 100:2008 (GUM) G.4.1, eq. (G.2b): ν_eff = u_c⁴ / Σ u_i⁴/ν_i, u_c² = Σ u_i²; G.4.3: Type B bounds
// taken as exactly known have ν_i = ∞.
describe('effectiveDegreesOfFreedom', () => {
  it('returns a lone component\'s own degrees of freedom', () => {
    expect(effectiveDegreesOfFreedom([{ standardUncertainty: 3.7, degreesOfFreedom: 9 }])).toBeCloseTo(9, 12);
  });

  it('gives n·ν for n equal components of ν each (eq. G.2b with u_i = u: (n u²)² / (n u⁴/ν))', () => {
    const same = Array.from({ length: 4 }, () => ({ standardUncertainty: 0.2, degreesOfFreedom: 6 }));
    expect(effectiveDegreesOfFreedom(same)).toBeCloseTo(24, 10);
  });

  it('lets exactly known Type B components raise ν_eff but not enter the denominator (G.4.3)', () => {
    // u_A = 1 with ν = 5, u_B = 1 with ν = ∞: u_c⁴ = 4, so ν_eff = 4 / (1/5) = 20 (eq. G.2b worked by hand).
    expect(effectiveDegreesOfFreedom([
      { standardUncertainty: 1, degreesOfFreedom: 5 },
      { standardUncertainty: 1, degreesOfFreedom: Infinity },
    ])).toBeCloseTo(20, 12);
    expect(effectiveDegreesOfFreedom([{ standardUncertainty: 2, degreesOfFreedom: Infinity }])).toBe(Infinity);
  });

  it('matches eq. G.2b evaluated term by term for unequal components', () => {
    const parts = [
      { standardUncertainty: 25, degreesOfFreedom: 18 },
      { standardUncertainty: 9.7, degreesOfFreedom: 25.6 },
      { standardUncertainty: 2.9, degreesOfFreedom: 50 },
      { standardUncertainty: 16.6, degreesOfFreedom: 2 },
    ];
    // Σu² = 625 + 94.09 + 8.41 + 275.56 = 1003.06; Σu⁴/ν = 21701.39 + 345.82 + 1.41 + 37966.66 = 60015.28
    expect(effectiveDegreesOfFreedom(parts)).toBeCloseTo(1003.06 ** 2 / 60015.28, 2);
  });

  it('refuses an empty list, a negative uncertainty and ν ≤ 0', () => {
    expect(() => effectiveDegreesOfFreedom([])).toThrow(/at least one/);
    expect(() => effectiveDegreesOfFreedom([{ standardUncertainty: -1, degreesOfFreedom: 3 }])).toThrow(/≥ 0/);
    expect(() => effectiveDegreesOfFreedom([{ standardUncertainty: 1, degreesOfFreedom: 0 }])).toThrow(/> 0/);
  });
});
