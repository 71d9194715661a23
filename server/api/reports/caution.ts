/** The high-voltage caution every report carries (same words as the client's caution notice). */
export const HIGH_VOLTAGE_CAUTION = {
  title: 'High voltage: for qualified people only',
  paragraphs: [
    'Battery packs, pre-charge circuits and the boards that measure them can carry lethal voltage and stored energy, even with the contactors open. '
      + 'Only people trained and authorised for high-voltage work should build, probe or test this hardware.',
    'Follow your local electrical codes, the rules of the vehicle or competition you build for, and licensed practice. '
      + 'When any of them disagree with a number in this report, they win.',
    'Tallyvolt checks arithmetic and certifies nothing. Confirm every value by measurement, and have a qualified person sign the design off before anyone relies on it.',
  ],
} as const;
