import type { StudyHeadlines } from './study-headlines.js';

/** The part of a stored uncertainty study a comparison reads, per channel. */
export interface UncertaintyPointsOf {
  key: string;
  name: string;
  coverageProbability: number;
  points: readonly { voltageV: number; monteCarloIntervalV: { low: number; high: number }; worstCaseMaxAbsV: number }[];
}

/** The part of a stored margin study a comparison reads. */
export interface MarginOutcomeOf {
  verdict: string;
  summary: readonly { key: string; criterion: string; pass: boolean; outcome: string }[];
  faults: readonly { key: string; label: string; verdict: string }[];
}

/**
 * The headlines of a revision's latest studies: per channel the largest worst-case error and the Monte Carlo
 * interval with the largest half-width (high − low)/2 over the evaluation voltages; the margin verdict, each
 * criterion's outcome and each fault case's verdict.
 * @param uncertainty channels of the latest finished uncertainty study, or null
 * @param margin result of the latest finished margin study, or null
 * @throws never (a channel without points is left out)
 * @example studyHeadlines(report.uncertainty?.channels ?? null, report.margin?.result ?? null)
 */
export function studyHeadlines(uncertainty: readonly UncertaintyPointsOf[] | null, margin: MarginOutcomeOf | null): StudyHeadlines {
  return {
    uncertainty: uncertainty === null ? null : {
      channels: uncertainty.filter((c) => c.points.length > 0).map((c) => {
        const widest = c.points.reduce((a, b) => (b.monteCarloIntervalV.high - b.monteCarloIntervalV.low > a.monteCarloIntervalV.high - a.monteCarloIntervalV.low ? b : a));
        return {
          key: c.key, name: c.name, coverageProbability: c.coverageProbability,
          worstCaseMaxAbsV: Math.max(...c.points.map((p) => p.worstCaseMaxAbsV)),
          widestInterval: { voltageV: widest.voltageV, ...widest.monteCarloIntervalV },
        };
      }),
    },
    margin: margin === null ? null : {
      verdict: margin.verdict,
      criteria: margin.summary.map(({ key, criterion, pass, outcome }) => ({ key, criterion, pass, outcome })),
      faults: margin.faults.map(({ key, label, verdict }) => ({ key, label, verdict })),
    },
  };
}
