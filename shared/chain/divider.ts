import type { DividerDefinition } from './types.js';

/** Nominal divider quantities (at the reference temperature, no tolerance). */
export interface DividerNominal {
  topOhm: number;
  bottomOhm: number;
  /** Bottom resistor in parallel with the converter's input resistance, if any. */
  loadedBottomOhm: number;
  /** V_in / V = R_b' / (R_top + R_b'). */
  ratio: number;
  /** Thevenin source resistance seen by the converter, R_top ‖ R_b'. */
  theveninOhm: number;
  /** Current through the top string per volt applied, A/V. */
  bleedAPerV: number;
}

/**
 * Nominal divider: ratio r = R_b'/(R_top + R_b') with R_b' = R_b ‖ R_in, Thevenin resistance
 * R_top ‖ R_b' and bleed current per volt 1/(R_top + R_b') (handbook voltage divider).
 * @param divider top string and bottom resistor (Ω)
 * @param inputResistanceOhm converter input resistance in Ω (omit for an unloaded divider)
 * @throws if a resistance is not > 0 Ω
 * @example dividerNominal({ top: [{ nominalOhm: 990e3 }], bottom: { nominalOhm: 10e3 } }).ratio // 0.01
 */
export function dividerNominal(
  divider: Pick<DividerDefinition, 'top' | 'bottom'>,
  inputResistanceOhm?: number,
): DividerNominal {
  if (divider.top.length === 0) throw new Error('top string must have at least 1 resistor');
  const topOhm = divider.top.reduce((sum, r, i) => {
    if (!(r.nominalOhm > 0)) throw new Error(`top resistor ${i + 1} must be > 0 Ω`);
    return sum + r.nominalOhm;
  }, 0);
  const bottomOhm = divider.bottom.nominalOhm;
  if (!(bottomOhm > 0)) throw new Error('bottom resistor must be > 0 Ω');
  if (inputResistanceOhm !== undefined && !(inputResistanceOhm > 0)) throw new Error('converter input resistance must be > 0 Ω');
  const loadedBottomOhm = inputResistanceOhm === undefined ? bottomOhm : (bottomOhm * inputResistanceOhm) / (bottomOhm + inputResistanceOhm);
  const totalOhm = topOhm + loadedBottomOhm;
  return {
    topOhm,
    bottomOhm,
    loadedBottomOhm,
    ratio: loadedBottomOhm / totalOhm,
    theveninOhm: (topOhm * loadedBottomOhm) / totalOhm,
    bleedAPerV: 1 / totalOhm,
  };
}

/** Voltage across and power in one resistor. */
export interface ResistorStress {
  where: string;
  voltageV: number;
  powerW: number;
}

/**
 * Voltage and power of every divider resistor with `voltageV` applied (nominal values):
 * I = V/(R_top + R_b'), V_i = I·R_i (bottom: I·R_b'), P_i = V_i²/R_i. Top resistors first.
 * @param divider top string and bottom resistor (Ω)
 * @param voltageV applied voltage in V (≥ 0)
 * @param inputResistanceOhm converter input resistance in Ω, if any
 * @throws if a resistance is not > 0 Ω or the voltage is negative
 * @example resistorStresses(divider, 462)[0].powerW
 */
export function resistorStresses(
  divider: Pick<DividerDefinition, 'top' | 'bottom'>,
  voltageV: number,
  inputResistanceOhm?: number,
): ResistorStress[] {
  if (!(voltageV >= 0) || !Number.isFinite(voltageV)) throw new Error('applied voltage must be ≥ 0 V');
  const nominal = dividerNominal(divider, inputResistanceOhm);
  const currentA = voltageV * nominal.bleedAPerV;
  const stresses = divider.top.map((r, i) => ({
    where: `divider.top[${i}]`,
    voltageV: currentA * r.nominalOhm,
    powerW: currentA * currentA * r.nominalOhm,
  }));
  const bottomV = currentA * nominal.loadedBottomOhm;
  stresses.push({ where: 'divider.bottom', voltageV: bottomV, powerW: (bottomV * bottomV) / nominal.bottomOhm });
  return stresses;
}
