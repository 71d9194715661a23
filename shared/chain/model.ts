import type { CompiledChannel } from './compile.js';
import { BOARD, PER_RESISTOR } from './layout.js';

/**
 * Frequency the converter emits at point p for one simulated board x (compiled-vector order):
 * R_i = R_i0(1 + δ_i)(1 + α_i(ΔT + P_iθ_i) + β_i V_i), R_in = R_in0(1 + δ_in)(1 + α_inΔT), R_b' = R_b ‖ R_in,
 * V_in = V·R_b'/(R_top + R_b') − I_b·(R_top ‖ R_b'), f_lin = f₀ + δf₀ + ḟ₀ΔT + G(1 + ε_G + γΔT)V_in,
 * f = f_lin + a_NL·f_FS·4x(1 − x) with x = f_lin/f_FS clipped to [0, 1]. Clipped at 0 Hz.
 * @param c compiled channel
 * @param x board inputs (see boardInputs)
 * @param p point index (grid, then the two calibration points)
 * @param deltaK temperature minus the reference temperature, K
 * @returns frequency in Hz (≥ 0)
 * @example converterFrequencyHz(compiled, x, 3, 15)
 */
export function converterFrequencyHz(c: CompiledChannel, x: Float64Array, p: number, deltaK: number): number {
  const n = c.pointCount;
  let topOhm = 0;
  let bottomOhm = 0;
  for (let r = 0; r < c.resistorCount; r++) {
    const i = r * PER_RESISTOR;
    const ohm = c.nominalOhm[r] * (1 + x[i]) * (1 + x[i + 1] * (deltaK + c.selfHeatingK[r * n + p]) + x[i + 2] * c.resistorV[r * n + p]);
    if (r < c.topCount) topOhm += ohm;
    else bottomOhm = ohm;
  }
  const tail = c.resistorCount * PER_RESISTOR;
  const inputOhm = c.inputResistanceOhm * (1 + x[tail + BOARD.inputResistanceTolerance]) * (1 + x[tail + BOARD.inputResistanceTempco] * deltaK);
  const loaded = c.inputResistanceOhm === Infinity ? bottomOhm : (bottomOhm * inputOhm) / (bottomOhm + inputOhm);
  const total = topOhm + loaded;
  const inputV = (c.pointV[p] * loaded) / total - (x[tail + BOARD.biasCurrent] * topOhm * loaded) / total;
  const gain = c.gainHzPerV * (1 + x[tail + BOARD.gainError] + x[tail + BOARD.gainTempco] * deltaK);
  const linearHz = c.offsetHz + x[tail + BOARD.offsetError] + x[tail + BOARD.offsetDrift] * deltaK + gain * inputV;
  const fraction = Math.min(1, Math.max(0, linearHz / c.fullScaleHz));
  const hz = linearHz + x[tail + BOARD.nonlinearity] * c.fullScaleHz * 4 * fraction * (1 - fraction);
  return hz > 0 ? hz : 0;
}

/**
 * What a counter of 2^bits states reads: the count modulo 2^bits, as firmware subtracting two
 * captures (or reading a gated counter) sees it once the count passes 2^bits − 1.
 * @param c compiled channel (its counter modulus)
 * @param counts counts as they would be on an endless counter (≥ 0)
 * @returns counts mod 2^bits
 * @example readCount(compiled, 768_000) // 47 104 on a 16-bit counter
 */
export function readCount(c: CompiledChannel, counts: number): number {
  return counts >= c.counterModulus ? counts % c.counterModulus : counts;
}

/** Noise-free measured frequency: f/(1 + ε_clk), unless the counter wraps. */
function noiseFreeMeasuredHz(c: CompiledChannel, hz: number, clock: number): number {
  if (!(hz > 0)) return 0;
  const counts = c.periodCapture ? (c.periodsAveraged * c.tickHz * clock) / hz : (hz * c.gateS) / clock;
  if (counts < c.counterModulus) return hz / clock;
  const read = readCount(c, counts);
  if (!c.periodCapture) return read / c.gateS;
  return read > 0 ? (c.periodsAveraged * c.tickHz) / read : 0;
}

