import type { ChainWarning, ChannelDefinition } from './types.js';

/** The warning codes of the isolation-rating check, so a caller can swap them for ones at another margin. */
export const ISOLATION_WARNING_CODES: ReadonlySet<ChainWarning['code']> = new Set(['isolation-rating-exceeded', 'isolation-distance-short', 'isolation-not-checked']);

const volts = (v: number): string => `${Number(v.toPrecision(6))} V`;
const mm = (v: number): string => `${Number(v.toPrecision(6))} mm`;

/**
 * The isolation-rating check of one channel: the range maximum raised by a margin, V·(1 + m/100), against
 * the isolator's rated working voltage and rated insulation test voltage; the rated test voltage against the
 * required one; the layout's creepage and clearance against the required distances. The required values are
 * the designer's, from the standard or rules named in `isolationRule`; nothing here knows any standard.
 * A check that cannot be made (a rating or distance not entered) is an 'info' `isolation-not-checked`.
 * @param channel validated channel; no isolator gives no warnings
 * @param marginPct margin over the range maximum, % (≥ 0), set with the margin inputs
 * @throws Error when marginPct is negative or not finite
 * @example isolationWarnings(channel, 20).map((w) => w.message)
 */
export function isolationWarnings(channel: ChannelDefinition, marginPct = 0): ChainWarning[] {
  if (!(Number.isFinite(marginPct) && marginPct >= 0)) throw new Error('isolation margin must be ≥ 0 %');
  const iso = channel.isolator;
  if (!iso) return [];
  const warnings: ChainWarning[] = [];
  const maxV = channel.rangeV.maxV;
  const neededV = maxV * (1 + marginPct / 100);
  const needed = marginPct > 0 ? `the range maximum ${volts(maxV)} with the ${marginPct} % isolation margin, ${volts(neededV)},` : `the range maximum ${volts(maxV)}`;
  const rule = iso.isolationRule ? ` (${iso.isolationRule})` : '';
  const exceeded = (where: string, message: string) => warnings.push({ code: 'isolation-rating-exceeded', level: 'warning', where, message });
  const short = (where: string, message: string) => warnings.push({ code: 'isolation-distance-short', level: 'warning', where, message });
  const unchecked = (where: string, message: string) => warnings.push({ code: 'isolation-not-checked', level: 'info', where, message });

  if (iso.ratedWorkingVoltageV === undefined) unchecked('isolator.ratedWorkingVoltageV', `isolator rated working voltage not entered: ${needed} not checked against it`);
  else if (neededV > iso.ratedWorkingVoltageV) exceeded('isolator.ratedWorkingVoltageV', `${needed} exceeds the isolator's rated working voltage ${volts(iso.ratedWorkingVoltageV)}`);
  if (iso.ratedTestVoltageV !== undefined && neededV > iso.ratedTestVoltageV) {
    exceeded('isolator.ratedTestVoltageV', `${needed} exceeds the isolator's rated insulation test voltage ${volts(iso.ratedTestVoltageV)}`);
  }
  if (iso.requiredTestVoltageV !== undefined) {
    if (iso.ratedTestVoltageV === undefined) unchecked('isolator.ratedTestVoltageV', `isolator rated insulation test voltage not entered: the required ${volts(iso.requiredTestVoltageV)}${rule} not checked`);
    else if (iso.ratedTestVoltageV < iso.requiredTestVoltageV) {
      exceeded('isolator.ratedTestVoltageV', `isolator rated insulation test voltage ${volts(iso.ratedTestVoltageV)} is below the required ${volts(iso.requiredTestVoltageV)}${rule}`);
    }
  }
  const distance = (name: string, provided: number | undefined, required: number | undefined, field: string) => {
    if (required === undefined) return;
    if (provided === undefined) unchecked(`isolator.${field}`, `${name} the layout provides not entered: the required ${mm(required)}${rule} not checked`);
    else if (provided < required) short(`isolator.${field}`, `${name} ${mm(provided)} falls short of the required ${mm(required)}${rule}`);
  };
  distance('creepage', iso.creepageMm, iso.requiredCreepageMm, 'creepageMm');
  distance('clearance', iso.clearanceMm, iso.requiredClearanceMm, 'clearanceMm');
  const anyRequired = [iso.requiredCreepageMm, iso.requiredClearanceMm, iso.requiredTestVoltageV].some((v) => v !== undefined);
  if (anyRequired && !iso.isolationRule) unchecked('isolator.isolationRule', 'required isolation values entered without naming the standard or rules they come from');
  return warnings;
}
