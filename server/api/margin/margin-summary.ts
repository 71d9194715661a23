import type { Closability } from '../../../shared/precharge/index.js';
import type { MarginCriterion, MarginInputs, MarginStudyResult } from '../../../shared/schemas/margin.js';
import { formatEng } from '../../../shared/units/index.js';

type StudyPart = Omit<MarginStudyResult, 'verdict' | 'summary'>;

const pct = (fraction: number, digits = 1) => `${(fraction * 100).toFixed(digits)} %`;
const prob = (p: number) => (p === 0 ? '0' : p < 1e-3 ? p.toExponential(1) : p.toPrecision(2));

/** "k of N trials", and for none the 95 % upper bound 3/N (rule of three, common practice). */
function occurrences(p: number, trials: number): string {
  const k = Math.round(p * trials);
  return k === 0 ? `0 of ${trials} trials (below ${prob(3 / trials)} at 95 % confidence)` : `${k} of ${trials} trials`;
}

const quantile = (d: StudyPart['ratioAtClosure'], probability: number) => d?.quantiles.find((q) => q.probability === probability)?.value;

function closes(inputs: MarginInputs, r: StudyPart, c: Closability): MarginCriterion {
  const criterion = 'Healthy pre-charge reaches the closing threshold before the timeout';
  const leak = r.model.leakageOhm === null ? 'no leakage' : `${formatEng(r.model.leakageOhm, 'Ω')} of leakage`;
  if (c.reason === 'settles-below-threshold') {
    return {
      key: 'closes', criterion, pass: false, value: c.steadyFraction * 100, limit: inputs.closingThresholdPct, unit: '%', sense: 'min',
      explanation: `Unable to close: with ${leak} against ${formatEng(inputs.prechargeOhm, 'Ω')} of pre-charge the link settles at ${pct(c.steadyFraction, 2)} of the pack, below the ${inputs.closingThresholdPct} % threshold.`,
    };
  }
  const exactS = c.closes ? c.closeS : Infinity;
  if (!c.closes) {
    return {
      key: 'closes', criterion, pass: false, value: null, limit: inputs.timeoutS, unit: 's', sense: 'max',
      explanation: `Unable to close: the nominal curve reaches ${inputs.closingThresholdPct} % only after the ${formatEng(inputs.timeoutS, 's')} timeout.`,
    };
  }
  return {
    key: 'closes', criterion, pass: true, value: exactS, limit: inputs.timeoutS, unit: 's', sense: 'max',
    explanation: `The nominal curve settles at ${pct(c.steadyFraction, 2)} of the pack (${leak}) and closes at ${formatEng(exactS, 's')} with exact readings; timeout ${formatEng(inputs.timeoutS, 's')}.`,
  };
}

/**
 * The ten-second summary: one pass/fail line per criterion with the numbers behind it.
 * Probabilities are fractions (unit ''), compared with the inputs' allowed probability.
 */
export function marginSummary(inputs: MarginInputs, r: StudyPart, closability: Closability): MarginCriterion[] {
  const allowed = inputs.allowedProbability;
  const rows: MarginCriterion[] = [closes(inputs, r, closability)];
  if (r.earlyClosureProbability !== null && r.model.requiredRatio !== null) {
    const low = quantile(r.ratioAtClosure, 0.001);
    rows.push({
      key: 'early-closure', criterion: `Contactor never closes below ${inputs.requiredRatioPct} % true link/pack ratio`,
      pass: r.earlyClosureProbability <= allowed, value: r.earlyClosureProbability, limit: allowed, unit: '', sense: 'max',
      explanation: `Closed below the required ratio in ${occurrences(r.earlyClosureProbability, r.trials)}`
        + (low === undefined ? '.' : `; the true ratio at closure is ≥ ${pct(low, 2)} in 99.9 % of trials.`),
    });
  }
  if (r.stepExceedanceProbability !== null && inputs.maxStepV !== undefined) {
    const high = quantile(r.stepAtClosureV, 0.999);
    rows.push({
      key: 'step-limit', criterion: `Voltage step across the contactor at closure ≤ ${formatEng(inputs.maxStepV, 'V')}`,
      pass: r.stepExceedanceProbability <= allowed, value: r.stepExceedanceProbability, limit: allowed, unit: '', sense: 'max',
      explanation: `Step above the limit in ${occurrences(r.stepExceedanceProbability, r.trials)}`
        + (high === undefined ? '.' : `; the step is ≤ ${formatEng(high, 'V')} in 99.9 % of trials.`),
    });
  }
  rows.push({
    key: 'timeout', criterion: `Threshold reached before the ${formatEng(inputs.timeoutS, 's')} timeout`,
    pass: r.neverReachedProbability <= allowed, value: r.neverReachedProbability, limit: allowed, unit: '', sense: 'max',
    explanation: `Never reached the threshold in ${occurrences(r.neverReachedProbability, r.trials)}`
      + (r.closureTimeS?.quantiles.length ? `; 99.9 % of closures by ${formatEng(quantile(r.closureTimeS, 0.999)!, 's')}.` : '.'),
  });
  if (r.window) {
    rows.push({
      key: 'false-alarm', criterion: 'Healthy pre-charges stay inside the plausibility window',
      pass: r.window.falseAlarmFraction <= allowed, value: r.window.falseAlarmFraction, limit: allowed, unit: '', sense: 'max',
      explanation: `Window ${formatEng(r.window.tooFastBelowS, 's')} to ${formatEng(r.window.tooSlowAboveS, 's')} (healthy 0.1 %–99.9 % closure times widened by ${inputs.plausibilityMarginPct} %); healthy trials flagged: ${prob(r.window.falseAlarmFraction)}.`,
    });
  }
  for (const f of r.faults) {
    const detected = f.verdict === 'too-fast' || f.verdict === 'too-slow';
    const caught = f.notDetectedFraction === null ? null : 1 - f.notDetectedFraction;
    rows.push({
      key: f.key, criterion: `Fault caught: ${f.label}`, pass: detected, value: caught, limit: 1 - allowed, unit: '', sense: 'detected',
      explanation: f.verdict === 'not-evaluated'
        ? 'Not evaluated: without a healthy closure there is no plausibility window to test against.'
        : detected
          ? `Flagged as too ${f.verdict === 'too-fast' ? 'fast' : 'slow'} in ${pct(caught ?? 0)} of ${r.faultTrials} trials.`
          : `Not detected: closes inside the plausibility window in ${pct(f.notDetectedFraction ?? 0)} of ${r.faultTrials} trials.`,
    });
  }
  return rows;
}
