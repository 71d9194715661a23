import type { CaptureDefinition } from '../../../shared/schemas/chain.js';

/**
 * Frequency from raw timer counts with the channel's capture settings: period capture counts timer ticks
 * over N periods, f = N·f_clk/(prescaler·counts); a gated count counts input edges in the gate, f = counts/T_gate.
 */
export function frequencyFromCounts(capture: CaptureDefinition, counts: number): number {
  if (!(counts > 0)) throw new Error('counts must be > 0');
  if (capture.method === 'gated') return counts / capture.gateS;
  return (capture.periodsAveraged * capture.clockHz) / (capture.prescaler * counts);
}
