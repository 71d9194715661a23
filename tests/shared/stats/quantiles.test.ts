import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { normalQuantile, studentTCdf, studentTQuantile, studentTUpperTail } from '../../../shared/stats/index.js';

function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const inner of Object.values(value as object)) deepFreeze(inner);
    Object.freeze(value);
  }
  return value;
}

const fixturePath = fileURLToPath(new URL('../../fixtures/quantiles.json', import.meta.url));
const vectors = deepFreeze(JSON.parse(readFileSync(fixturePath, 'utf8')));
const DBL_EPSILON = 2.220446049250313e-16;
const relative = (actual: number, expected: number) => (expected === 0 ? Math.abs(actual) : Math.abs(actual / expected - 1));

describe('studentTQuantile', () => {
  it('matches the 17-digit t quantiles to 1e-12 relative', () => {
    const table = vectors.computed_t_quantiles_17sig.values as Record<string, Record<string, string>>;
    let count = 0;
    for (const [p, byNu] of Object.entries(table)) {
      for (const [nu, t] of Object.entries(byNu)) {
        expect(relative(studentTQuantile(Number(p), Number(nu)), Number(t))).toBeLessThanOrEqual(1e-12); // quantiles.json, 17-digit values (mpmath)
        count++;
      }
    }
    expect(count).toBeGreaterThan(150);
  });

  it('matches the NIST/SEMATECH e-Handbook t table to its 3 decimals', () => {
    const table = vectors.t_table_3dp;
    for (const key of ['p=0.95', 'p=0.975', 'p=0.995']) {
      const p = Number(key.slice(2));
      (table.nu as (number | string)[]).forEach((nu, i) => {
        const t = studentTQuantile(p, nu === 'inf' ? Infinity : Number(nu));
        expect(Math.abs(t - table[key][i])).toBeLessThanOrEqual(0.0005 + 1e-12); // NIST/SEMATECH e-Handbook t table
      });
    }
  });

  it('matches GUM Table G.2 coverage factors to ±0.005', () => {
    for (const entry of vectors.gum_table_G2_entries.k_from_p_nu as { p: number; nu: number | string; k: number }[]) {
      const nu = typeof entry.nu === 'number' ? entry.nu : Infinity;
      expect(Math.abs(studentTQuantile((1 + entry.p) / 2, nu) - entry.k)).toBeLessThanOrEqual(0.005); // GUM (JCGM 100) Table G.2
    }
  });

  it('gives GUM Table G.2 coverage probabilities from coverage factors to ±0.005', () => {
    for (const entry of vectors.gum_table_G2_entries.p_from_k_nu as { k: number; nu: number | string; p: number }[]) {
      const nu = typeof entry.nu === 'number' ? entry.nu : 1e9;
      expect(Math.abs(1 - 2 * studentTUpperTail(entry.k, nu) - entry.p)).toBeLessThanOrEqual(0.005); // GUM (JCGM 100) Table G.2
    }
  });

  it('meets the GNU Scientific Library test vectors within their tolerance', () => {
    for (const v of vectors.gsl_tdist_Pinv.vectors as { P: string; nu: string; t: string; tol: string }[]) {
      const tolerance = Number(v.tol.split('*')[0]) * DBL_EPSILON;
      expect(relative(studentTQuantile(Number(v.P), Number(v.nu)), Number(v.t))).toBeLessThanOrEqual(tolerance); // GSL cdf/test.c vectors
    }
  });

  it('agrees with jstat to jstat’s own accuracy', () => {
    for (const nu of [1, 2, 3, 7.5, 12, 30, 200]) {
      for (const p of [0.6, 0.9, 0.975, 0.999]) {
        expect(relative(studentTQuantile(p, nu), jStat.studentt.inv(p, nu))).toBeLessThan(1e-6); // jstat
      }
    }
  });

  it('matches the closed forms for one and two degrees of freedom', () => {
    for (const p of [0.001, 0.2, 0.7, 0.95, 0.9999]) {
      const cauchy = p < 0.5 ? -1 / Math.tan(Math.PI * p) : 1 / Math.tan(Math.PI * (1 - p)); // Cauchy quantile tan(π(p − ½)), closed form
      expect(relative(studentTQuantile(p, 1), cauchy)).toBeLessThan(1e-13);
      expect(relative(studentTQuantile(p, 2), (2 * p - 1) / Math.sqrt(2 * p * (1 - p)))).toBeLessThan(1e-13); // ν = 2 closed form, from memory
    }
  });

  it('is odd about p = ½ and inverts its own distribution function for non-integer ν', () => {
    for (const nu of [0.7, 2.5, 9.3, 55.5, 1234.5]) {
      for (const p of [1e-10, 0.01, 0.3, 0.5, 0.8, 0.995]) {
        const t = studentTQuantile(p, nu);
        if (p >= 0.01) expect(relative(t, -studentTQuantile(1 - p, nu))).toBeLessThan(1e-12); // symmetry of t
        expect(relative(studentTCdf(t, nu), p)).toBeLessThan(1e-11); // round trip
      }
    }
  });

  it('rejects probabilities outside (0, 1) and non-positive degrees of freedom', () => {
    for (const p of [0, 1, -0.1, 1.5, NaN]) expect(() => studentTQuantile(p, 5)).toThrow('p must be a probability strictly between 0 and 1');
    for (const nu of [0, -3, NaN]) expect(() => studentTQuantile(0.9, nu)).toThrow('degrees of freedom nu must be > 0');
    expect(() => studentTCdf(1, 0)).toThrow('degrees of freedom');
    expect(() => studentTUpperTail(NaN, 3)).toThrow('t must be a number');
  });
});

