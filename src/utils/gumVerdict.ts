import type { GumAgreement, GumValidation } from '@shared/propagation/gum-validation';

/** A point's GUM check; studies stored before the three-way check only said whether GUM was adequate. */
export function gumVerdictOf(v: Pick<GumValidation, 'adequate'> & { verdict?: GumAgreement }): GumAgreement {
  return v.verdict ?? (v.adequate ? 'agrees' : 'disagrees');
}

export { GUM_AGREEMENT_WORDS as GUM_VERDICT_WORDS } from '@shared/propagation/gum-validation';

/** A report channel's check over all its voltages; reports of older studies only carry the yes/no. */
export function gumAgreementOf(channel: { gumAdequate: boolean; gumAgreement?: GumAgreement }): GumAgreement {
  return channel.gumAgreement ?? (channel.gumAdequate ? 'agrees' : 'disagrees');
}
