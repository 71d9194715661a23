import type { DataSource } from 'typeorm';
import type { StockPartBody } from '../../shared/schemas/stock.js';
import { recordAudit } from '../common/audit.js';
import { createDesign } from '../api/designs/designs.service.js';
import { replaceChannels, startNextRevision } from '../api/revisions/revisions.service.js';
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

/**
 * The demo team's pack-monitor board "PM-2": revision A approved by the lead, revision B a draft that
 * moves the link-side bottom resistor. Built through the same services the API uses.
 */
export async function seedDemoDesign(dataSource: DataSource, designer: User, lead: User): Promise<void> {
  const design = await createDesign(dataSource, designer, {
    name: 'PM-2 pack monitor',
    purpose: 'Pack-side and link-side voltage for the pre-charge decision: 110-cell pack, 308–462 V, 1.5 kΩ pre-charge into 600 µF.',
  });
  const revA = design.revisions[0];
  await dataSource.transaction(async (m) => {
    await m.getRepository(Revision).update({ id: revA.id }, { state: 'approved', note: 'First board build.' });
    await recordAudit(m, lead.id, 'revision.approve', `revision:${revA.id}`, { comment: 'Margins hold for the first build.' });
  });
  const revB = await startNextRevision(dataSource, designer, design.id, revA.id);
  const channels = revB.channels.map((c) => ({ key: c.key, definition: structuredClone(c.definition) }));
  channels[1].definition.divider.bottom.nominalOhm = 33.2e3;
  await replaceChannels(dataSource, designer, revB.id, { channels, note: 'Link side: 33.2 kΩ bottom resistor for more headroom.' });
  const stock = dataSource.getRepository(StockPart);
  await stock.insert(DEMO_STOCK.map((p) => stock.create(p)));
}
