import { dividerNominal, nominalFrequencyHz } from '../../../shared/chain/index.js';
import { readingErrorSamples } from '../../../shared/precharge/index.js';
import { histogramOf } from '../../../shared/propagation/index.js';
import {
  combinedDecision, fitPolynomial, guardedAcceptanceRule, guardedDecision, lineUncertainty, referenceShare, type ReferenceAccuracy,
} from '../../../shared/fit/index.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import type { BoardComparison, DesignPopulation, Spread } from '../../../shared/schemas/calibration-views.js';
import type { CalibrationPoint } from '../../entities/CalibrationPoint.js';
import { contentHash } from '../runs/inputs-hash.js';

/** Boards simulated for the design's population; fixed seed, so the spread shown never wobbles. */
const POPULATION_TRIALS = 20_000;
const POPULATION_SEED = 60063;
const COVERAGE = 0.99;

function spreadOf(values: Float64Array): Spread {
  const sorted = Float64Array.from(values).sort();
  const at = (p: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.round(p * (sorted.length - 1))))];
  return { low: at((1 - COVERAGE) / 2), high: at((1 + COVERAGE) / 2), median: at(0.5), histogram: histogramOf(values, 40) };
}

const cache = new Map<string, DesignPopulation>();

/**
 * The design's spread of uncalibrated reading gain and offset errors (V̂ = V·(1 + g) + o) over simulated
 * boards at the session's ambient temperature: what a correctly built board of this revision looks like.
 */
export function designPopulation(channel: ChannelDefinition, ambientC: number): DesignPopulation {
  const atBench: ChannelDefinition = { ...channel, reconstruction: { mode: 'nominal' }, environment: { ...channel.environment, minC: ambientC, maxC: ambientC } };
  const key = contentHash({ atBench, POPULATION_TRIALS, POPULATION_SEED });
  const hit = cache.get(key);
  if (hit) return hit;
  const samples = readingErrorSamples(atBench, { seed: POPULATION_SEED, trials: POPULATION_TRIALS });
  const population = {
    trials: POPULATION_TRIALS,
    ambientC,
    gainError: spreadOf(Float64Array.from(samples.gainErrorFraction)),
    offsetErrorV: spreadOf(Float64Array.from(samples.offsetErrorV)),
  };
  if (cache.size > 200) cache.clear();
  cache.set(key, population);
  return population;
}

/** Coverage factor of the board's own gain and offset uncertainty beside the design interval, and of the guard band. */
const BOARD_K = 2;

/** The decision rule of board versus design, as the session, the overview and the review state it. */
export const BOARD_ACCEPTANCE_RULE = guardedAcceptanceRule(BOARD_K);

/**
 * Where a board's own calibration falls against its design's population. The board's straight-line fit
 * f = b0 + b1·V read with the design's nominal constants gives g = b1/G − 1 and o = (b0 − f0)/G. Their
 * uncertainty combines the fit's standard errors with the reference instrument's share as the line carries it
 * (one bound at each voltage, common to every point: its projection onto the line, reference-share.ts). The
 * decision is guarded acceptance (JCGM 106:2012 §8) with a guard band of the board's expanded uncertainty at
 * k = 2 inside each limit of the design's interval.
 */
export function compareBoard(
  channel: ChannelDefinition, ambientC: number, points: readonly CalibrationPoint[], reference: ReferenceAccuracy,
): BoardComparison {
  const used = points.filter((p) => !p.excluded);
  const volts = used.map((p) => p.appliedV);
  const line = fitPolynomial(volts, used.map((p) => p.frequencyHz), { degree: 1 });
  const ratio = dividerNominal(channel.divider, channel.converter.inputResistanceOhm).ratio;
  const f0 = nominalFrequencyHz(channel.converter, ratio, 0);
  const gainHzPerV = nominalFrequencyHz(channel.converter, ratio, 1) - f0;
  const u = lineUncertainty(line.standardErrors, gainHzPerV, referenceShare(volts, reference, { degree: 1 }));
  const board = {
    gainError: line.coefficients[1] / gainHzPerV - 1,
    offsetErrorV: (line.coefficients[0] - f0) / gainHzPerV,
    gainErrorExpanded: BOARD_K * u.gainFraction,
    offsetErrorExpandedV: BOARD_K * u.offsetV,
    coverageFactor: BOARD_K,
  };
  const population = designPopulation(channel, ambientC);
  const inside = (v: number, s: Spread) => v >= s.low && v <= s.high;
  const gainWithin = inside(board.gainError, population.gainError);
  const offsetWithin = inside(board.offsetErrorV, population.offsetErrorV);
  const gain = guardedDecision(board.gainError, u.gainFraction, BOARD_K, population.gainError.low, population.gainError.high);
  const offset = guardedDecision(board.offsetErrorV, u.offsetV, BOARD_K, population.offsetErrorV.low, population.offsetErrorV.high);
  const overall = combinedDecision([gain, offset]);
  return {
    population, board, gainWithin, offsetWithin, within: gainWithin && offsetWithin, undecided: overall.decision === 'undecided',
    acceptance: { rule: BOARD_ACCEPTANCE_RULE, decision: overall.decision, gain, offset, nonConformanceAtMost: overall.nonConformanceAtMost },
    referenceShare: u.reference,
    likelyCauses: likelyCauses(board, population, gainWithin, offsetWithin),
  };
}

function likelyCauses(board: BoardComparison['board'], population: DesignPopulation, gainWithin: boolean, offsetWithin: boolean): string[] {
  const causes: string[] = [];
  if (!gainWithin) {
    const halfWidth = (population.gainError.high - population.gainError.low) / 2;
    const far = Math.abs(board.gainError - population.gainError.median) > Math.max(5 * halfWidth, 0.01);
    if (far) causes.push('A resistor of the wrong value may be fitted: check every top-string resistor and the bottom resistor against the drawing.');
    causes.push("The converter's gain may be outside its datasheet bounds: compare its own input/output at one point.");
    causes.push("The reference meter may be on the wrong range or setting: check its reading at the highest point.");
  }
  if (!offsetWithin) {
    causes.push("The converter's offset may be outside its bounds, or a leakage path loads the divider: check the reading with the input shorted.");
    causes.push('Wiring: a loose or high-resistance connection, or a ground offset between the reference and the board.');
  }
  return causes;
}
