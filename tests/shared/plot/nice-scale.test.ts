import { describe, expect, it } from 'vitest';
import { niceScale, niceStep } from '../../../shared/plot/nice-scale.js';

describe('niceStep', () => {
  it('rounds a rough step to 1, 2 or 5 times a power of ten', () => {
    expect(niceStep(1.98)).toBe(2); // Heckbert, Graphics Gems (1990), nice numbers 1-2-5
    expect(niceStep(0.0123)).toBe(0.01); // Heckbert 1990
    expect(niceStep(3.4)).toBe(5); // Heckbert 1990
    expect(niceStep(720)).toBe(1000); // Heckbert 1990
  });

  it('refuses a step that is zero, negative or not finite', () => {
    expect(() => niceStep(0)).toThrow(/step/);
    expect(() => niceStep(-1)).toThrow(/step/);
    expect(() => niceStep(Number.POSITIVE_INFINITY)).toThrow(/step/);
  });
});

describe('niceScale', () => {
  it('puts the study histogram reported with ticks at −8.02 and −6.04 on round ticks', () => {
    expect(niceScale(-8.02, 6.3, 8)).toEqual({ min: -10, max: 8, stepSize: 2 }); // span 14.32 / 8 = 1.79 → step 2 (Heckbert 1990)
  });

  it('tops a count axis of 6,586 at a round number', () => {
    expect(niceScale(0, 6586, 5)).toEqual({ min: 0, max: 7000, stepSize: 1000 }); // 6586 / 5 = 1317 → step 1000 (Heckbert 1990)
  });

  it('covers the data and lands every limit on a whole step', () => {
    const cases: [number, number, number][] = [[0.013, 0.087, 6], [-0.4, 0.42, 5], [308, 462, 7], [1e-7, 3.3e-7, 4]];
    for (const [low, high, ticks] of cases) {
      const s = niceScale(low, high, ticks);
      expect(s.min).toBeLessThanOrEqual(low); // covers the data (definition)
      expect(s.max).toBeGreaterThanOrEqual(high); // covers the data (definition)
      const steps = (s.max - s.min) / s.stepSize;
      expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-9); // whole steps (definition)
    }
  });

  it('widens a single value into an axis', () => {
    expect(niceScale(5, 5, 4)).toEqual({ min: 4, max: 6, stepSize: 1 }); // span taken as |5|, 5 / 4 = 1.25 → step 1, one step either side (in this module)
  });

  it('refuses reversed or non-finite limits and fewer than one tick, and leaves nothing half-done', () => {
    expect(() => niceScale(2, 1)).toThrow(/must not exceed/);
    expect(() => niceScale(Number.NaN, 1)).toThrow(/finite/);
    expect(() => niceScale(0, 1, 0)).toThrow(/ticks/);
  });
});
