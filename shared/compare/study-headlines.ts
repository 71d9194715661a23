import { formatEng } from '../units/format-engineering.js';
import type { CompareField } from './compare-types.js';

/** The few numbers of a revision's latest finished studies that a reviewer compares. */
export interface StudyHeadlines {
  /** Per channel, over the study's evaluation voltages. */
  uncertainty: null | {
    channels: {
      key: string;
      name: string;
      coverageProbability: number;
      /** Largest worst-case reading error, V. */
      worstCaseMaxAbsV: number;
      /** The Monte Carlo coverage interval of the reading error with the largest half-width, and its voltage. */
      widestInterval: { voltageV: number; low: number; high: number };
    }[];
  };
  margin: null | {
    verdict: string;
    criteria: { key: string; criterion: string; pass: boolean; outcome: string }[];
    faults: { key: string; label: string; verdict: string }[];
  };
}

type Channel = NonNullable<StudyHeadlines['uncertainty']>['channels'][number];
type Margin = NonNullable<StudyHeadlines['margin']>;

const VERDICTS: Record<string, string> = { pass: 'pass', fail: 'fail', 'unable-to-close': 'unable to close', 'not-shown': 'not shown' };
const FAULT_VERDICTS: Record<string, string> = { 'too-fast': 'caught (too fast)', 'too-slow': 'caught (too slow)', 'not-detected': 'not detected', 'not-evaluated': 'not evaluated' };

/** The uncertainty headlines of one channel (read by key so that both sides line up). */
export function uncertaintyHeadlineFields(key: string, name: string): CompareField<StudyHeadlines>[] {
  const ch = (read: (c: Channel) => number | string) => (h: StudyHeadlines) => {
    const c = h.uncertainty?.channels.find((x) => x.key === key);
    return c ? read(c) : undefined;
  };
  return [
    { label: `${name}: largest worst-case error`, unit: '', read: ch((c) => `±${formatV(c.worstCaseMaxAbsV)}`) },
    { label: `${name}: widest Monte Carlo interval`, unit: '',
      read: ch((c) => `${formatV(c.widestInterval.low)} to ${formatV(c.widestInterval.high)} at ${formatV(c.widestInterval.voltageV)} (p = ${c.coverageProbability})`) },
  ];
}

/** The margin verdict, each criterion's outcome and each fault case's verdict, read by key. */
export function marginHeadlineFields(keys: { criteria: { key: string; criterion: string }[]; faults: { key: string; label: string }[] }): CompareField<StudyHeadlines>[] {
  const m = (read: (r: Margin) => string | undefined) => (h: StudyHeadlines) => (h.margin ? read(h.margin) : undefined);
  return [
    { label: 'Margin verdict', unit: '', read: (h: StudyHeadlines) => (h.margin ? VERDICTS[h.margin.verdict] ?? h.margin.verdict : 'no finished study') },
    ...keys.criteria.map(({ key, criterion }) => ({
      label: criterion, unit: '',
      read: m((r) => {
        const c = r.criteria.find((x) => x.key === key);
        return c ? (c.pass ? 'met' : c.outcome === 'not-shown' ? 'not shown' : 'failed') : undefined;
      }),
    })),
    ...keys.faults.map(({ key, label }) => ({ label, unit: '', read: m((r) => { const fv = r.faults.find((x) => x.key === key)?.verdict; return fv ? FAULT_VERDICTS[fv] ?? fv : undefined; }) })),
  ];
}

/** Studies are compared as the pages print them (three digits), so a rerun's last-digit noise is not a change. */
const formatV = (v: number): string => formatEng(v, 'V', 3);
