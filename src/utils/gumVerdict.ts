import type { GumAgreement, GumValidation } from '@shared/propagation/gum-validation';

/** A point's GUM check; studies stored before the three-way check only said whether GUM was adequate. */
export function gumVerdictOf(v: Pick<GumValidation, 'adequate'> & { verdict?: GumAgreement }): GumAgreement {
  return v.verdict ?? (v.adequate ? 'agrees' : 'disagrees');
}

export const GUM_VERDICT_WORDS: Record<GumAgreement, string> = { agrees: 'agrees', disagrees: 'differs', 'cannot-tell': 'cannot tell yet' };
