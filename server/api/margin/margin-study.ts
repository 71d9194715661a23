import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import { faultCaseLabel, type FaultDetection, type MarginInputs, type MarginResolution, type MarginStudyResult } from '../../../shared/schemas/margin.js';
import {
  nominalClosability, ratioEnvelope, readingErrorSamples, simulatePrechargeChunk, summarisePrecharge, finiteSorted, independentTrials, readingErrorDraws,
  linkFractionAt, steadyStateFraction, timeConstantS, timeToFractionS, PRECHARGE_OUTPUT, type PrechargeDesign, type PrechargeStudy, type ReadingErrorModel,
} from '../../../shared/precharge/index.js';
import { blockCountFor, mergeChunks, outputValues, planChunks, type TrialChunk } from '../../../shared/propagation/index.js';
import { channelForMode, faultyNetwork, leakagePathsOf, parallelOhm, prechargeDesignOf, toPrechargeFault } from './margin-model.js';
import { marginSummary } from './margin-summary.js';
import { clopperPearsonUpper, trialsToShow } from '../../../shared/stats/clopper-pearson.js';

/** Everything a margin study needs, as plain data (stored with the run, sent to a worker). */
export interface MarginStudyData {
  inputs: MarginInputs;
  pack: { key: string; definition: ChannelDefinition };
  link: { key: string; definition: ChannelDefinition };
  /** Board mode: the board's recorded errors per channel (plain arrays). */
  board?: { boardId: number; description: string; pack: ReadingErrorModel; link: ReadingErrorModel };
  seed: number;
  trials: number;
  faultTrials: number;
  readingErrorTrials: number;
}

const SIMULATION_CHUNKS = 20;
const ENVELOPE_POINTS = 60;

function spread(model: ReadingErrorModel): { gainSigmaFraction: number; offsetSigmaV: number } {
  if (model.kind === 'sigma') return { gainSigmaFraction: model.gainSigmaFraction, offsetSigmaV: model.offsetSigmaV };
  const sd = (a: ArrayLike<number>) => {
    let mean = 0;
    for (let i = 0; i < a.length; i++) mean += a[i];
    mean /= a.length;
    let sq = 0;
    for (let i = 0; i < a.length; i++) sq += (a[i] - mean) ** 2;
    return a.length > 1 ? Math.sqrt(sq / (a.length - 1)) : 0;
  };
  return { gainSigmaFraction: sd(model.gainErrorFraction), offsetSigmaV: sd(model.offsetErrorV) };
}

function readingModels(data: MarginStudyData): { pack: ReadingErrorModel; link: ReadingErrorModel; description: string } {
  const mode = data.inputs.readingErrors.mode;
  if (mode === 'board') {
    if (!data.board) throw new Error('board reading errors are missing from the study inputs');
    return { pack: data.board.pack, link: data.board.link, description: data.board.description };
  }
  const options = { trials: data.readingErrorTrials };
  return {
    pack: readingErrorSamples(channelForMode(data.pack.definition, mode), { ...options, seed: data.seed }),
    link: readingErrorSamples(channelForMode(data.link.definition, mode), { ...options, seed: data.seed + 1 }),
    description: mode === 'uncalibrated'
      ? `uncalibrated chain: errors of ${data.readingErrorTrials} simulated boards per channel, read with nominal coefficients`
      : `calibrated chain: errors of ${data.readingErrorTrials} simulated boards per channel after a two-point calibration (the channel's own, or at the range ends at the reference temperature)`,
  };
}

/** Closure time of a nominal curve with exact readings, s; null when it never closes before the timeout. */
function exactCloseS(design: PrechargeDesign, network: ReturnType<typeof faultyNetwork>): number | null {
  if (network.prechargeOhm === Infinity) return null;
  const crossS = network.prechargeOhm === 0 ? 0 : timeToFractionS(design.closingFraction, network);
  if (crossS === Infinity) return null;
  const closeS = (Math.max(1, Math.ceil(crossS / design.updateIntervalS)) + design.consecutiveReadings - 1) * design.updateIntervalS;
  return closeS <= design.timeoutS ? closeS : null;
}

