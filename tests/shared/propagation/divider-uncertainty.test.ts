import { describe, it, expect } from 'vitest';
import { channelSchema } from '../../../shared/schemas/chain.js';
import { compileChannel, dividerNominal } from '../../../shared/chain/index.js';
import { channelGum, channelKernel, channelStudy, runMonteCarlo } from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

// An ideal converter and a long gate: only the resistor tolerances matter (quantisation ~10⁻⁶ relative).
const tolerancePct = 0.1;
const channelWith = (topCount: number) => deepFreeze(channelSchema.parse({
  rangeV: { minV: 100, maxV: 400 },
  divider: {
    top: Array.from({ length: topCount }, () => ({ nominalOhm: 396e3 / topCount, tolerancePct })),
    bottom: { nominalOhm: 4e3, tolerancePct },
  },
  converter: { gainHzPerV: 10e3, fullScaleHz: 60e3 },
  capture: { method: 'gated', gateS: 20 },
  environment: { minC: 25, maxC: 25 },
}));

function expectedRelative(topCount: number): { ratio: number; uRel: number } {
  const ratio = dividerNominal(channelWith(topCount).divider).ratio;
  const uEach = tolerancePct / 100 / Math.sqrt(3); // GUM (JCGM 100) 4.3.7
  const uTop = uEach / Math.sqrt(topCount); // equal independent resistors in series
  return { ratio, uRel: (1 - ratio) * Math.sqrt(uTop ** 2 + uEach ** 2) }; // GUM (JCGM 100) 5.1.6 for r = Rb/(Rt + Rb)
}

describe('divider ratio uncertainty', () => {
  for (const topCount of [1, 4]) {
    it(`matches (1 − r)·√(u_rel(R_top)² + u_rel(R_bottom)²) by GUM with ${topCount} top resistor(s)`, () => {
      const { uRel } = expectedRelative(topCount);
      const gum = channelGum(compileChannel(channelWith(topCount), 4));
      for (const point of gum) {
        // quantisation adds ≈ 2·10⁻⁶ relative in quadrature; tolerance 0.5 %
        expect(point.combinedStandardUncertainty / point.voltageV / uRel).toBeCloseTo(1, 2); // GUM (JCGM 100) 5.1.2
      }
    });

    it(`matches (1 − r)·√(u_rel(R_top)² + u_rel(R_bottom)²) by Monte Carlo with ${topCount} top resistor(s)`, () => {
      const { uRel } = expectedRelative(topCount);
      const compiled = compileChannel(channelWith(topCount), 4);
      const mc = runMonteCarlo(channelKernel(compiled), { seed: 5, trials: 40_000 });
      mc.outputs.forEach((out, g) => {
        // sd of a standard deviation at M = 4·10⁴ is ≈ 0.35 %; tolerance 2 % (> 5σ)
        expect(Math.abs(out.standardDeviation / compiled.gridV[g] / uRel - 1)).toBeLessThan(0.02); // JCGM 101:2008 7.6
      });
    });
  }

  it('reports a budget led by the resistor tolerances and validates GUM for this near-linear design', () => {
    const study = channelStudy(channelWith(1), { seed: 9, trials: 50_000, gridPoints: 3 });
    const labels = study.points[2].gum.budget.slice(0, 2).map((row) => row.label).sort();
    expect(labels).toEqual(['R bottom tolerance', 'R1 tolerance']);
    expect(study.points[2].worstCase.method).toBe('exhaustive');
    // worst case of a ratio with two ±0.1 % resistors ≈ (1 − r)·0.2 % of the reading (from memory)
    expect(study.points[2].worstCase.maxAbs / 400).toBeCloseTo((1 - expectedRelative(1).ratio) * 0.002, 5);
  });
});
