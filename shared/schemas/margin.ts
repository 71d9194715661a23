import { z } from 'zod';
import type { CriterionOutcome } from '../precharge/resolution.js';
import type { Histogram } from '../propagation/histogram.js';
import { formatEng } from '../units/format-engineering.js';
import { MARGIN_TRIAL_DEFAULTS, MAX_MARGIN_TRIALS, MIN_MARGIN_FAULT_TRIALS, MIN_TRIALS } from './study-defaults.js';

const finite = (name: string) => z.number({ error: `${name} must be a number` }).refine(Number.isFinite, { error: `${name} must be finite` });
const positive = (name: string, unit: string) => finite(name).refine((v) => v > 0, { error: `${name} must be > 0 ${unit}`.trim() });
const percent = (name: string) => finite(name).refine((v) => v > 0 && v <= 100, { error: `${name} must be in (0, 100] %` });
const tolerancePct = (name: string) => finite(name).refine((v) => v >= 0 && v < 100, { error: `${name} must be in [0, 100) %` });

/** Where the channels' reading errors come from. */
export const readingErrorSourceSchema = z.discriminatedUnion('mode', [
  /** The chain as designed, read with nominal coefficients. */
  z.strictObject({ mode: z.literal('uncalibrated') }),
  /** The chain after a typical two-point calibration (the channel's own, or at the range ends at the reference temperature). */
  z.strictObject({ mode: z.literal('calibrated') }),
  /** A built board's recorded calibration. */
  z.strictObject({ mode: z.literal('board'), boardId: z.number({ error: 'boardId must be a number' }).int().positive({ error: 'boardId must be positive' }) }),
], { error: 'reading error mode must be uncalibrated, calibrated or board' });
export type ReadingErrorSource = z.infer<typeof readingErrorSourceSchema>;

/** A fault case the plausibility window must catch. */
export const faultCaseSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('open-precharge') }),
  z.strictObject({ kind: z.literal('bypassed-precharge'), residualOhm: finite('residual resistance').refine((v) => v >= 0, { error: 'residual resistance must be ≥ 0 Ω' }).default(0) }),
  z.strictObject({ kind: z.literal('leakage'), resistanceOhm: positive('leakage resistance', 'Ω') }),
  z.strictObject({ kind: z.literal('missing-capacitance'), missingPct: finite('missing capacitance').refine((v) => v > 0 && v < 100, { error: 'missing capacitance must be in (0, 100) %' }) }),
], { error: 'fault kind must be open-precharge, bypassed-precharge, leakage or missing-capacitance' });
export type FaultCase = z.infer<typeof faultCaseSchema>;

export const leakagePathSchema = z.strictObject({
  label: z.string({ error: 'label must be text' }).trim().min(1, { error: 'label is required' }).max(80, { error: 'label must be at most 80 characters' }),
  resistanceOhm: positive('leakage resistance', 'Ω'),
});

