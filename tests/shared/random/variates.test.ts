import { describe, it, expect } from 'vitest';
import { blockStream, blockStreams, standardUncertaintyOf, VariateSource } from '../../../shared/random/index.js';

function sampleSd(draw: () => number, count: number): { mean: number; sd: number } {
  let sum = 0;
  let squares = 0;
  const values = new Float64Array(count);
  for (let i = 0; i < count; i++) sum += values[i] = draw();
  const mean = sum / count;
  for (let i = 0; i < count; i++) squares += (values[i] - mean) ** 2;
  return { mean, sd: Math.sqrt(squares / (count - 1)) };
}

describe('variate sources', () => {
  const count = 200_000;
  // sampling error of a standard deviation ≈ 1/√(2M) ≈ 0.16 %; tolerance 1 % (> 5σ)

  it('draws a rectangular variate with standard deviation a/√3', () => {
    const source = new VariateSource(blockStream(11, 0));
    const { mean, sd } = sampleSd(() => source.rectangular(-2, 2), count);
    expect(sd).toBeCloseTo(2 / Math.sqrt(3), 2); // GUM (JCGM 100) 4.3.7
    expect(Math.abs(sd / (2 / Math.sqrt(3)) - 1)).toBeLessThan(0.01); // GUM (JCGM 100) 4.3.7
    expect(Math.abs(mean)).toBeLessThan(0.02); // from memory: mean of R(−a, a) is 0
  });

  it('draws a triangular variate with standard deviation a/√6', () => {
    const source = new VariateSource(blockStream(12, 0));
    const { sd } = sampleSd(() => source.triangular(-3, 3), count);
    expect(Math.abs(sd / (3 / Math.sqrt(6)) - 1)).toBeLessThan(0.01); // GUM (JCGM 100) 4.3.9
  });

  it('draws a U-shaped variate with standard deviation a/√2', () => {
    const source = new VariateSource(blockStream(13, 0));
    const { sd } = sampleSd(() => source.arcsine(-1, 1), count);
    expect(Math.abs(sd / (1 / Math.SQRT2) - 1)).toBeLessThan(0.01); // JCGM 101:2008 6.4.6
  });

  it('draws standard normals with unit standard deviation and unit variates scaled by 1/k', () => {
    const source = new VariateSource(blockStream(14, 0));
    expect(Math.abs(sampleSd(() => source.normal(), count).sd - 1)).toBeLessThan(0.01); // from memory: Box–Muller gives N(0, 1)
    expect(Math.abs(sampleSd(() => source.unit(1, 2), count).sd - 0.5)).toBeLessThan(0.005); // GUM (JCGM 100) 4.3.4: a = k·σ
  });

  it('keeps every variate inside its bounds', () => {
    const source = new VariateSource(blockStream(15, 0));
    for (let i = 0; i < 20_000; i++) {
      const u = source.uniform();
      expect(u >= 0 && u < 1).toBe(true);
      const a = source.arcsine(2, 4);
      expect(a >= 2 && a <= 4).toBe(true);
    }
  });
});

describe('standard uncertainty of a bounded input', () => {
  it('converts half-widths by the shape of the distribution', () => {
    expect(standardUncertaintyOf(1, 'rectangular')).toBeCloseTo(1 / Math.sqrt(3), 15); // GUM (JCGM 100) 4.3.7
    expect(standardUncertaintyOf(1, 'triangular')).toBeCloseTo(1 / Math.sqrt(6), 15); // GUM (JCGM 100) 4.3.9
    expect(standardUncertaintyOf(1, 'u-shaped')).toBeCloseTo(1 / Math.SQRT2, 15); // JCGM 101:2008 6.4.6
    expect(standardUncertaintyOf(3, 'normal', 3)).toBeCloseTo(1, 15); // GUM (JCGM 100) 4.3.4
  });

  it('refuses a negative half-width or a zero coverage factor', () => {
    expect(() => standardUncertaintyOf(-1, 'rectangular')).toThrow('half-width must be a finite number ≥ 0');
    expect(() => standardUncertaintyOf(1, 'normal', 0)).toThrow('coverage factor must be > 0');
  });
});

describe('block streams', () => {
  it('gives the same stream for the same seed and block however it is reached', () => {
    const direct = blockStream(99, 3);
    const walked = blockStreams(99, 0);
    for (let b = 0; b < 3; b++) walked.next();
    const third = walked.next();
    for (let i = 0; i < 10; i++) expect(third.next()).toBe(direct.next());
  });

  it('gives different streams for different blocks and seeds', () => {
    expect(blockStream(1, 0).next()).not.toBe(blockStream(1, 1).next());
    expect(blockStream(1, 0).next()).not.toBe(blockStream(2, 0).next());
  });

  it('refuses a seed that is not a 32-bit unsigned integer', () => {
    expect(() => blockStream(-1, 0)).toThrow('seed must be an integer');
    expect(() => blockStream(1.5, 0)).toThrow('seed must be an integer');
    expect(() => blockStream(1, -1)).toThrow('block index must be an integer ≥ 0');
  });
});