function trajectory(timeS: number[], network: ReturnType<typeof faultyNetwork>): number[] {
  if (network.prechargeOhm === Infinity) return timeS.map(() => 0);
  return timeS.map((t) => linkFractionAt(t, network));
}

/**
 * The healthy curves when the nominal design cannot close: a window drawn from the few trials whose
 * reading errors let them close would mislead, so there is none and the faults are not evaluated.
 */
function unableToCloseStudy(design: PrechargeDesign, merged: TrialChunk): Omit<PrechargeStudy, 'faults' | 'window'> {
  const network = faultyNetwork(design, null);
  const empty = { histogram: { edges: [], counts: [] }, quantiles: [] };
  const closeS = outputValues(merged, PRECHARGE_OUTPUT.closeTimeS);
  const ratio = outputValues(merged, PRECHARGE_OUTPUT.ratio);
  let never = 0;
  let early = 0;
  for (let i = 0; i < closeS.length; i++) {
    if (!Number.isFinite(closeS[i])) never++;
    else if (ratio[i] < design.requiredFraction) early++;
  }
  return {
    trials: merged.trials,
    earlyClosureProbability: early / merged.trials,
    neverReachedProbability: never / merged.trials,
    closureTimeS: empty,
    ratioAtClosure: empty,
    stepAtClosureV: empty,
    envelope: ratioEnvelope(
      outputValues(merged, PRECHARGE_OUTPUT.steadyFraction).subarray(0, 2000), outputValues(merged, PRECHARGE_OUTPUT.timeConstantS).subarray(0, 2000),
      { steady: steadyStateFraction(network), tauS: timeConstantS(network) },
      design.timeoutS, ENVELOPE_POINTS,
    ),
  };
}

/** How small a probability the healthy and fault runs can show, given the boards their trials share. */
function resolutionOf(design: PrechargeDesign, trials: number, faultTrials: number, allowed: number): MarginResolution {
  const draws = readingErrorDraws(design);
  const healthy = independentTrials(trials, draws);
  const fault = independentTrials(faultTrials, draws);
  return {
    readingErrorDraws: draws,
    independentTrials: healthy,
    smallestShowable: clopperPearsonUpper(0, healthy),
    faultIndependentTrials: fault,
    faultSmallestShowable: clopperPearsonUpper(0, fault),
    neededForAllowed: trialsToShow(allowed),
  };
}

/**
 * The margin study of one revision: reading errors of both channels, the pre-charge Monte Carlo,
 * plausibility window, fault verdicts, chart data and the pass/fail summary.
 * @param onProgress 0…1 as the work proceeds
 */
