import { faultCaseLabel, type MarginInputs } from '../schemas/margin.js';
import { formatEng } from '../units/format-engineering.js';
import type { CompareField } from './compare-types.js';

const f = (label: string, unit: string, read: CompareField<MarginInputs>['read']): CompareField<MarginInputs> => ({ label, unit, read });

const READING_ERRORS = { uncalibrated: 'the chain as designed', calibrated: 'after a typical two-point calibration' } as const;

/** Every margin input, named as the margin study form names it. */
export const MARGIN_FIELDS: readonly CompareField<MarginInputs>[] = [
  f('Pack minimum', 'V', (m) => m.packMinV), f('Pack maximum', 'V', (m) => m.packMaxV),
  f('Closing threshold', '%', (m) => m.closingThresholdPct), f('Required true ratio', '%', (m) => m.requiredRatioPct),
  f('Largest voltage step', 'V', (m) => m.maxStepV),
  f('Pack channel', '', (m) => m.packChannelKey), f('Link channel', '', (m) => m.linkChannelKey),
  f('Pre-charge resistance', 'Ω', (m) => m.prechargeOhm), f('Pre-charge tolerance', '%', (m) => m.prechargeTolerancePct),
  f('Link capacitance', 'F', (m) => m.linkCapacitanceF), f('Capacitance tolerance', '%', (m) => m.capacitanceTolerancePct),
  f('Leakage paths', '', (m) => (m.leakagePaths.length ? m.leakagePaths.map((p) => `${p.label} ${formatEng(p.resistanceOhm, 'Ω', 6)}`).join('; ') : 'none')),
  f('Update interval', 's', (m) => m.updateIntervalS), f('Consecutive readings', '', (m) => m.consecutiveReadings), f('Timeout', 's', (m) => m.timeoutS),
  f('Reading errors', '', (m) => (m.readingErrors.mode === 'board' ? `board ${m.readingErrors.boardId}'s calibration` : READING_ERRORS[m.readingErrors.mode])),
  f('Fault cases', '', (m) => (m.faults.length ? m.faults.map(faultCaseLabel).join('; ') : 'none')),
  f('Plausibility margin', '%', (m) => m.plausibilityMarginPct), f('Allowed probability', '', (m) => m.allowedProbability),
  f('Isolation margin', '%', (m) => m.isolationMarginPct),
];
