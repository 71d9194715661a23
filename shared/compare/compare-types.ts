/** One compared value: what it is, as the forms name it, and how it read on each side. */
export interface RevisionChangeRow {
  /** Where it belongs: a channel's stage ('pack side · Divider'), 'Margin inputs', 'Uncertainty study' or 'Margin study'. */
  section: string;
  label: string;
  /** The value as the page shows it, unit included; null when that side does not have it. */
  before: string | null;
  after: string | null;
  changed: boolean;
}

/** A value of one side before formatting: a number with its unit, a word, or nothing. */
export type FieldValue = number | string | boolean | undefined | null;

/** How one field is read from a record and printed. */
export interface CompareField<T> {
  label: string;
  /** '' for a plain count; an SI unit takes a prefix (kΩ, mV). */
  unit: string;
  read: (record: T) => FieldValue;
}
