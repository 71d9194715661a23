import type { CompiledChannel } from '../chain/compile.js';
import { BOARD, PER_RESISTOR } from '../chain/layout.js';
import { calibrationLine, readingErrorV } from '../chain/model.js';
import type { MeasurementFunction } from './functional-model.js';
import { gumPropagation, type GumResult } from './gum.js';
import type { UncertainInput } from './inputs.js';
import { worstCase, type WorstCaseResult } from './worst-case.js';
import { DEFAULT_COVERAGE_PROBABILITY } from '../schemas/study-defaults.js';

/**
 * The channel's reading error at grid point g as a plain function of all its inputs (board
 * inputs, then quantisation in counts and the two edge timings), for the GUM and worst case.
 * @param c compiled channel
 * @param g grid point index
 * @returns inputs and the measurement function (error in V)
 * @throws if g is out of range
 * @example const { inputs, model } = channelErrorFunction(compiled, 10)
 */
export function channelErrorFunction(c: CompiledChannel, g: number): { inputs: UncertainInput[]; model: MeasurementFunction } {
  if (!Number.isInteger(g) || g < 0 || g >= c.gridV.length) throw new Error('grid point out of range');
  const inputs = [...c.board, ...c.reading];
  const boardCount = c.board.length;
  const line = new Float64Array(2);
  const model: MeasurementFunction = (x) => {
    const board = x.subarray(0, boardCount);
    if (c.calibrated) calibrationLine(c, board, line);
    return readingErrorV(c, board, g, x[boardCount], x[boardCount + 1], x[boardCount + 2], false, line);
  };
  return { inputs, model };
}

/** GUM result at one evaluation voltage; the budget lists only inputs with non-zero bounds. */
export interface ChannelGumPoint extends GumResult {
  voltageV: number;
}

/**
 * GUM (JCGM 100) law of propagation for the channel's reading error at every grid voltage,
 * with numerical central-difference sensitivity coefficients (see gumPropagation).
 * @param c compiled channel
 * @param coverageProbability p in (0, 1), default 0.95
 * @throws if p is outside (0, 1)
 * @example channelGum(compiled)[10].budget[0].label
 */
export function channelGum(c: CompiledChannel, coverageProbability = DEFAULT_COVERAGE_PROBABILITY): ChannelGumPoint[] {
  return Array.from(c.gridV, (voltageV, g) => {
    const { inputs, model } = channelErrorFunction(c, g);
    const result = gumPropagation(inputs, model, coverageProbability);
    return { ...result, voltageV, budget: result.budget.filter((row) => row.halfWidth > 0) };
  });
}

/** Worst-case result at one evaluation voltage. */
export interface ChannelWorstCasePoint extends WorstCaseResult {
  voltageV: number;
  /**
   * Set by a study when some Monte Carlo trial fell outside the corners found (a normal input
   * drawn beyond ±k·σ, or a search that stopped short): the bounds were widened to that trial.
   */
  widenedToTrials?: boolean;
}

/**
 * Worst-case reading error at every grid voltage: corners of all bounded inputs, quantisation
 * ±1 count, normal inputs at ±k·σ (a Monte Carlo draw of a normal input can pass that).
 * Operating temperature is scanned (ends, midpoint, reference and calibration temperatures) and
 * at each temperature every TCR and tempco takes the sign its effect has there, so a cold extreme
 * is found even when temperature has no first-order effect at the centre of its range.
 * Why the sign corner is right here (worstCase condition a): at a fixed temperature every other
 * input enters through positive factors (1 + δ)(1 + α(ΔT + Pθ) + βV), the Möbius ratio
 * R_b'/(R_top + R_b'), the gain (1 + ε + γΔT), N/f of period capture and the read-back line, each
 * monotone; a direction can reverse only where a quantity changes sign inside the box: the
 * converter input near 0 V (bias current against gain), a nonlinearity bow over 25 % of full
 * scale, or a counter that wraps. Calibrated read-back divides differences of such maps; the
 * tests compare it with every corner.
 * Temperature itself (condition b): at a fixed corner the error is a ratio of low-degree
 * polynomials in ΔT, largest at an end of the range in every chain tested; an interior best is
 * refined by golden-section search.
 * @param c compiled channel
 * @throws never for a compiled channel
 * @example channelWorstCase(compiled)[0].method
 */
export function channelWorstCase(c: CompiledChannel): ChannelWorstCasePoint[] {
  return Array.from(c.gridV, (voltageV, g) => {
    const { inputs, model } = channelErrorFunction(c, g);
    const scanned = c.resistorCount * PER_RESISTOR + BOARD.temperature;
    return { ...worstCase(inputs, model, { scanned, scanValues: [c.referenceC, c.calibrationC] }), voltageV };
  });
}
