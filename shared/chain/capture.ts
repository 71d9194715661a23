import type { CaptureDefinition, ConverterDefinition } from './types.js';

/**
 * Converter output frequency from the nominal design: f = f₀ + G·r·V.
 * @param converter gain (Hz/V) and offset (Hz)
 * @param ratio divider ratio V_in/V (0 < r < 1)
 * @param voltageV measured voltage in V
 * @throws if the gain is not > 0 Hz/V
 * @example nominalFrequencyHz({ gainHzPerV: 10e3, offsetHz: 0 }, 0.01, 400) // 40 kHz
 */
export function nominalFrequencyHz(converter: Pick<ConverterDefinition, 'gainHzPerV' | 'offsetHz'>, ratio: number, voltageV: number): number {
  if (!(converter.gainHzPerV > 0)) throw new Error('converter gain must be > 0 Hz/V');
  return converter.offsetHz + converter.gainHzPerV * ratio * voltageV;
}

function checkFrequency(frequencyHz: number): void {
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) throw new Error('frequency must be > 0 Hz');
}

/**
 * Counts in one reading before quantisation: period capture N·(f_clk/P)/f timer ticks over N
 * periods; gated count f·T_gate pulses.
 * @param capture capture settings (clock Hz, prescaler, periods, or gate s)
 * @param frequencyHz converter frequency in Hz (> 0)
 * @throws if the frequency is not > 0 Hz
 * @example countsPerReading({ method: 'gated', gateS: 0.1, ... }, 40e3) // 4000
 */
export function countsPerReading(capture: CaptureDefinition, frequencyHz: number): number {
  checkFrequency(frequencyHz);
  if (capture.method === 'period') return (capture.periodsAveraged * capture.clockHz) / (capture.prescaler * frequencyHz);
  return frequencyHz * capture.gateS;
}

/**
 * Frequency change of one count: gated count 1/T_gate; period capture f/n with n the ticks
 * per reading (Δf = f²·P/(N·f_clk)), common practice for reciprocal counters.
 * @param capture capture settings
 * @param frequencyHz converter frequency in Hz (> 0)
 * @throws if the frequency is not > 0 Hz
 * @example frequencyResolutionHz({ method: 'gated', gateS: 0.5, ... }, 1e3) // 2 Hz
 */
export function frequencyResolutionHz(capture: CaptureDefinition, frequencyHz: number): number {
  if (capture.method === 'gated') return 1 / capture.gateS;
  return frequencyHz / countsPerReading(capture, frequencyHz);
}

/**
 * Time one reading takes: N/f for period capture, T_gate for a gated count.
 * @param capture capture settings
 * @param frequencyHz converter frequency in Hz (> 0)
 * @throws if the frequency is not > 0 Hz
 * @example readingTimeS({ method: 'period', periodsAveraged: 16, ... }, 1600) // 0.01 s
 */
export function readingTimeS(capture: CaptureDefinition, frequencyHz: number): number {
  checkFrequency(frequencyHz);
  return capture.method === 'gated' ? capture.gateS : capture.periodsAveraged / frequencyHz;
}