/**
 * Two-point calibration of one board at the calibration temperature: the line V = a + b·f̂
 * through its noise-free measured frequencies f̂ = f/(1 + ε_clk) at the two calibration points,
 * so gain, offset and clock errors at that temperature are removed. A counter that wraps there
 * gives the wrapped frequency, as the bench would record it.
 * @param c compiled channel (calibrated)
 * @param x board inputs
 * @param line output: line[0] = a (V), line[1] = b (V/Hz)
 * @throws if the two calibration frequencies coincide
 * @example calibrationLine(compiled, x, line)
 */
export function calibrationLine(c: CompiledChannel, x: Float64Array, line: Float64Array): void {
  const tail = c.resistorCount * PER_RESISTOR;
  const deltaK = c.calibrationC - c.referenceC;
  const clock = 1 + x[tail + BOARD.clockError];
  const low = c.pointCount - 2;
  const lowHz = noiseFreeMeasuredHz(c, converterFrequencyHz(c, x, low, deltaK), clock);
  const highHz = noiseFreeMeasuredHz(c, converterFrequencyHz(c, x, low + 1, deltaK), clock);
  if (lowHz === highHz) throw new Error('calibration points give the same frequency');
  line[1] = (c.pointV[low + 1] - c.pointV[low]) / (highHz - lowHz);
  line[0] = c.pointV[low] - line[1] * lowHz;
}

/**
 * Reading error V̂ − V at grid point p for one board and one reading. Period capture counts
 * n = N(f_clk/P)(1 + ε_clk)/f plus edge timing (t_end − t_start)(f_clk/P)(1 + ε_clk) and reads
 * f̂ = N(f_clk/P)/n; a gated count gives n = f·T_gate/(1 + ε_clk) and f̂ = n/T_gate. With
 * `byPhase` the count is ⌊n + q⌋, q ~ U[0, 1) (±1 count, random phase); otherwise n + q (q in
 * counts, for the GUM and worst case). The counter reads the count modulo 2^bits (readCount), so
 * an overflow gives the wrong reading the firmware would. No counts reads as 0 Hz. Uncalibrated V̂ = (f̂ − f₀)/(G·r);
 * calibrated V̂ = (a + b·f̂)(1 + ε_cal) + δ_cal.
 * @param c compiled channel
 * @param x board inputs
 * @param p grid point index
 * @param q quantisation: phase in [0, 1) when byPhase, else count error
 * @param startEdgeS timing error of the first captured edge, s
 * @param endEdgeS timing error of the last captured edge, s
 * @param byPhase true in the Monte Carlo, false for the analytic methods
 * @param line calibration line (a, b) of this board, ignored when not calibrated
 * @returns error in V
 * @example readingErrorV(compiled, x, 10, 0.37, 0, 0, true, line)
 */
export function readingErrorV(
  c: CompiledChannel, x: Float64Array, p: number, q: number, startEdgeS: number, endEdgeS: number, byPhase: boolean, line: Float64Array,
): number {
  const tail = c.resistorCount * PER_RESISTOR;
  const deltaK = x[tail + BOARD.temperature] - c.referenceC;
  const hz = converterFrequencyHz(c, x, p, deltaK);
  const clock = 1 + x[tail + BOARD.clockError];
  let measuredHz = 0;
  if (c.periodCapture) {
    if (hz > 0) {
      const ticks = (c.periodsAveraged / hz + endEdgeS - startEdgeS) * c.tickHz * clock;
      const counts = readCount(c, byPhase ? Math.floor(ticks + q) : ticks + q);
      measuredHz = counts > 0 ? (c.periodsAveraged * c.tickHz) / counts : 0;
    }
  } else {
    const pulses = (hz * c.gateS) / clock;
    const counts = readCount(c, byPhase ? Math.floor(pulses + q) : pulses + q);
    measuredHz = counts / c.gateS;
  }
  const estimateV = c.calibrated
    ? (line[0] + line[1] * measuredHz) * (1 + x[tail + BOARD.calibrationGain]) + x[tail + BOARD.calibrationOffset]
    : (measuredHz - c.offsetHz) / (c.gainHzPerV * c.nominalRatio);
  return estimateV - c.pointV[p];
}