/** Inputs of a revision's margin study (SI units; percentages say so in their names). */
export const marginInputsSchema = z.strictObject({
  packMinV: positive('pack minimum', 'V'),
  packMaxV: positive('pack maximum', 'V'),
  /** Close when the link reading reaches this % of the pack reading. */
  closingThresholdPct: percent('closing threshold'),
  /** True link/pack ratio the contactor must not close below, %; give this or maxStepV (or both). */
  requiredRatioPct: percent('required ratio').optional(),
  /** Largest voltage step allowed across the contactor at closure, V. */
  maxStepV: positive('largest voltage step', 'V').optional(),
  prechargeOhm: positive('pre-charge resistance', 'Ω'),
  prechargeTolerancePct: tolerancePct('pre-charge tolerance'),
  linkCapacitanceF: positive('link capacitance', 'F'),
  capacitanceTolerancePct: tolerancePct('capacitance tolerance'),
  /** Further parallel paths on the link side; the link channel's divider is added automatically. */
  leakagePaths: z.array(leakagePathSchema).max(10, { error: 'at most 10 leakage paths' }).default([]),
  packChannelKey: z.string().min(1).max(40).default('pack'),
  linkChannelKey: z.string().min(1).max(40).default('link'),
  updateIntervalS: positive('update interval', 's'),
  consecutiveReadings: z.number({ error: 'consecutive readings must be a number' }).int({ error: 'consecutive readings must be a whole number' })
    .min(1, { error: 'consecutive readings must be ≥ 1' }).max(1000, { error: 'consecutive readings must be ≤ 1000' }),
  timeoutS: positive('timeout', 's'),
  readingErrors: readingErrorSourceSchema.default({ mode: 'uncalibrated' }),
  faults: z.array(faultCaseSchema).max(12, { error: 'at most 12 fault cases' }).default([]),
  /** Margin m widening the healthy spread into the plausibility window, %. */
  plausibilityMarginPct: finite('plausibility margin').refine((v) => v >= 0 && v < 100, { error: 'plausibility margin must be in [0, 100) %' }).default(10),
  /** Largest acceptable probability of closing early, of timing out, and of a false alarm. */
  allowedProbability: finite('allowed probability').refine((v) => v > 0 && v < 1, { error: 'allowed probability must be in (0, 1)' }).default(0.001),
  /**
   * Headroom the isolation barrier must have over each channel's range maximum, %: the review checks the
   * isolator's ratings against V·(1 + m/100). Optional without a default, so stored inputs keep their hash.
   */
  isolationMarginPct: finite('isolation margin').refine((v) => v >= 0 && v <= 200, { error: 'isolation margin must be in [0, 200] %' }).optional(),
}).superRefine((v, ctx) => {
  if (v.packMaxV < v.packMinV) ctx.addIssue({ code: 'custom', path: ['packMaxV'], message: 'pack maximum must be ≥ pack minimum' });
  if (v.requiredRatioPct === undefined && v.maxStepV === undefined) {
    ctx.addIssue({ code: 'custom', path: ['requiredRatioPct'], message: 'give the required ratio or the largest voltage step' });
  }
  if (v.requiredRatioPct !== undefined && v.requiredRatioPct > v.closingThresholdPct) {
    ctx.addIssue({ code: 'custom', path: ['requiredRatioPct'], message: 'required ratio must not exceed the closing threshold' });
  }
  if (v.timeoutS < v.updateIntervalS * v.consecutiveReadings) {
    ctx.addIssue({ code: 'custom', path: ['timeoutS'], message: 'timeout must allow the consecutive readings' });
  }
  if (v.packChannelKey === v.linkChannelKey) ctx.addIssue({ code: 'custom', path: ['linkChannelKey'], message: 'link channel must differ from the pack channel' });
});
export type MarginInputs = z.infer<typeof marginInputsSchema>;
export type MarginInputsBody = z.input<typeof marginInputsSchema>;

export { MAX_MARGIN_TRIALS };

export const marginStudyRequestSchema = z.strictObject({
  trials: z.number({ error: 'trials must be a number' }).int({ error: 'trials must be a whole number' })
    .min(MIN_TRIALS, { error: `trials must be ≥ ${MIN_TRIALS}` }).max(MAX_MARGIN_TRIALS, { error: `trials must be ≤ ${MAX_MARGIN_TRIALS}` }).default(MARGIN_TRIAL_DEFAULTS.trials),
  /** Trials per fault case. */
  faultTrials: z.number({ error: 'faultTrials must be a number' }).int({ error: 'faultTrials must be a whole number' })
    .min(MIN_MARGIN_FAULT_TRIALS, { error: `faultTrials must be ≥ ${MIN_MARGIN_FAULT_TRIALS}` }).max(MAX_MARGIN_TRIALS, { error: `faultTrials must be ≤ ${MAX_MARGIN_TRIALS}` }).default(MARGIN_TRIAL_DEFAULTS.faultTrials),
  /**
   * Simulated boards whose reading errors the study draws from, per channel. Trials share these
   * boards, so a probability can be shown no smaller than about 3 / min(boards, trials).
   */
  readingErrorTrials: z.number({ error: 'readingErrorTrials must be a number' }).int({ error: 'readingErrorTrials must be a whole number' })
    .min(MIN_MARGIN_FAULT_TRIALS, { error: `readingErrorTrials must be ≥ ${MIN_MARGIN_FAULT_TRIALS}` }).max(MAX_MARGIN_TRIALS, { error: `readingErrorTrials must be ≤ ${MAX_MARGIN_TRIALS}` }).default(MARGIN_TRIAL_DEFAULTS.readingErrorTrials),
  seed: z.number({ error: 'seed must be a number' }).int({ error: 'seed must be a whole number' })
    .min(0, { error: 'seed must be ≥ 0' }).max(2 ** 31 - 1, { error: 'seed must be < 2³¹' }).optional(),
});
export type MarginStudyRequest = z.infer<typeof marginStudyRequestSchema>;

