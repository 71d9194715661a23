import type { DataSource } from 'typeorm';
import { diffRevisions, studyHeadlines, type RevisionSide } from '../../../shared/compare/index.js';
import type { ChannelStudy } from '../../../shared/propagation/index.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import { REVISION_STATE_LABELS } from '../../../shared/schemas/designs.js';
import type { MarginStudyResult } from '../../../shared/schemas/margin.js';
import type { RevisionComparison } from '../../../shared/schemas/report-views.js';
import { Revision } from '../../entities/Revision.js';
import { compareLetters } from '../designs/revision-letters.js';
import { latestDoneRun, marginInputsOf } from '../margin/margin.service.js';
import { getRevision } from '../revisions/revisions.service.js';

/** A revision's channels, margin inputs (the defaults when none are saved: what its studies use) and latest study headlines. */
async function sideOf(dataSource: DataSource, revision: Revision): Promise<RevisionSide> {
  const [uncertaintyRun, marginRun, stored] = await Promise.all([
    latestDoneRun(dataSource, revision.id, 'uncertainty'), latestDoneRun(dataSource, revision.id, 'margin'), marginInputsOf(dataSource, revision.id),
  ]);
  const studied = uncertaintyRun ? (uncertaintyRun.result as { channels: { key: string; name: string; study: ChannelStudy }[] }).channels : null;
  return {
    channels: revision.channels.map((c) => ({ key: c.key, definition: c.definition as ChannelDefinition })),
    marginInputs: stored.inputs,
    studies: studyHeadlines(
      studied?.map(({ key, name, study }) => ({
        key, name, coverageProbability: study.coverageProbability,
        points: study.points.map((p) => ({ voltageV: p.voltageV, monteCarloIntervalV: p.monteCarlo.symmetricInterval, worstCaseMaxAbsV: p.worstCase.maxAbs })),
      })) ?? null,
      marginRun ? (marginRun.result as unknown as MarginStudyResult) : null,
    ),
  };
}

/**
 * The revision compared value by value with the one it was started from and with the last approved revision
 * before it (one comparison when they are the same revision); none for a first revision.
 */
export async function revisionComparisons(dataSource: DataSource, revision: Revision): Promise<RevisionComparison[]> {
  const siblings = await dataSource.getRepository(Revision).find({ where: { designId: revision.designId } });
  const earlier = siblings.filter((r) => compareLetters(r.letter, revision.letter) < 0).sort((a, b) => compareLetters(a.letter, b.letter));
  const previous = siblings.find((r) => r.id === revision.basedOnId) ?? earlier.at(-1);
  const approved = earlier.filter((r) => r.state === 'approved').at(-1);
  const targets = new Map<number, RevisionComparison['against']>();
  if (previous) targets.set(previous.id, ['previous']);
  if (approved) targets.set(approved.id, [...(targets.get(approved.id) ?? []), 'approved']);
  if (targets.size === 0) return [];
  const current = await sideOf(dataSource, revision);
  const comparisons: RevisionComparison[] = [];
  for (const [id, against] of targets) {
    const other = await getRevision(dataSource, id);
    const rows = diffRevisions(await sideOf(dataSource, other), current);
    comparisons.push({
      against, revision: { id: other.id, letter: other.letter, state: other.state, stateLabel: REVISION_STATE_LABELS[other.state] },
      rows, changedCount: rows.filter((r) => r.changed).length,
    });
  }
  return comparisons;
}
