import type { DataSource } from 'typeorm';
import type { StockPartBody } from '../../shared/schemas/stock.js';
import { recordAudit } from '../common/audit.js';
import { createDesign } from '../api/designs/designs.service.js';
import { getRevision, replaceChannels, startNextRevision } from '../api/revisions/revisions.service.js';
import { DEFAULT_MARGIN_INPUTS } from '../api/margin/margin-defaults.js';
import { computeMarginStudy } from '../api/margin/margin-study.js';
import { marginStudyData, saveMarginInputs } from '../api/margin/margin.service.js';
import type { UncertaintyRunInputs } from '../../shared/schemas/run-views.js';
import { channelsHash } from '../api/runs/runs.service.js';
import { channelStudy } from '../../shared/propagation/index.js';
import type { RevisionState } from '../../shared/schemas/designs.js';
import { AnalysisRun } from '../entities/AnalysisRun.js';
import { Revision } from '../entities/Revision.js';
import { StockPart } from '../entities/StockPart.js';
import type { User } from '../entities/User.js';

/** Invented shelf stock: values and ratings only, no makers or part numbers. */
const DEMO_STOCK: StockPartBody[] = [
  { ohms: 1e6, tolerancePct: 0.5, tcrPpmPerK: 50, voltageCoefficientPpmPerV: 1, ratedVoltageV: 200, ratedPowerW: 0.25, package: '1206', quantity: 140, note: 'top string' },
  { ohms: 2e6, tolerancePct: 1, tcrPpmPerK: 100, voltageCoefficientPpmPerV: 2, ratedVoltageV: 200, ratedPowerW: 0.25, package: '1206', quantity: 35, note: '' },
  { ohms: 4.99e6, tolerancePct: 1, tcrPpmPerK: 100, voltageCoefficientPpmPerV: 5, ratedVoltageV: 1500, ratedPowerW: 0.5, package: 'axial', quantity: 12, note: 'high-voltage film' },
  { ohms: 32.4e3, tolerancePct: 0.1, tcrPpmPerK: 25, voltageCoefficientPpmPerV: 0, ratedVoltageV: 75, ratedPowerW: 0.1, package: '0603', quantity: 60, note: 'bottom' },
  { ohms: 33.2e3, tolerancePct: 0.1, tcrPpmPerK: 25, voltageCoefficientPpmPerV: 0, ratedVoltageV: 75, ratedPowerW: 0.1, package: '0603', quantity: 22, note: '' },
  { ohms: 4.7e3, tolerancePct: 1, tcrPpmPerK: 100, voltageCoefficientPpmPerV: 0, ratedVoltageV: 150, ratedPowerW: 0.125, package: '0805', quantity: 200, note: '' },
  { ohms: 10e3, tolerancePct: 0.1, tcrPpmPerK: 25, voltageCoefficientPpmPerV: 0, ratedVoltageV: 75, ratedPowerW: 0.1, package: '0603', quantity: 90, note: '' },
  { ohms: 1.5e3, tolerancePct: 5, tcrPpmPerK: 200, voltageCoefficientPpmPerV: 0, ratedVoltageV: 750, ratedPowerW: 25, package: 'TO-220', quantity: 6, note: 'pre-charge resistor' },
];

