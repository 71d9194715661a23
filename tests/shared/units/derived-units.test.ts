import { describe, expect, it } from 'vitest';
import { boardInputs, readingInputs } from '../../../shared/chain/inputs.js';
import { budgetRowTexts, divideUnits, formatSensitivityValue, sensitivityUnit } from '../../../shared/units/index.js';
import { demoChannel } from '../../fixtures/demo-channel.js';

/** The unit of ∂(error in V)/∂x for every unit an input of the chain has (JCGM 100:2008 5.1.3: c_i in output unit per input unit). */
const EXPECTED: Record<string, string> = {
  1: 'V', // a fraction: volts per unit fraction, JCGM 100:2008 5.1.3
  '1/K': 'V·K', // V ÷ K⁻¹, dimensional algebra (SI Brochure 9th ed. 2.3.3)
  '1/V': 'V²', // V ÷ V⁻¹, dimensional algebra (SI Brochure 9th ed. 2.3.3)
  'Hz/K': 'V·K/Hz', // V ÷ (Hz/K), dimensional algebra (SI Brochure 9th ed. 2.3.3)
  Hz: 'V/Hz', // dimensional algebra (SI Brochure 9th ed. 2.3.3)
  A: 'V/A', // kept as volts per ampere, not reduced to Ω: the budget reads per input (common practice)
  '°C': 'V/K', // a temperature change of 1 °C is 1 K (SI Brochure 9th ed. 2.3.1)
  V: '1', // volts per volt (SI Brochure 9th ed. 2.3.3, quantities of dimension one)
  count: 'V/count', // dimensional algebra (SI Brochure 9th ed. 2.3.3)
  s: 'V/s', // dimensional algebra (SI Brochure 9th ed. 2.3.3)
};

describe('derived units', () => {
  it('gives the sensitivity unit of every input unit the chain uses', () => {
    const channel = demoChannel();
    const units = new Set([...boardInputs(channel), ...readingInputs(channel)].map((i) => i.unit));
    expect(units.size).toBeGreaterThanOrEqual(8);
    for (const unit of units) expect(sensitivityUnit('V', unit), unit).toBe(EXPECTED[unit]);
    for (const [unit, expected] of Object.entries(EXPECTED)) expect(sensitivityUnit('V', unit), unit).toBe(expected);
  });

  it('divides by products and cancels a temperature against a per-kelvin coefficient', () => {
    expect(divideUnits('V', '°C', '1/K')).toBe('V'); // K·K⁻¹ = 1, dimensional algebra
    expect(divideUnits('V', '°C', 'Hz/K')).toBe('V/Hz'); // K·Hz/K = Hz, dimensional algebra
    expect(divideUnits('V', '°C', '1/V')).toBe('V²/K'); // V ÷ (K/V), dimensional algebra
    expect(divideUnits('V', 'Hz', 's')).toBe('V/(Hz·s)'); // symbols are kept, not reduced (common practice)
    expect(divideUnits('1', 'K')).toBe('K⁻¹'); // nothing above the line: negative power (SI Brochure 9th ed. 5.4.6)
    expect(divideUnits('V', 'V')).toBe('1'); // dimension one (SI Brochure 9th ed. 2.3.3)
    expect(divideUnits('V·K/Hz', 'K/Hz')).toBe('V'); // dimensional algebra
    expect(() => divideUnits('V', '^2')).toThrow(/unit term/);
  });

  it('prints the converter offset-drift sensitivity in mV·K/Hz, not mV/Hz/K', () => {
    expect(formatSensitivityValue(-0.0123, 'Hz/K')).toBe('-12.3 mV·K/Hz'); // V ÷ (Hz/K), dimensional algebra
    expect(formatSensitivityValue(Number.NaN, 'Hz/K')).toBe('–');
  });

  it('gives every budget cell its unit, a second-order row included', () => {
    const first = budgetRowTexts({ label: 'converter offset drift', unit: 'Hz/K', distribution: 'rectangular', halfWidth: 0.5, standardUncertainty: 0.5 / Math.sqrt(3), sensitivity: -1.26e-4, contributionV: 3.64e-5, sharePct: 12.34, order: 1 });
    // u = a/√3 for a rectangular bound a (JCGM 100:2008 4.3.7)
    expect(first).toEqual({ term: 'Converter offset drift', distribution: 'rectangular', bound: '±500 mHz/K', standardUncertainty: '290 mHz/K', sensitivity: '-126 µV·K/Hz', contribution: '36 µV', share: '12 %' });
    const second = budgetRowTexts({ label: 'R1 TCR × operating temperature', unit: '1', distribution: 'product', halfWidth: 2.5e-4, standardUncertainty: 8.3e-5, sensitivity: 400, contributionV: 0.0333, sharePct: 1, order: 2 });
    expect(second.term).toBe('R1 TCR × operating temperature (second order)');
    expect(second.bound).toBe('±250 ppm'); // 2.5e-4 = 250 ppm, by definition of ppm
    expect(second.sensitivity).toBe('400 V');
  });
});
