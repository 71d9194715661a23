import { nominalReadouts } from '../../../shared/chain/index.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import type { ReportChainWarning } from '../../../shared/schemas/report-views.js';

/**
 * The editor's warnings for a stored channel, for the review and report: stresses over rating, ratings
 * not entered (stress not checked), counter overflow and the rest. A channel the engine now refuses
 * (stored before a bound existed) says why instead of hiding it.
 */
export function chainWarningsOf(definition: ChannelDefinition): ReportChainWarning[] {
  try {
    return nominalReadouts(definition).warnings.map(({ level, message, where }) => ({ level, message, where }));
  } catch (err) {
    return [{ level: 'warning', message: `the chain cannot be computed: ${(err as Error).message}`, where: 'channel' }];
  }
}