/** Finished studies stored as the scheduler would, computed here (seeding runs before the worker pool starts); small trial counts keep it quick. */
async function seedFinishedStudies(dataSource: DataSource, revisionId: number, requester: User, seed: number): Promise<void> {
  const revision = await getRevision(dataSource, revisionId);
  const channels = revision.channels.map((c) => ({ key: c.key, definition: c.definition }));
  const uncertaintyInputs: UncertaintyRunInputs = { channels, coverageProbability: 0.95, gridPoints: 5 };
  const uncertainty = { channels: channels.map((c) => ({ key: c.key, name: c.definition.name,
    study: channelStudy(c.definition, { seed, trials: 2000, gridPoints: 5, coverageProbability: 0.95 }) })) };
  // Boards as many as trials and 5000 per fault case: enough to show the default allowance of 10⁻³ (≥ 2995 each).
  const { data, hash } = await marginStudyData(dataSource, revision, { seed, trials: 20_000, faultTrials: 5000, readingErrorTrials: 20_000 });
  const margin = computeMarginStudy(data);
  const runs = dataSource.getRepository(AnalysisRun);
  const done = { state: 'done' as const, progress: 1, requestedById: requester.id, startedAt: new Date(), finishedAt: new Date(), durationMs: 0, adaptiveDigits: null, seed };
  await runs.save([
    runs.create({ ...done, revisionId, kind: 'uncertainty', inputs: uncertaintyInputs as unknown as Record<string, unknown>, inputsHash: channelsHash(channels),
      trials: 2000, result: JSON.parse(JSON.stringify(uncertainty)) }),
    runs.create({ ...done, revisionId, kind: 'margin', inputs: data as unknown as Record<string, unknown>, inputsHash: hash, trials: 20_000,
      result: JSON.parse(JSON.stringify(margin)) }),
  ]);
}

/** A review transition as the workflow records it (no mail: nobody is listening while seeding). */
async function seedTransition(dataSource: DataSource, revisionId: number, actor: User, action: string, to: RevisionState, comment = ''): Promise<void> {
  await dataSource.transaction(async (m) => {
    const revision = await m.getRepository(Revision).findOneByOrFail({ id: revisionId });
    await m.getRepository(Revision).update({ id: revisionId }, { state: to });
    await recordAudit(m, actor.id, action, `revision:${revisionId}`, { from: revision.state, to, ...(comment ? { comment } : {}) });
  });
}

/**
 * The demo team's pack-monitor board "PM-2": revision A approved by the lead, revision B (which moves
 * the link-side bottom resistor and adds a 30 % missing-capacitance fault case) in review, both with
 * finished studies. Built through the same services the API uses.
 */
export async function seedDemoDesign(dataSource: DataSource, designer: User, lead: User): Promise<void> {
  const design = await createDesign(dataSource, designer, {
    name: 'PM-2 pack monitor',
    purpose: 'Pack-side and link-side voltage for the pre-charge decision: 110-cell pack, 308–462 V, 1.5 kΩ pre-charge into 600 µF.',
  });
  const revA = design.revisions[0];
  await replaceChannels(dataSource, designer, revA.id, { channels: (await getRevision(dataSource, revA.id)).channels.map((c) => ({ key: c.key, definition: c.definition })), note: 'First board build.' });
  const faultsA = DEFAULT_MARGIN_INPUTS.faults.map((f) => (f.kind === 'missing-capacitance' ? { ...f, missingPct: 50 } : f));
  await saveMarginInputs(dataSource, designer, revA.id, { ...DEFAULT_MARGIN_INPUTS, faults: faultsA });
  await seedFinishedStudies(dataSource, revA.id, designer, 1001);
  await seedTransition(dataSource, revA.id, designer, 'revision.submit', 'in_review');
  await seedTransition(dataSource, revA.id, lead, 'revision.approve', 'approved', 'Margins hold for the first build.');

  const revB = await startNextRevision(dataSource, designer, design.id, revA.id);
  const channels = revB.channels.map((c) => ({ key: c.key, definition: structuredClone(c.definition) }));
  channels[1].definition.divider.bottom.nominalOhm = 33.2e3;
  await replaceChannels(dataSource, designer, revB.id, { channels, note: 'Link side: 33.2 kΩ bottom resistor for more headroom.' });
  await saveMarginInputs(dataSource, designer, revB.id, DEFAULT_MARGIN_INPUTS);
  await seedFinishedStudies(dataSource, revB.id, designer, 1002);
  await seedTransition(dataSource, revB.id, designer, 'revision.submit', 'in_review');
  const stock = dataSource.getRepository(StockPart);
  await stock.insert(DEMO_STOCK.map((p) => stock.create(p)));
}
