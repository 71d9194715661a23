import { checkProbability, type Closability } from '../../../shared/precharge/index.js';
import type { MarginCriterion, MarginInputs, MarginStudyResult } from '../../../shared/schemas/margin.js';
import { formatEng } from '../../../shared/units/index.js';
import { countSentence, drawsWord, probabilityRow } from './margin-probability-row.js';

type StudyPart = Omit<MarginStudyResult, 'verdict' | 'summary'>;

const pct = (fraction: number, digits = 1) => `${(fraction * 100).toFixed(digits)} %`;

const quantile = (d: StudyPart['ratioAtClosure'], probability: number) => d?.quantiles.find((q) => q.probability === probability)?.value;

function closes(inputs: MarginInputs, r: StudyPart, c: Closability): MarginCriterion {
  const criterion = 'Healthy pre-charge reaches the closing threshold before the timeout';
  const leak = r.model.leakageOhm === null ? 'no leakage' : `${formatEng(r.model.leakageOhm, 'Ω')} of leakage`;
  if (c.reason === 'settles-below-threshold') {
    return {
      key: 'closes', criterion, pass: false, outcome: 'not-met', value: c.steadyFraction * 100, limit: inputs.closingThresholdPct, unit: '%', sense: 'min',
      explanation: `Unable to close: with ${leak} against ${formatEng(inputs.prechargeOhm, 'Ω')} of pre-charge the link settles at ${pct(c.steadyFraction, 2)} of the pack, below the ${inputs.closingThresholdPct} % threshold.`,
    };
  }
  const exactS = c.closes ? c.closeS : Infinity;
  if (!c.closes) {
    return {
      key: 'closes', criterion, pass: false, outcome: 'not-met', value: null, limit: inputs.timeoutS, unit: 's', sense: 'max',
      explanation: `Unable to close: the nominal curve reaches ${inputs.closingThresholdPct} % only after the ${formatEng(inputs.timeoutS, 's')} timeout.`,
    };
  }
  return {
    key: 'closes', criterion, pass: true, outcome: 'met', value: exactS, limit: inputs.timeoutS, unit: 's', sense: 'max',
    explanation: `The nominal curve settles at ${pct(c.steadyFraction, 2)} of the pack (${leak}) and closes at ${formatEng(exactS, 's')} with exact readings; timeout ${formatEng(inputs.timeoutS, 's')}.`,
  };
}

/**
 * The ten-second summary: one line per criterion with the numbers behind it. Probabilities are
 * fractions (unit ''), met only when their 95 % upper bound is within the allowed probability;
 * a bound the trials or shared boards cannot bring that low leaves the criterion not shown.
 */
export function marginSummary(inputs: MarginInputs, r: StudyPart, closability: Closability): MarginCriterion[] {
  const allowed = inputs.allowedProbability;
  const drawCount = r.resolution.readingErrorDraws;
  const draws = drawsWord(r.model.readingErrors.mode);
  const rows: MarginCriterion[] = [closes(inputs, r, closability)];
  if (r.earlyClosureProbability !== null && r.model.requiredRatio !== null) {
    const low = quantile(r.ratioAtClosure, 0.001);
    rows.push(probabilityRow(
      { key: 'early-closure', criterion: `Contactor never closes below ${inputs.requiredRatioPct} % true link/pack ratio` },
      r.earlyClosureProbability, r.trials, drawCount, allowed, 'Closed below the required ratio', draws,
      low === undefined ? '' : ` The true ratio at closure is ≥ ${pct(low, 2)} in 99.9 % of trials.`,
    ));
  }
  if (r.stepExceedanceProbability !== null && inputs.maxStepV !== undefined) {
    const high = quantile(r.stepAtClosureV, 0.999);
    rows.push(probabilityRow(
      { key: 'step-limit', criterion: `Voltage step across the contactor at closure ≤ ${formatEng(inputs.maxStepV, 'V')}` },
      r.stepExceedanceProbability, r.trials, drawCount, allowed, 'Step above the limit', draws,
      high === undefined ? '' : ` The step is ≤ ${formatEng(high, 'V')} in 99.9 % of trials.`,
    ));
  }
  rows.push(probabilityRow(
    { key: 'timeout', criterion: `Threshold reached before the ${formatEng(inputs.timeoutS, 's')} timeout` },
    r.neverReachedProbability, r.trials, drawCount, allowed, 'Never reached the threshold', draws,
    r.closureTimeS?.quantiles.length ? ` 99.9 % of closures by ${formatEng(quantile(r.closureTimeS, 0.999)!, 's')}.` : '',
  ));
  if (r.window) {
    rows.push(probabilityRow(
      { key: 'false-alarm', criterion: 'Healthy pre-charges stay inside the plausibility window' },
      r.window.falseAlarmFraction, r.trials, drawCount, allowed, 'Healthy trials flagged', draws,
      ` Window ${formatEng(r.window.tooFastBelowS, 's')} to ${formatEng(r.window.tooSlowAboveS, 's')} (healthy 0.1 %–99.9 % closure times widened by ${inputs.plausibilityMarginPct} %).`,
    ));
  }
  for (const f of r.faults) rows.push(faultRow(f, r, allowed, drawCount, draws));
  return rows;
}

/** A fault is caught when it is flagged in more than 1 − allowed of its trials, shown with 95 % confidence. */
function faultRow(f: StudyPart['faults'][number], r: StudyPart, allowed: number, drawCount: number | null, draws: string): MarginCriterion {
  const base = { key: f.key, criterion: `Fault caught: ${f.label}`, limit: 1 - allowed, unit: '', sense: 'detected' as const };
  if (f.verdict === 'not-evaluated' || f.notDetectedFraction === null) {
    return { ...base, pass: false, outcome: 'not-met', value: null, explanation: 'Not evaluated: without a healthy closure there is no plausibility window to test against.' };
  }
  const miss = checkProbability(Math.round(f.notDetectedFraction * r.faultTrials), r.faultTrials, drawCount, allowed);
  const detected = f.verdict === 'too-fast' || f.verdict === 'too-slow';
  const outcome = detected ? miss.outcome : 'not-met';
  const flagged = detected ? `Flagged as too ${f.verdict === 'too-fast' ? 'fast' : 'slow'} in ${pct(1 - f.notDetectedFraction)} of ${r.faultTrials} trials. ` : '';
  const missed = detected ? countSentence('Missed', miss, allowed, draws) : `Not detected: closes inside the plausibility window in ${pct(f.notDetectedFraction)} of ${r.faultTrials} trials.`;
  return { ...base, pass: outcome === 'met', outcome, upperBound: miss.upperBound, value: 1 - f.notDetectedFraction, explanation: flagged + missed };
}
