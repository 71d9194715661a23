import { describe, expect, it } from 'vitest';
import { compileChannel } from '../../../shared/chain/index.js';
import { readingErrorSamples } from '../../../shared/precharge/index.js';
import { channelGum, channelStudy, channelWorstCase } from '../../../shared/propagation/index.js';
import { channelSchema, type ChannelDefinitionInput } from '../../../shared/schemas/chain.js';

const TOP = 990e3;
const BOTTOM = 10e3;
const INPUT = 20e3;
const V = 400;

/** Handbook divider with a loaded bottom: r = R_b‖R_in / (R_top + R_b‖R_in). */
const ratio = (inputOhm: number) => {
  const loaded = (BOTTOM * inputOhm) / (BOTTOM + inputOhm);
  return loaded / (TOP + loaded);
};
/** Reading error of a gated count read with the nominal ratio: e = V·(r/r₀ − 1). */
const errorAt = (inputOhm: number) => V * (ratio(inputOhm) / ratio(INPUT) - 1);

/** Only the converter's input resistance spreads; a 1 s gate at 10 kHz/V keeps quantisation near 15 mV. */
function channel(extra: Partial<NonNullable<ChannelDefinitionInput['converter']>>, environment = { minC: 25, maxC: 25 }) {
  return channelSchema.parse({
    rangeV: { minV: 0, maxV: V },
    divider: { top: [{ nominalOhm: TOP, tolerancePct: 0 }], bottom: { nominalOhm: BOTTOM, tolerancePct: 0 } },
    converter: { gainHzPerV: 10e3, fullScaleHz: 1e6, inputResistanceOhm: INPUT, ...extra },
    capture: { method: 'gated', gateS: 1 },
    environment,
  });
}

describe('the converter input resistance spread', () => {
  it('has a budget row whose sensitivity is the divider formula’s central difference', () => {
    const c = compileChannel(channel({ inputResistanceTolerancePct: 10 }), 3);
    const row = channelGum(c)[2].budget.find((r) => r.key === 'converter.inputResistanceTolerance');
    const u = 0.1 / Math.sqrt(3); // GUM 4.3.7: rectangular ±a has u = a/√3
    expect(row?.label).toBe('converter input resistance tolerance');
    expect(row?.standardUncertainty).toBeCloseTo(u, 15);
    // JCGM 100 5.1.3 as gum.ts takes it: c = [f(x + u) − f(x − u)]/(2u), f from the handbook loaded-divider ratio
    const central = (errorAt(INPUT * (1 + u)) - errorAt(INPUT * (1 - u))) / (2 * u);
    expect(row?.sensitivity).toBeCloseTo(central, 9);
    // handbook derivative: ∂e/∂δ = (V/r₀)·R_top/(R_top + R_b')²·R_b²/(R_b + R_in)²·R_in
    const loaded = (BOTTOM * INPUT) / (BOTTOM + INPUT);
    const derivative = (V / ratio(INPUT)) * (TOP / (TOP + loaded) ** 2) * (BOTTOM ** 2 / (BOTTOM + INPUT) ** 2) * INPUT;
    expect(row!.sensitivity / derivative).toBeCloseTo(1, 2);
  });

  it('reaches the worst case at a corner of the input resistance, plus one count', () => {
    const c = compileChannel(channel({ inputResistanceTolerancePct: 10 }), 3);
    const count = 1 / (1 * 10e3 * ratio(INPUT)); // common practice: one gated count is 1/(T·G·r₀) volts
    const corner = Math.max(Math.abs(errorAt(INPUT * 1.1)), Math.abs(errorAt(INPUT * 0.9)));
    expect(channelWorstCase(c)[2].maxAbs).toBeCloseTo(corner + count, 9); // exhaustive enumeration over all 2^n corners (in this test: δ_in and the count)
  });

  it('spreads the Monte Carlo as the GUM predicts, and reaches the margin study’s board samples', () => {
    const defined = channel({ inputResistanceTolerancePct: 10 });
    const study = channelStudy(defined, { seed: 11, trials: 20_000, gridPoints: 3 });
    const top = study.points[2];
    // JCGM 101:2008 §9.4: for a nearly linear model the Monte Carlo and GUM standard uncertainties agree
    expect(top.monteCarlo.standardDeviation / top.gum.combinedStandardUncertainty).toBeCloseTo(1, 1);
    expect(top.gum.combinedStandardUncertainty).toBeGreaterThan(5); // arithmetic, in the test: ≈ 133 V per unit δ × 0.058
    const boards = readingErrorSamples(defined, { seed: 2, trials: 4000, gridPoints: 3 });
    const gains = Array.from(boards.gainErrorFraction);
    const mean = gains.reduce((a, b) => a + b, 0) / gains.length;
    const sd = Math.sqrt(gains.reduce((a, b) => a + (b - mean) ** 2, 0) / (gains.length - 1));
    // arithmetic, in the test: gain error r/r₀ − 1 is e/V, so its spread is the GUM's at 400 V divided by 400 V
    expect(sd / (top.gum.combinedStandardUncertainty / V)).toBeCloseTo(1, 1);
  });

  it('carries the tempco through the operating temperature', () => {
    const hot = channel({ inputResistanceTempcoPpmPerK: 1000 }, { minC: 85, maxC: 85 });
    const row = channelGum(compileChannel(hot, 3))[2].budget.find((r) => r.key === 'converter.inputResistanceTempco');
    const u = 1e-3 / Math.sqrt(3); // GUM 4.3.7: rectangular ±a has u = a/√3
    // JCGM 100 5.1.3 central difference on the handbook ratio with R_in(1 + αΔT), ΔT = 85 − 25 K
    const central = (errorAt(INPUT * (1 + u * 60)) - errorAt(INPUT * (1 - u * 60))) / (2 * u);
    expect(row?.sensitivity).toBeCloseTo(central, 6);
  });

  it('ignores the spread of an input resistance that is not there', () => {
    const unloaded = channelSchema.parse({ ...channel({}), converter: { gainHzPerV: 10e3, fullScaleHz: 1e6, inputResistanceTolerancePct: 10 } });
    const rows = channelGum(compileChannel(unloaded, 3))[2].budget.map((r) => r.key);
    expect(rows).not.toContain('converter.inputResistanceTolerance');
  });
});
