import { worstCase } from '../propagation/worst-case.js';
import type { CompiledChannel } from './compile.js';
import { BOARD, PER_RESISTOR } from './layout.js';
import { converterFrequencyHz } from './model.js';

/** Whether the counter can pass 2^bits − 1 at one evaluation voltage. */
export interface CounterOverflowPoint {
  voltageV: number;
  /** Counts of a nominal board, before any wrap. */
  nominalCounts: number;
  /** Most counts any board and reading within the bounds can give (worst case, +1 count, edges). */
  highestCounts: number;
  /** True when the nominal or the highest count passes 2^bits − 1, so some readings wrap. */
  overflows: boolean;
}

/**
 * Counts at grid point g on an endless counter: N(f_clk/P)(1 + ε_clk)/f + q + edge timing for
 * period capture, f·T_gate/(1 + ε_clk) + q for a gated count. A stopped converter (f = 0) leaves a
 * period capture counting until it wraps, so it counts as 2^bits.
 */
function endlessCounts(c: CompiledChannel, x: Float64Array, g: number): number {
  const tail = c.resistorCount * PER_RESISTOR;
  const board = c.board.length;
  const hz = converterFrequencyHz(c, x, g, x[tail + BOARD.temperature] - c.referenceC);
  const clock = 1 + x[tail + BOARD.clockError];
  if (!c.periodCapture) return (hz * c.gateS) / clock + x[board];
  if (!(hz > 0)) return c.counterModulus;
  return (c.periodsAveraged / hz + x[board + 2] - x[board + 1]) * c.tickHz * clock + x[board];
}

/**
 * Where a channel's counter overflows: per grid voltage, the nominal count and the highest count
 * within the tolerance box (worst case over every bounded board and reading input, see worstCase),
 * flagged when either passes 2^bits − 1. The studies model the wrap (readCount); this says where.
 * @param c compiled channel
 * @throws never for a compiled channel
 * @example counterOverflow(compiled).filter((p) => p.overflows).map((p) => p.voltageV)
 */
export function counterOverflow(c: CompiledChannel): CounterOverflowPoint[] {
  const inputs = [...c.board, ...c.reading];
  const centre = Float64Array.from(inputs, (i) => i.centre);
  return Array.from(c.gridV, (voltageV, g) => {
    const model = (x: Float64Array) => endlessCounts(c, x, g);
    const nominalCounts = model(centre);
    const highestCounts = worstCase(inputs, model).maximum;
    const limit = c.counterModulus - 1;
    return { voltageV, nominalCounts, highestCounts, overflows: nominalCounts > limit || highestCounts > limit };
  });
}