describe('normalQuantile', () => {
  it('matches the 17-digit normal quantiles to 1e-14 relative', () => {
    for (const [p, z] of Object.entries(vectors.computed_normal_quantiles_17sig.values as Record<string, string>)) {
      expect(relative(normalQuantile(Number(p)), Number(z))).toBeLessThanOrEqual(1e-14); // quantiles.json, 17-digit values (mpmath)
    }
  });

  it('meets the GNU Scientific Library test vectors within their tolerance', () => {
    for (const v of vectors.gsl_ugaussian_Pinv.vectors as { P: string; x: string; tol: string }[]) {
      const [factor, unit] = v.tol.split('*');
      const tolerance = unit === 'DBL_EPSILON' ? Number(factor) * DBL_EPSILON : Number(v.tol);
      expect(relative(normalQuantile(Number(v.P)), Number(v.x))).toBeLessThanOrEqual(tolerance); // GSL cdf/test.c vectors
    }
  });

  it('agrees with jstat', () => {
    for (const p of [1e-12, 0.001, 0.1, 0.5 + 1e-9, 0.9, 0.975]) {
      expect(relative(normalQuantile(p), jStat.normal.inv(p, 0, 1))).toBeLessThan(1e-6); // jstat (less accurate in the far tail)
    }
  });

  it('is the limit of Student t for infinite degrees of freedom', () => {
    expect(studentTQuantile(0.975, Infinity)).toBe(normalQuantile(0.975));
    const z = normalQuantile(0.975);
    expect(relative(studentTQuantile(0.975, 1e12), z + (z ** 3 + z) / 4e12)).toBeLessThan(1e-15); // Abramowitz & Stegun 26.7.5, first term
    expect(studentTQuantile(0.975, 1e12)).toBeCloseTo(1.96, 2); // GUM (JCGM 100) Table G.2, ν = ∞ row
  });

  it('rejects probabilities outside (0, 1)', () => {
    for (const p of [0, 1, -1, 2, NaN]) expect(() => normalQuantile(p)).toThrow('p must be a probability strictly between 0 and 1');
  });
});
