import type { PrechargeDesign, ReadingErrorModel } from './types.js';

function check(ok: boolean, message: string): void {
  if (!ok) throw new Error(message);
}

function checkReading(model: ReadingErrorModel, name: string): void {
  if (model.kind === 'sigma') {
    check(model.gainSigmaFraction >= 0 && Number.isFinite(model.gainSigmaFraction), `${name} gain sigma must be ≥ 0`);
    check(model.offsetSigmaV >= 0 && Number.isFinite(model.offsetSigmaV), `${name} offset sigma must be ≥ 0 V`);
  } else if (model.kind === 'samples') {
    check(model.gainErrorFraction.length > 0, `${name} error samples must not be empty`);
    check(model.gainErrorFraction.length === model.offsetErrorV.length, `${name} gain and offset samples must pair up`);
  } else throw new Error(`${name} error model must be sigma or samples`);
}

/**
 * Checks a pre-charge design so the study never produces NaN.
 * @param design the design (SI units)
 * @throws Error naming the first bad input, e.g. `link capacitance must be > 0 F`
 * @example assertPrechargeDesign(design)
 */
export function assertPrechargeDesign(design: PrechargeDesign): void {
  const d = design;
  check(d.packMinV > 0 && Number.isFinite(d.packMinV), 'pack minimum must be > 0 V');
  check(d.packMaxV >= d.packMinV && Number.isFinite(d.packMaxV), 'pack voltage range reversed');
  check(d.prechargeOhm > 0 && Number.isFinite(d.prechargeOhm), 'pre-charge resistance must be > 0 Ω');
  check(d.prechargeTolerancePct >= 0 && d.prechargeTolerancePct < 100, 'pre-charge tolerance must be in [0, 100) %');
  check(d.linkCapacitanceF > 0 && Number.isFinite(d.linkCapacitanceF), 'link capacitance must be > 0 F');
  check(d.capacitanceTolerancePct >= 0 && d.capacitanceTolerancePct < 100, 'capacitance tolerance must be in [0, 100) %');
  check(d.leakageOhm === undefined || d.leakageOhm > 0, 'leakage resistance must be > 0 Ω');
  check(d.closingFraction > 0 && d.closingFraction <= 1, 'closing fraction must be in (0, 1]');
  check(d.requiredFraction > 0 && d.requiredFraction <= 1, 'required fraction must be in (0, 1]');
  check(d.updateIntervalS > 0 && Number.isFinite(d.updateIntervalS), 'update interval must be > 0 s');
  check(Number.isInteger(d.consecutiveReadings) && d.consecutiveReadings >= 1, 'consecutive readings must be a whole number ≥ 1');
  check(d.timeoutS > 0 && Number.isFinite(d.timeoutS), 'timeout must be > 0 s');
  checkReading(d.packReading, 'pack reading');
  checkReading(d.linkReading, 'link reading');
}