export function computeMarginStudy(data: MarginStudyData, onProgress: (fraction: number) => void = () => {}): MarginStudyResult {
  const { inputs } = data;
  onProgress(0);
  const readings = readingModels(data);
  onProgress(0.15);
  const leakagePaths = leakagePathsOf(inputs, data.link.definition);
  const leakageOhm = parallelOhm(leakagePaths);
  const design = prechargeDesignOf(inputs, leakageOhm, readings.pack, readings.link);
  const closability = nominalClosability(design);
  const totalBlocks = blockCountFor(data.trials);
  const chunks = planChunks(totalBlocks, SIMULATION_CHUNKS).map((range, i, all) => {
    const chunk = simulatePrechargeChunk(design, data.seed, data.trials, range.firstBlock, range.blockCount);
    onProgress(0.15 + (0.6 * (i + 1)) / all.length);
    return chunk;
  });
  const faults = inputs.faults.map(toPrechargeFault);
  const merged = mergeChunks(chunks);
  const anyClosed = closability.closes && finiteSorted(outputValues(merged, PRECHARGE_OUTPUT.closeTimeS)).length > 0;
  const study: Omit<PrechargeStudy, 'window' | 'faults'> & Partial<Pick<PrechargeStudy, 'window' | 'faults'>> = anyClosed
    ? summarisePrecharge(design, chunks, {
      seed: data.seed, trials: data.trials, faults, faultTrials: data.faultTrials,
      plausibilityMarginFraction: inputs.plausibilityMarginPct / 100, faultMissFraction: inputs.allowedProbability,
    })
    : unableToCloseStudy(design, merged);
  onProgress(0.95);

  let stepExceedanceProbability: number | null = null;
  if (inputs.maxStepV !== undefined) {
    const steps = outputValues(merged, PRECHARGE_OUTPUT.stepV);
    let over = 0;
    for (let i = 0; i < steps.length; i++) if (Number.isFinite(steps[i]) && steps[i] > inputs.maxStepV) over++;
    stepExceedanceProbability = over / merged.trials;
  }
  const timeS = study.envelope.timeS;
  const faultResults = inputs.faults.map((fault, i) => {
    const outcome = study.faults?.[i];
    return {
      key: `fault-${i + 1}`,
      label: faultCaseLabel(fault),
      fault,
      verdict: (outcome?.verdict ?? 'not-evaluated') as FaultDetection,
      tooFastFraction: outcome?.tooFastFraction ?? null,
      tooSlowFraction: outcome?.tooSlowFraction ?? null,
      notDetectedFraction: outcome?.notDetectedFraction ?? null,
      nominalCloseS: exactCloseS(design, faultyNetwork(design, faults[i])),
    };
  });
  const requiredRatio = inputs.requiredRatioPct !== undefined ? inputs.requiredRatioPct / 100 : null;
  const window = study.window
    ? { tooFastBelowS: study.window.tooFastBelowS, tooSlowAboveS: study.window.tooSlowAboveS, marginFraction: study.window.marginFraction,
      fromProbabilities: study.window.fromProbabilities, falseAlarmFraction: study.window.falseAlarmFraction }
    : null;
  const nominal = faultyNetwork(design, null);
  const result: Omit<MarginStudyResult, 'verdict' | 'summary'> = {
    trials: merged.trials,
    faultTrials: data.faultTrials,
    seed: data.seed,
    model: {
      leakagePaths,
      leakageOhm,
      nominalSteadyRatio: closability.steadyFraction,
      nominalTimeConstantS: timeConstantS(nominal),
      nominalCloseS: closability.closes ? closability.closeS : null,
      closingRatio: design.closingFraction,
      requiredRatio,
      maxStepV: inputs.maxStepV ?? null,
      readingErrors: {
        mode: inputs.readingErrors.mode,
        ...(data.board ? { boardId: data.board.boardId } : {}),
        description: readings.description,
        channels: [
          { key: data.pack.key, name: data.pack.definition.name, ...spread(readings.pack) },
          { key: data.link.key, name: data.link.definition.name, ...spread(readings.link) },
        ],
      },
    },
    resolution: resolutionOf(design, merged.trials, data.faultTrials, inputs.allowedProbability),
    earlyClosureProbability: requiredRatio === null ? null : study.earlyClosureProbability,
    stepExceedanceProbability,
    neverReachedProbability: study.neverReachedProbability,
    closureTimeS: anyClosed ? study.closureTimeS : null,
    ratioAtClosure: anyClosed ? study.ratioAtClosure : null,
    stepAtClosureV: anyClosed ? study.stepAtClosureV : null,
    window,
    faults: faultResults,
    charts: {
      ratioOverTime: {
        timeS,
        healthyLowest: study.envelope.lowest,
        healthyNominal: study.envelope.nominal,
        healthyHighest: study.envelope.highest,
        thresholdRatio: design.closingFraction,
        requiredRatio,
        window: window && { tooFastBelowS: window.tooFastBelowS, tooSlowAboveS: window.tooSlowAboveS },
        timeoutS: inputs.timeoutS,
        faults: faultResults.map((f, i) => ({ key: f.key, label: f.label, ratio: trajectory(timeS, faultyNetwork(design, faults[i])) })),
      },
      ratioAtClosureHistogram: { ...study.ratioAtClosure.histogram, requiredRatio, thresholdRatio: design.closingFraction },
      stepAtClosureHistogram: { ...study.stepAtClosureV.histogram, maxStepV: inputs.maxStepV ?? null },
    },
  };
  const summary = marginSummary(inputs, result, closability);
  const verdict = !summary.find((c) => c.key === 'closes')?.pass ? 'unable-to-close'
    : summary.some((c) => c.outcome === 'not-met') ? 'fail'
      : summary.some((c) => c.outcome === 'not-shown') ? 'not-shown' : 'pass';
  onProgress(1);
  return { verdict, summary, ...result };
}
