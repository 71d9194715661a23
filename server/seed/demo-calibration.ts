import type { DataSource } from 'typeorm';
import { dividerNominal, nominalFrequencyHz } from '../../shared/chain/index.js';
import { recordAudit } from '../common/audit.js';
import { createBoard } from '../api/boards/boards.service.js';
import { createSession, getSession, writePoints } from '../api/calibration/sessions.service.js';
import { currentRecord } from '../api/calibration/session-export.js';
import { CalibrationSession } from '../entities/CalibrationSession.js';
import { Channel } from '../entities/Channel.js';
import { Revision } from '../entities/Revision.js';
import type { User } from '../entities/User.js';

/** Invented bench readings: a board a little off nominal, with a few hertz of scatter. */
const BOARD_GAIN_ERROR = { pack: 0.0021, link: -0.0014 } as Record<string, number>;
const BOARD_OFFSET_HZ = { pack: 3.2, link: -2.1 } as Record<string, number>;
const SCATTER_HZ = [0.6, -0.4, 0.2, -0.7, 0.5, 0.1, -0.3, 0.4, -0.2, 0.3, -0.5];

/** Board "PM-2-001" of revision A with one completed calibration per channel. */
export async function seedDemoCalibration(dataSource: DataSource, tester: User): Promise<void> {
  const revision = await dataSource.getRepository(Revision).findOneOrFail({ where: { letter: 'A', design: { name: 'PM-2 pack monitor' } } });
  const board = await createBoard(dataSource, tester, { serialNumber: 'PM-2-001', revisionId: revision.id, buildDate: '2026-11-16', note: 'First build, hand-assembled.', confirmDraft: false });
  const channels = await dataSource.getRepository(Channel).find({ where: { revisionId: revision.id }, order: { position: 'ASC' } });
  for (const channel of channels) {
    const def = channel.definition;
    const ratio = dividerNominal(def.divider, def.converter.inputResistanceOhm).ratio;
    const session = await createSession(dataSource, tester, board.id, {
      channelKey: channel.key, performedOn: '2026-11-20', ambientC: 23.5, note: '',
      reference: { description: 'Bench HV source with a 6½-digit meter on its 1000 V range', percentOfReading: 0.01, plusVolts: 0.05, coverageFactor: 0 },
      // Invented identifiers: the lab's own asset tag and certificate number.
      referenceInstrumentId: 'QER-LAB-0042', referenceCertificate: 'QER-CAL-2026-117', referenceDueOn: '2027-05-31',
      fit: { degree: 1, intercept: true, weighted: false },
    });
    const points = SCATTER_HZ.map((scatter, i) => {
      const appliedV = 50 * i;
      const nominal = nominalFrequencyHz(def.converter, ratio, appliedV) - def.converter.offsetHz;
      const frequencyHz = def.converter.offsetHz + BOARD_OFFSET_HZ[channel.key] + nominal * (1 + BOARD_GAIN_ERROR[channel.key]) + scatter;
      return { appliedV, frequencyHz: Math.round(frequencyHz * 10) / 10, counts: null, uncertaintyHz: null, excluded: false, excludedReason: '' };
    });
    await writePoints(dataSource, tester, session.id, points, 'replace');
    await dataSource.transaction(async (m) => {
      await m.getRepository(CalibrationSession).update({ id: session.id }, { state: 'complete', completedAt: new Date('2026-11-20T15:30:00Z') });
      await recordAudit(m, tester.id, 'calibration.complete', `calibration:${session.id}`, { seeded: true });
    });
    await currentRecord(dataSource, await getSession(dataSource, session.id)); // freezes record 1, as completing does
  }
}
