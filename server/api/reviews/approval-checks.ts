import type { DataSource } from 'typeorm';
import type { MarginStudyResult } from '../../../shared/schemas/margin.js';
import type { FailingCheck } from '../../../shared/schemas/review-views.js';
import { calibrationOverview } from '../calibration/calibration-overview.js';
import { currentRunHash, latestDoneRun } from '../margin/margin.service.js';
import type { Revision } from '../../entities/Revision.js';

const STUDY_NAMES = { uncertainty: 'uncertainty study', margin: 'margin study' } as const;

/**
 * Every check the revision fails right now, computed here and never taken from the client: the margin
 * study's criteria and fault cases, studies missing or not current, and built boards outside the design's spread.
 */
export async function failingChecks(dataSource: DataSource, revision: Revision): Promise<FailingCheck[]> {
  const failing: FailingCheck[] = [];
  for (const kind of ['uncertainty', 'margin'] as const) {
    const run = await latestDoneRun(dataSource, revision.id, kind);
    if (!run) {
      failing.push({ key: `study-missing:${kind}`, label: `No finished ${STUDY_NAMES[kind]}` });
      continue;
    }
    if (run.inputsHash !== await currentRunHash(dataSource, revision, kind)) {
      failing.push({ key: `study-stale:${kind}`, label: `The ${STUDY_NAMES[kind]} (study ${run.id}) is not current: it used older inputs` });
    }
    if (kind === 'margin' && run.result) {
      const result = run.result as unknown as MarginStudyResult;
      const faultKeys = new Set(result.faults.map((f) => f.key));
      // A criterion the study had too few trials to show is not passed either; it is named as such.
      for (const row of result.summary.filter((c) => !c.pass)) {
        const unshown = row.outcome === 'not-shown';
        const fault = row.criterion.replace(/^Fault caught: /, '');
        failing.push(faultKeys.has(row.key)
          ? { key: `fault:${row.key}`, label: unshown ? `Fault detection not shown: ${fault} (too few trials to show it is caught)` : `Fault detection fails: ${fault} is not caught` }
          : { key: `margin:${row.key}`, label: unshown ? `Margin not shown: ${row.criterion} (too few trials to show it)` : `Margin fails: ${row.criterion}` });
      }
    }
  }
  for (const channel of revision.channels) {
    const overview = await calibrationOverview(dataSource, revision.id, channel.key);
    for (const board of overview.boards) {
      // Judged by the guarded acceptance rule the review shows: a board in a guard band is not shown to be inside either.
      const { decision } = board;
      if (decision === null || decision === 'accept') continue;
      failing.push({
        key: `board:${board.boardId}:${channel.key}`,
        label: decision === 'reject'
          ? `Board ${board.serialNumber}, ${overview.channelName}: outside the design's spread (rejected)`
          : `Board ${board.serialNumber}, ${overview.channelName}: not shown inside the design's spread (undecided, in a guard band)`,
      });
    }
  }
  return failing;
}

/** True when the acknowledged keys name exactly the failing checks (order and repeats aside). */
export function acknowledgesExactly(acknowledged: readonly string[], failing: readonly FailingCheck[]): boolean {
  const given = new Set(acknowledged);
  return given.size === failing.length && failing.every((f) => given.has(f.key));
}
