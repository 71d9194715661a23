import { describe, it, expect } from 'vitest';
import { MIN_RANGE_USE_FRACTION, nominalReadouts, rangeUseFraction } from '../../../shared/chain/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel, demoChannelInput } from '../../fixtures/demo-channel.js';

const loadedBottomOhm = (4.99e3 * 10e6) / (4.99e3 + 10e6); // 4.99 kΩ ∥ 10 MΩ converter input, handbook parallel resistance
const ratio = loadedBottomOhm / (4e6 + loadedBottomOhm); // handbook loaded voltage divider

function warningsAt(maxV: number, fullScaleHz = demoChannelInput.converter.fullScaleHz) {
  const channel = deepFreeze(demoChannel({ rangeV: { minV: 0, maxV }, converter: { ...demoChannelInput.converter, fullScaleHz } }));
  const readouts = nominalReadouts(channel);
  return { readouts, codes: readouts.warnings.map((w) => w.code), unused: readouts.warnings.find((w) => w.code === 'converter-range-unused') };
}

describe('converter range use', () => {
  it('is the converter input at the maximum over the full-scale input', () => {
    // converter input r·V over full-scale input (f_FS − f₀)/G, linear converter (in the test)
    expect(rangeUseFraction(6e3, { offsetHz: 1e3, fullScaleHz: 11e3 })).toBeCloseTo(0.5, 15); // (6 − 1)/(11 − 1) kHz, by hand
    expect(rangeUseFraction(12e3, { offsetHz: 0, fullScaleHz: 10e3 })).toBeCloseTo(1.2, 15); // 12/10 kHz, by hand
    expect(rangeUseFraction(5e3, { offsetHz: 1e3, fullScaleHz: 1e3 })).toBeNull(); // no input span: f_FS = f₀
  });

  it('shows the demo channel using most of its converter with no range warning', () => {
    const { readouts, codes } = warningsAt(462);
    // r·Vmax = 0.5753 V of a 0.6 V full-scale input (10 kHz/V, 1 kHz offset, 7 kHz full scale), handbook divider
    expect(readouts.rangeUseFraction).toBeCloseTo((ratio * 462) / 0.6, 12);
    expect(codes).not.toContain('converter-range-unused');
    expect(codes).not.toContain('converter-over-range');
  });

  it('warns that resolution is thrown away below half of full scale, with the share', () => {
    expect(MIN_RANGE_USE_FRACTION).toBe(0.5); // product choice stated in the warning: half the span unused
    const { readouts, unused } = warningsAt(200);
    const share = (ratio * 200) / 0.6; // 0.4151, handbook divider over the full-scale input
    expect(readouts.rangeUseFraction).toBeCloseTo(share, 12);
    expect(unused).toEqual({
      code: 'converter-range-unused', level: 'warning', where: 'converter.fullScaleHz',
      message: `converter input at the range maximum uses only ${Number((100 * share).toPrecision(3))} % of its full scale (below 50 %): resolution is thrown away`,
    });
    expect(unused?.message).toContain('41.5 %'); // 100·0.4151 to three digits, by hand
  });

  it('stays quiet just above the threshold and warns just below it', () => {
    const justAbove = (0.51 * 0.6) / ratio; // Vmax giving 51 % of the full-scale input, handbook divider
    const justBelow = (0.49 * 0.6) / ratio; // 49 %
    expect(warningsAt(justAbove).codes).not.toContain('converter-range-unused');
    expect(warningsAt(justBelow).codes).toContain('converter-range-unused');
  });

  it('reports clipping, not under-use, when the maximum passes full scale', () => {
    const { readouts, codes } = warningsAt(462, 5e3);
    expect(readouts.rangeUseFraction).toBeCloseTo((10e3 * ratio * 462) / 4e3, 12); // G·r·V/(f_FS − f₀), handbook divider
    expect(readouts.rangeUseFraction!).toBeGreaterThan(1);
    expect(codes).toContain('converter-over-range');
    expect(codes).not.toContain('converter-range-unused');
  });
});