/** The words people read for each fault case. */
export function faultCaseLabel(fault: FaultCase): string {
  switch (fault.kind) {
    case 'open-precharge': return 'Open pre-charge path';
    case 'bypassed-precharge': return fault.residualOhm > 0 ? `Bypassed pre-charge resistor (${formatEng(fault.residualOhm, 'Ω')} left)` : 'Bypassed pre-charge resistor';
    case 'leakage': return `Leakage or welded discharge path, ${formatEng(fault.resistanceOhm, 'Ω')}`;
    case 'missing-capacitance': return `${fault.missingPct} % of the link capacitance missing`;
  }
}

// ---- Result of a margin study (what /api/runs/:id returns as `result` for kind 'margin') ----

/** 'not-shown': nothing fails, but some criterion needs more trials or simulated boards to be shown met. */
export type MarginVerdict = 'pass' | 'fail' | 'unable-to-close' | 'not-shown';
export type FaultDetection = 'too-fast' | 'too-slow' | 'not-detected' | 'not-evaluated';

/** One line of the ten-second summary. */
export interface MarginCriterion {
  key: string;
  criterion: string;
  /** True only when the criterion is met (for probabilities: its 95 % upper bound is within the allowance). */
  pass: boolean;
  outcome: CriterionOutcome;
  /**
   * Probabilities only: one-sided 95 % upper confidence bound of the unwanted event (for a fault case,
   * of missing it), allowing for the boards the trials share.
   */
  upperBound?: number;
  value: number | null;
  limit: number | null;
  unit: string;
  /** How value compares with limit: 'max' (value ≤ limit passes), 'min' (value ≥ limit passes) or 'detected'. */
  sense: 'max' | 'min' | 'detected';
  explanation: string;
}

export interface MarginFaultResult {
  key: string;
  label: string;
  fault: FaultCase;
  verdict: FaultDetection;
  tooFastFraction: number | null;
  tooSlowFraction: number | null;
  notDetectedFraction: number | null;
  /** Closure time of the fault's nominal curve with exact readings, s (null: never). */
  nominalCloseS: number | null;
}

/** What the healthy and fault runs can resolve (see shared/precharge/resolution.ts). */
export interface MarginResolution {
  /** Simulated boards (reading-error draws) the trials share, per channel; null when every trial draws afresh. */
  readingErrorDraws: number | null;
  /** Independent samples behind a healthy-run probability: min(trials, boards). */
  independentTrials: number;
  /** Smallest probability the healthy run can show (the 95 % bound after no events). */
  smallestShowable: number;
  faultIndependentTrials: number;
  faultSmallestShowable: number;
  /** Boards and trials each needed to show the allowed probability with no events. */
  neededForAllowed: number;
}

export interface MarginDistribution {
  histogram: Histogram;
  quantiles: { probability: number; value: number }[];
}

export interface MarginStudyResult {
  verdict: MarginVerdict;
  summary: MarginCriterion[];
  trials: number;
  faultTrials: number;
  seed: number;
  /** What the model used, resolved from the inputs (SI). */
  model: {
    leakagePaths: { label: string; resistanceOhm: number }[];
    /** Parallel combination of all link-side leakage paths, Ω (null: none). */
    leakageOhm: number | null;
    nominalSteadyRatio: number;
    nominalTimeConstantS: number;
    /** Closure time of the nominal healthy curve with exact readings, s (null: never). */
    nominalCloseS: number | null;
    closingRatio: number;
    requiredRatio: number | null;
    maxStepV: number | null;
    readingErrors: { mode: ReadingErrorSource['mode']; boardId?: number; description: string;
      channels: { key: string; name: string; gainSigmaFraction: number; offsetSigmaV: number }[] };
  };
  /** How small a probability these trials and boards can show at 95 % confidence. */
  resolution: MarginResolution;
  earlyClosureProbability: number | null;
  stepExceedanceProbability: number | null;
  neverReachedProbability: number;
  closureTimeS: MarginDistribution | null;
  ratioAtClosure: MarginDistribution | null;
  stepAtClosureV: MarginDistribution | null;
  window: { tooFastBelowS: number; tooSlowAboveS: number; marginFraction: number; fromProbabilities: [number, number]; falseAlarmFraction: number } | null;
  faults: MarginFaultResult[];
  charts: {
    ratioOverTime: {
      timeS: number[];
      healthyLowest: number[];
      healthyNominal: number[];
      healthyHighest: number[];
      thresholdRatio: number;
      requiredRatio: number | null;
      window: { tooFastBelowS: number; tooSlowAboveS: number } | null;
      timeoutS: number;
      faults: { key: string; label: string; ratio: number[] }[];
    };
    ratioAtClosureHistogram: { edges: number[]; counts: number[]; requiredRatio: number | null; thresholdRatio: number };
    stepAtClosureHistogram: { edges: number[]; counts: number[]; maxStepV: number | null };
  };
}
