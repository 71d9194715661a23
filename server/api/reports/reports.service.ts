import { In, type DataSource } from 'typeorm';
import type { ChannelStudy } from '../../../shared/propagation/index.js';
import { overallGumAgreement } from '../../../shared/propagation/gum-validation.js';
import { REVISION_STATE_LABELS } from '../../../shared/schemas/designs.js';
import type { MarginInputs, MarginStudyResult } from '../../../shared/schemas/margin.js';
import { AuditEvent } from '../../entities/AuditEvent.js';
import { User } from '../../entities/User.js';
import type { AnalysisRun } from '../../entities/AnalysisRun.js';
import { currentRunHash, latestDoneRun, marginInputsOf } from '../margin/margin.service.js';
import { getRevision } from '../revisions/revisions.service.js';
import { REVIEW_ACTIONS } from '../reviews/reviews.service.js';
import type { MarginStudyData } from '../margin/margin-study.js';
import { HIGH_VOLTAGE_CAUTION } from './caution.js';
import { chainStages } from './chain-rows.js';
import { chainWarningsOf } from './chain-warnings.js';
import { revisionComparisons } from './revision-compare.js';
import { isoTime, isoTimeOrNull } from '../../common/iso-time.js';
import type { ReportSignOff, ReportUncertaintyChannel, RevisionReport, RunHeader } from '../../../shared/schemas/report-views.js';

const ACTION_LABELS: Record<string, string> = {
  'revision.submit': 'Submitted for review',
  'revision.approve': 'Approved',
  'revision.request-changes': 'Changes requested',
  'revision.reopen': 'Moved back to draft',
};

function runHeader(run: AnalysisRun, current: boolean): RunHeader {
  return {
    runId: run.id, current, seed: run.seed, trials: run.trials, finishedAt: isoTimeOrNull(run.finishedAt),
    requestedBy: run.requestedBy ? { id: run.requestedBy.id, displayName: run.requestedBy.displayName } : null,
  };
}

/** Per channel: coverage at each voltage, and the budget where the GUM expanded uncertainty is largest. */
function uncertaintySection(run: AnalysisRun, current: boolean): RunHeader & { channels: ReportUncertaintyChannel[] } {
  const result = run.result as { channels: { key: string; name: string; study: ChannelStudy }[] };
  return {
    ...runHeader(run, current),
    channels: result.channels.map(({ key, name, study }) => {
      const worst = study.points.reduce((a, b) => (b.gum.expandedUncertainty > a.gum.expandedUncertainty ? b : a));
      const variance = worst.gum.combinedStandardUncertainty ** 2;
      return {
        key, name, trials: study.trials, coverageProbability: study.coverageProbability, gumAdequate: study.gumAdequate,
        // studies stored before the three-way check carry only `adequate`
        gumAgreement: overallGumAgreement(study.points.map((p) => ({ verdict: p.gumValidation.verdict ?? (p.gumValidation.adequate ? 'agrees' : 'disagrees') }))),
        counterOverflowV: study.points.filter((p) => p.counterOverflow).map((p) => p.voltageV),
        points: study.points.map((p) => ({
          voltageV: p.voltageV,
          monteCarloMeanV: p.monteCarlo.mean,
          monteCarloIntervalV: p.monteCarlo.symmetricInterval,
          gumExpandedUncertaintyV: p.gum.expandedUncertainty,
          worstCaseMaxAbsV: p.worstCase.maxAbs,
        })),
        budget: {
          voltageV: worst.voltageV,
          combinedStandardUncertaintyV: worst.gum.combinedStandardUncertainty,
          expandedUncertaintyV: worst.gum.expandedUncertainty,
          coverageFactor: worst.gum.coverageFactor,
          rows: worst.gum.budget.map((r) => ({
            label: r.label, where: r.where, unit: r.unit, distribution: r.distribution, halfWidth: r.halfWidth,
            standardUncertainty: r.standardUncertainty, sensitivity: r.sensitivity, contributionV: r.contribution,
            sharePct: variance > 0 ? (100 * r.contribution ** 2) / variance : 0,
            // Studies stored before the budget had second-order rows carry no order.
            order: r.order ?? 1,
          })),
        },
      };
    }),
  };
}

/** Everything the printable review report shows, in the order it shows it. */
export async function buildReport(dataSource: DataSource, revisionId: number, now = new Date()): Promise<RevisionReport> {
  const revision = await getRevision(dataSource, revisionId);
  const [uncertaintyRun, marginRun, stored, comparisons] = await Promise.all([
    latestDoneRun(dataSource, revisionId, 'uncertainty'), latestDoneRun(dataSource, revisionId, 'margin'), marginInputsOf(dataSource, revisionId),
    revisionComparisons(dataSource, revision),
  ]);
  const events = await dataSource.getRepository(AuditEvent).find({
    where: { subject: `revision:${revisionId}`, action: In([...REVIEW_ACTIONS]) }, order: { at: 'ASC', id: 'ASC' },
  });
  const actorIds = [...new Set(events.map((e) => e.actorId).filter((id): id is number => id !== null))];
  const actors = actorIds.length ? await dataSource.getRepository(User).findBy({ id: In(actorIds) }) : [];
  const uncertaintyCurrent = uncertaintyRun ? uncertaintyRun.inputsHash === await currentRunHash(dataSource, revision, 'uncertainty') : false;
  const marginCurrent = marginRun ? marginRun.inputsHash === await currentRunHash(dataSource, revision, 'margin') : false;
  return {
    generatedAt: now.toISOString(),
    title: `${revision.design.name}, revision ${revision.letter}`,
    design: {
      id: revision.design.id, name: revision.design.name, purpose: revision.design.purpose,
      owner: { id: revision.design.owner.id, displayName: revision.design.owner.displayName },
    },
    revision: {
      id: revision.id, letter: revision.letter, state: revision.state, stateLabel: REVISION_STATE_LABELS[revision.state], note: revision.note,
      basedOnId: revision.basedOnId, createdBy: { id: revision.createdBy.id, displayName: revision.createdBy.displayName },
      createdAt: isoTimeOrNull(revision.createdAt), updatedAt: isoTimeOrNull(revision.updatedAt),
    },
    channels: revision.channels.map((c) => ({ key: c.key, name: c.definition.name, stages: chainStages(c.definition), warnings: chainWarningsOf(c.definition, (stored.inputs as MarginInputs).isolationMarginPct) })),
    uncertainty: uncertaintyRun ? uncertaintySection(uncertaintyRun, uncertaintyCurrent) : null,
    margin: marginRun
      ? { ...runHeader(marginRun, marginCurrent), inputs: (marginRun.inputs as unknown as MarginStudyData).inputs, result: marginRun.result as unknown as MarginStudyResult }
      : null,
    /** The inputs as they are now (may differ from the study's when the study is not current). */
    marginInputs: stored.inputs as MarginInputs,
    signOff: events.map((e) => ({
      at: isoTime(e.at),
      action: e.action,
      label: e.detail?.override ? 'Approved with an override' : ACTION_LABELS[e.action] ?? e.action,
      actor: { id: e.actorId, displayName: actors.find((a) => a.id === e.actorId)?.displayName ?? null },
      comment: typeof e.detail?.comment === 'string' ? e.detail.comment : '',
      ...(e.detail?.override ? { override: e.detail.override as ReportSignOff['override'] } : {}),
    })),
    caution: HIGH_VOLTAGE_CAUTION,
    comparisons,
  };
}

export type ReviewReport = RevisionReport;
