import { describe, it, expect } from 'vitest';
import { nominalClosability, timeToFractionS, type PrechargeDesign } from '../../../shared/precharge/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

const exact = { kind: 'sigma', gainSigmaFraction: 0, offsetSigmaV: 0 } as const;
// Invented pre-charge: 1.5 kΩ into 600 µF, 4 MΩ of link-side divider.
const design: PrechargeDesign = deepFreeze({
  packMinV: 308, packMaxV: 462, prechargeOhm: 1.5e3, prechargeTolerancePct: 5, linkCapacitanceF: 600e-6, capacitanceTolerancePct: 10,
  leakageOhm: 4e6, closingFraction: 0.95, requiredFraction: 0.9, updateIntervalS: 0.01, consecutiveReadings: 3, timeoutS: 5,
  packReading: exact, linkReading: exact,
});

describe('nominal closability', () => {
  it('closes at the first reading after the crossing plus N − 1 readings', () => {
    const c = nominalClosability(design);
    const crossS = timeToFractionS(0.95, { prechargeOhm: 1.5e3, leakageOhm: 4e6, capacitanceF: 600e-6 });
    expect(c).toMatchObject({ closes: true, reason: null });
    expect(c.steadyFraction).toBeCloseTo(4e6 / (4e6 + 1.5e3), 14); // handbook RC charging: R_l/(R_p + R_l)
    expect(c.closeS).toBeCloseTo((Math.ceil(crossS / 0.01) + 2) * 0.01, 12); // handbook RC charging, 10 ms readings, 3 in a row
  });

  it('is unable to close when leakage holds the link below the threshold', () => {
    const c = nominalClosability({ ...design, leakageOhm: 20e3 });
    expect(c).toMatchObject({ closes: false, reason: 'settles-below-threshold', closeS: Infinity });
    expect(c.steadyFraction).toBeCloseTo(20e3 / 21.5e3, 14); // handbook RC charging: 93.0 % < 95 %
  });

  it('is unable to close when the threshold comes only after the timeout', () => {
    expect(nominalClosability({ ...design, timeoutS: 2 })).toMatchObject({ closes: false, reason: 'after-timeout' }); // 3τ ≈ 2.7 s > 2 s
  });

  it('refuses a non-physical design by name', () => {
    expect(() => nominalClosability({ ...design, linkCapacitanceF: 0 })).toThrow('link capacitance must be > 0 F');
    expect(() => nominalClosability({ ...design, updateIntervalS: -1 })).toThrow('update interval must be > 0 s');
  });
});
