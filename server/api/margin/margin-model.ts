import { channelSchema, type ChannelDefinition } from '../../../shared/schemas/chain.js';
import type { FaultCase, MarginInputs } from '../../../shared/schemas/margin.js';
import type { PrechargeDesign, PrechargeFault, ReadingErrorModel } from '../../../shared/precharge/index.js';

/** Nominal resistance the link channel's divider puts across the link, Ω: top string plus bottom ‖ converter input. */
export function dividerLoadOhm(channel: ChannelDefinition): number {
  const top = channel.divider.top.reduce((sum, r) => sum + r.nominalOhm, 0);
  const bottom = channel.divider.bottom.nominalOhm;
  const input = channel.converter.inputResistanceOhm;
  return top + (input === undefined ? bottom : (bottom * input) / (bottom + input));
}

/** All link-side leakage paths: the link divider first, then the inputs' own. */
export function leakagePathsOf(inputs: MarginInputs, link: ChannelDefinition): { label: string; resistanceOhm: number }[] {
  return [{ label: `${link.name} divider`, resistanceOhm: dividerLoadOhm(link) }, ...inputs.leakagePaths];
}

/** Parallel combination, Ω; null when there is no path. */
export function parallelOhm(paths: readonly { resistanceOhm: number }[]): number | null {
  if (paths.length === 0) return null;
  return 1 / paths.reduce((sum, p) => sum + 1 / p.resistanceOhm, 0);
}

/** The channel as the chosen reading-error mode reads it. */
export function channelForMode(channel: ChannelDefinition, mode: 'uncalibrated' | 'calibrated'): ChannelDefinition {
  if (mode === 'uncalibrated') return { ...channel, reconstruction: { mode: 'nominal' } };
  if (channel.reconstruction.mode === 'calibrated') return channel;
  return channelSchema.parse({ ...channel, reconstruction: { mode: 'calibrated', temperatureC: channel.environment.referenceC } });
}

export function toPrechargeFault(fault: FaultCase): PrechargeFault {
  switch (fault.kind) {
    case 'open-precharge': return { kind: 'open-precharge' };
    case 'bypassed-precharge': return { kind: 'bypassed-precharge', residualOhm: fault.residualOhm };
    case 'leakage': return { kind: 'leakage', resistanceOhm: fault.resistanceOhm };
    case 'missing-capacitance': return { kind: 'missing-capacitance', fraction: fault.missingPct / 100 };
  }
}

/** The engine's design from the stored inputs, the link leakage and both channels' reading errors. */
export function prechargeDesignOf(
  inputs: MarginInputs, leakageOhm: number | null, packReading: ReadingErrorModel, linkReading: ReadingErrorModel,
): PrechargeDesign {
  const requiredFraction = inputs.requiredRatioPct !== undefined
    ? inputs.requiredRatioPct / 100
    // Step limit only: the engine's own early-closure count is not reported; give it the ratio the step limit means at the top of the pack.
    : Math.min(1, Math.max(1e-9, 1 - (inputs.maxStepV ?? 0) / inputs.packMaxV));
  return {
    packMinV: inputs.packMinV,
    packMaxV: inputs.packMaxV,
    prechargeOhm: inputs.prechargeOhm,
    prechargeTolerancePct: inputs.prechargeTolerancePct,
    linkCapacitanceF: inputs.linkCapacitanceF,
    capacitanceTolerancePct: inputs.capacitanceTolerancePct,
    leakageOhm: leakageOhm ?? undefined,
    closingFraction: inputs.closingThresholdPct / 100,
    requiredFraction,
    updateIntervalS: inputs.updateIntervalS,
    consecutiveReadings: inputs.consecutiveReadings,
    timeoutS: inputs.timeoutS,
    packReading,
    linkReading,
  };
}

/** R_p, R_l and C of the nominal network with a fault applied (Infinity: no path). */
export function faultyNetwork(design: PrechargeDesign, fault: PrechargeFault | null) {
  let prechargeOhm = design.prechargeOhm;
  let leakageOhm = design.leakageOhm ?? Infinity;
  let capacitanceF = design.linkCapacitanceF;
  if (fault?.kind === 'open-precharge') prechargeOhm = Infinity;
  if (fault?.kind === 'bypassed-precharge') prechargeOhm = fault.residualOhm ?? 0;
  if (fault?.kind === 'leakage') leakageOhm = leakageOhm === Infinity ? fault.resistanceOhm : (leakageOhm * fault.resistanceOhm) / (leakageOhm + fault.resistanceOhm);
  if (fault?.kind === 'missing-capacitance') capacitanceF *= 1 - fault.fraction;
  return { prechargeOhm, leakageOhm, capacitanceF };
}
