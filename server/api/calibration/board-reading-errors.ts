import type { DataSource } from 'typeorm';
import { readingErrorSamples } from '../../../shared/precharge/index.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import { ConflictError } from '../../common/errors.js';
import { getBoard, sessionsOfBoards } from '../boards/boards.service.js';
import type { BoardReadingErrors } from '../margin/board-errors.js';
import { getSession, sessionChannel } from './sessions.service.js';
import { fitSession } from './session-fit.js';
import { lineUncertainty, referenceShare, withCommonReferenceError } from '../../../shared/fit/index.js';

const TRIALS = 20_000;
const SEED = 62;
const REFERENCE_SEED = 63;

/**
 * The reading errors of one built board, per channel, from its latest completed calibrations: the chain
 * read with that board's own line (calibrated at the bench temperature), so what remains is drift,
 * nonlinearity, quantisation and the calibration's own uncertainty. The coefficient standard errors go in as
 * the line's gain and offset uncertainty (k = 2); the reference instrument goes in as one error per simulated
 * calibration that moves gain and offset together (reference-share.ts), so a reading at V carries the
 * reference's bound at V, as the session's read-back uncertainty does.
 */
export async function boardReadingErrors(dataSource: DataSource, boardId: number): Promise<BoardReadingErrors> {
  const board = await getBoard(dataSource, boardId);
  const complete = (await sessionsOfBoards(dataSource, [boardId])).filter((s) => s.state === 'complete');
  const channels: BoardReadingErrors['channels'] = {};
  const dates: string[] = [];
  for (const summary of complete) {
    if (channels[summary.channelKey]) continue; // newest first: keep the latest per channel
    const session = await getSession(dataSource, summary.id);
    const definition = await sessionChannel(dataSource, session);
    const fit = fitSession({ ...session.fit, degree: 1 }, session.points, session.reference);
    const used = session.points.filter((p) => !p.excluded);
    const weights = fit.settings.weighted ? used.map((p) => 1 / (p.uncertaintyHz as number) ** 2) : undefined;
    const share = referenceShare(used.map((p) => p.appliedV), session.reference, { degree: 1, intercept: fit.settings.intercept, weights });
    const u = lineUncertainty(fit.standardErrors, fit.coefficients[1], share);
    const calibrated: ChannelDefinition = {
      ...definition,
      reconstruction: {
        mode: 'calibrated', temperatureC: session.ambientC, coverageFactor: 2,
        gainUncertaintyFraction: 2 * u.fit.gainFraction,
        offsetUncertaintyV: 2 * u.fit.offsetV,
      },
    };
    channels[summary.channelKey] = { kind: 'samples', ...withCommonReferenceError(readingErrorSamples(calibrated, { seed: SEED, trials: TRIALS }), share, REFERENCE_SEED) };
    dates.push(`${summary.channelKey} ${summary.performedOn}`);
  }
  if (dates.length === 0) throw new ConflictError(`board ${board.serialNumber} has no completed calibration yet`, { 'readingErrors.boardId': 'has no completed calibration' });
  return { description: `board ${board.serialNumber} (revision ${board.revision.letter}), calibrations: ${dates.join(', ')}`, channels };
}
