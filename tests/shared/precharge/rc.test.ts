import { describe, it, expect } from 'vitest';
import { linkFractionAt, steadyStateFraction, timeConstantS, timeToFractionS } from '../../../shared/precharge/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

const noLeak = deepFreeze({ prechargeOhm: 1.5e3, leakageOhm: Infinity, capacitanceF: 600e-6 });
const leaky = deepFreeze({ prechargeOhm: 1.5e3, leakageOhm: 30e3, capacitanceF: 600e-6 });

describe('link RC charging', () => {
  it('reaches 90 % at ln 10·τ and 95 % at ln 20·τ without leakage', () => {
    const tau = timeConstantS(noLeak);
    expect(tau).toBeCloseTo(0.9, 12); // handbook RC charging: τ = R·C
    expect(timeToFractionS(0.9, noLeak)).toBeCloseTo(Math.log(10) * tau, 12); // handbook RC charging
    expect(timeToFractionS(0.95, noLeak)).toBeCloseTo(Math.log(20) * tau, 12); // handbook RC charging
    expect(linkFractionAt(Math.log(20) * tau, noLeak)).toBeCloseTo(0.95, 12); // handbook RC charging
  });

  it('settles at V·R_l/(R_p + R_l) with leakage, with τ = (R_p ‖ R_l)·C', () => {
    expect(steadyStateFraction(leaky)).toBeCloseTo(30e3 / 31.5e3, 14); // handbook RC charging with a divider
    expect(timeConstantS(leaky)).toBeCloseTo(((1.5e3 * 30e3) / 31.5e3) * 600e-6, 14); // handbook: Thevenin R·C
  });

  it('reaches a threshold with leakage at −τ·ln(1 − p·(R_p + R_l)/R_l), or never', () => {
    const tau = ((1.5e3 * 30e3) / 31.5e3) * 600e-6;
    expect(timeToFractionS(0.9, leaky)).toBeCloseTo(-tau * Math.log(1 - (0.9 * 31.5e3) / 30e3), 12); // handbook RC charging
    expect(linkFractionAt(timeToFractionS(0.9, leaky), leaky)).toBeCloseTo(0.9, 12); // inverse check
    expect(timeToFractionS(0.96, leaky)).toBe(Infinity); // 0.96 > R_l/(R_p + R_l) = 0.952: never reached
  });

  it('refuses non-physical networks by name', () => {
    expect(() => timeConstantS({ ...noLeak, capacitanceF: 0 })).toThrow('link capacitance must be > 0 F');
    expect(() => timeConstantS({ ...noLeak, prechargeOhm: -1 })).toThrow('pre-charge resistance must be ≥ 0 Ω');
    expect(() => steadyStateFraction({ ...noLeak, leakageOhm: 0 })).toThrow('leakage resistance must be > 0 Ω');
    expect(() => timeToFractionS(1.5, noLeak)).toThrow('fraction of pack voltage must be in (0, 1]');
    expect(() => linkFractionAt(-1, noLeak)).toThrow('time must be ≥ 0 s');
  });
});
