import type { ChannelDefinition } from '../schemas/chain.js';
import type { MarginInputs } from '../schemas/margin.js';
import { channelStageFields } from './channel-fields.js';
import type { CompareField, RevisionChangeRow } from './compare-types.js';
import { formatField } from './format-field.js';
import { MARGIN_FIELDS } from './margin-fields.js';
import { marginHeadlineFields, uncertaintyHeadlineFields, type StudyHeadlines } from './study-headlines.js';

/** What one revision brings to a comparison. */
export interface RevisionSide {
  channels: readonly { key: string; definition: ChannelDefinition }[];
  /** The stored margin inputs; null when none were saved. */
  marginInputs: MarginInputs | null;
  /** The latest finished studies' headlines. */
  studies: StudyHeadlines;
}

function compare<T>(section: string, fields: readonly CompareField<T>[], before: T | null, after: T | null): RevisionChangeRow[] {
  return fields.flatMap((field) => {
    const [a, b] = [before === null ? undefined : field.read(before), after === null ? undefined : field.read(after)];
    const [beforeText, afterText] = [formatField(a, field.unit), formatField(b, field.unit)];
    if (beforeText === null && afterText === null) return [];
    return [{ section, label: field.label, before: beforeText, after: afterText, changed: (a ?? null) !== (b ?? null) }];
  });
}

/**
 * Value-by-value comparison of two revisions: every channel input (channels matched by key, top resistors
 * by position), every margin input and the study headlines (largest worst-case error, widest Monte Carlo
 * interval, margin verdict, each criterion and fault verdict), old → new. A row is `changed` when the values
 * differ (inputs exactly, studies as printed to three digits); a value one side lacks reads null.
 * @param before the older revision (previous, or last approved)
 * @param after the revision under review
 * @returns rows in the order the forms show them; fields neither side has are left out
 * @throws never
 * @example diffRevisions(a, b).filter((r) => r.changed).map((r) => `${r.label}: ${r.before} → ${r.after}`)
 */
export function diffRevisions(before: RevisionSide, after: RevisionSide): RevisionChangeRow[] {
  const keys = [...new Set([...after.channels.map((c) => c.key), ...before.channels.map((c) => c.key)])];
  const rows: RevisionChangeRow[] = [];
  for (const key of keys) {
    const [a, b] = [before.channels.find((c) => c.key === key)?.definition ?? null, after.channels.find((c) => c.key === key)?.definition ?? null];
    const name = b?.name ?? a?.name ?? key;
    rows.push(...compare(name, [{ label: 'Channel name', unit: '', read: (c: ChannelDefinition) => c.name }], a, b));
    const tops = Math.max(a?.divider.top.length ?? 0, b?.divider.top.length ?? 0);
    for (const { stage, fields } of channelStageFields(tops)) rows.push(...compare(`${name} · ${stage}`, fields, a, b));
  }
  rows.push(...compare('Margin inputs', MARGIN_FIELDS, before.marginInputs, after.marginInputs));
  const studied = [...(after.studies.uncertainty?.channels ?? []), ...(before.studies.uncertainty?.channels ?? [])];
  const channelKeys = [...new Map(studied.map((c) => [c.key, c.name])).entries()];
  rows.push(...compare('Uncertainty study', channelKeys.flatMap(([key, name]) => uncertaintyHeadlineFields(key, name)), before.studies, after.studies));
  // With a margin study on one side only, its verdict says so; listing every criterion against nothing says no more.
  const both = before.studies.margin !== null && after.studies.margin !== null;
  const criteria = both ? [...new Map([...after.studies.margin!.criteria, ...before.studies.margin!.criteria].map((c) => [c.key, c])).values()] : [];
  const faults = both ? [...new Map([...after.studies.margin!.faults, ...before.studies.margin!.faults].map((f) => [f.key, f])).values()] : [];
  rows.push(...compare('Margin study', marginHeadlineFields({ criteria, faults }), before.studies, after.studies));
  return rows;
}
