/**
 * Physical bounds of every engine input, shared by the zod schema and assertChannel so a form,
 * the API and a direct engine call refuse the same values with the same words. Each is generous
 * for a divider → V/F converter → timer chain yet keeps the model's products far from overflow;
 * what is left (a vanishing frequency, say) is caught where a run ends: a non-finite number fails it.
 */
export interface InputBound {
  /** Lowest allowed value; excluded when `aboveMin`. */
  min: number;
  aboveMin?: boolean;
  max: number;
  unit: string;
  /** The maximum as a person writes it, unit included. */
  maxText: string;
  /** The minimum as a person writes it, when the bare number would read badly. */
  minText?: string;
  /** Say "must be > 0" first for a value ≤ 0, as for any positive quantity, before the finer minimum. */
  positive?: boolean;
}

const b = (min: number, max: number, unit: string, maxText: string, aboveMin = false): InputBound => ({ min, max, unit, maxText, aboveMin });

/** Absolute zero to the hottest a soldered board can be, °C. */
export const TEMPERATURE_BOUND: InputBound = { min: -273.15, max: 500, unit: '°C', maxText: '500 °C', minText: '−273.15 °C' };

export const BOUNDS = {
  /** 1 mΩ to 1 TΩ: above it leakage and humidity decide the value, not the part. */
  resistance: { min: 1e-3, max: 1e12, unit: 'Ω', maxText: '1 TΩ', minText: '1 mΩ', positive: true },
  /** 50 %: beyond it a part is no longer the value it is marked. */
  tolerance: b(0, 50, '%', '50 %'),
  coverageFactor: b(0, 10, '', '10', true),
  /** 1000 ppm/K is twice a poor thick-film part and keeps R(1 + αΔT) > 0 across the 773 K the temperatures allow. */
  tcr: b(0, 1000, 'ppm/K', '1000 ppm/K'),
  /** 100 ppm/V is ten times a poor thick-film part. */
  voltageCoefficient: b(0, 100, 'ppm/V', '100 ppm/V'),
  ratedVoltage: b(0, 1e6, 'V', '1 MV', true),
  ratedPower: b(0, 1e4, 'W', '10 kW', true),
  thermalResistance: b(0, 1e4, 'K/W', '10 000 K/W'),
  /** 100 kV: the top of any divider this product is for. */
  rangeMax: b(0, 1e5, 'V', '100 kV', true),
  rangeMin: b(0, 1e5, 'V', '100 kV'),
  /** 1 mHz/V: below it a single count of a 1 s gate is worth kilovolts. */
  converterGain: { min: 1e-3, max: 1e9, unit: 'Hz/V', maxText: '1 GHz/V', minText: '1 mHz/V', positive: true },
  frequency: b(0, 1e9, 'Hz', '1 GHz'),
  fullScale: { min: 1, max: 1e9, unit: 'Hz', maxText: '1 GHz', positive: true },
  gainError: b(0, 50, '%', '50 %'),
  gainTempco: b(0, 1000, 'ppm/K', '1000 ppm/K'),
  offsetDrift: b(0, 1e6, 'Hz/K', '1 MHz/K'),
  nonlinearity: b(0, 10, '% FS', '10 % FS'),
  /** From a shunt-like 1 mΩ input up to 1 PΩ (electrometer grade). */
  inputResistance: { min: 1e-3, max: 1e15, unit: 'Ω', maxText: '1 PΩ', minText: '1 mΩ', positive: true },
  inputResistanceTolerance: b(0, 50, '%', '50 %'),
  /** As for a resistor's TCR: R_in(1 + αΔT) stays > 0 across the whole temperature range. */
  inputResistanceTempco: b(0, 1000, 'ppm/K', '1000 ppm/K'),
  inputBiasCurrent: b(0, 1e-3, 'A', '1 mA'),
  signalRate: { min: 1, max: 1e11, unit: 'Bd', maxText: '100 GBd', positive: true },
  pulseWidthDistortion: b(0, 1e-3, 's', '1 ms'),
  /** Timers from 1 Hz (a count of whole seconds) to 10 GHz. */
  clock: { min: 1, max: 1e10, unit: 'Hz', maxText: '10 GHz', positive: true },
  /** 10 %: an uncalibrated RC oscillator at its worst. */
  clockTolerance: b(0, 1e5, 'ppm', '100 000 ppm'),
  /** 1 µs: shorter than any gate a timer peripheral opens in practice. */
  gate: { min: 1e-6, max: 1e3, unit: 's', maxText: '1000 s', minText: '1 µs', positive: true },
  calibrationGainUncertainty: b(0, 0.5, '', '0.5'),
  calibrationOffsetUncertainty: b(0, 1e5, 'V', '100 kV'),
  calibrationPoint: b(0, 1e5, 'V', '100 kV'),
} as const satisfies Record<string, InputBound>;

/** Largest prescaler and number of periods averaged (whole numbers ≥ 1). */
export const MAX_PRESCALER = 65_536;
export const MAX_PERIODS_AVERAGED = 1_000_000;

/**
 * The message for a value outside a bound, or null when it lies inside: `tolerance must be ≤ 50 %`.
 * @param value the input (any type: non-numbers are refused)
 * @param name the input as a person calls it
 * @param bound its bound
 * @returns null, or the message naming the input and the limit it broke
 * @throws never
 * @example boundProblem(300, 'tolerance', BOUNDS.tolerance) // 'tolerance must be ≤ 50 %'
 */
export function boundProblem(value: unknown, name: string, bound: InputBound): string | null {
  const unit = bound.unit ? ` ${bound.unit}` : '';
  if (typeof value !== 'number' || Number.isNaN(value)) return `${name} must be a number`;
  if (bound.positive && !(value > 0)) return `${name} must be > 0${unit}`;
  if (bound.aboveMin ? !(value > bound.min) : !(value >= bound.min)) {
    return `${name} must be ${bound.aboveMin ? '>' : '≥'} ${bound.minText ?? `${bound.min}${unit}`}`;
  }
  if (!(value <= bound.max)) return `${name} must be ≤ ${bound.maxText}`;
  return null;
}
