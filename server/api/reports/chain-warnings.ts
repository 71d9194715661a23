import { isolationWarnings, ISOLATION_WARNING_CODES, nominalReadouts } from '../../../shared/chain/index.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import type { ReportChainWarning } from '../../../shared/schemas/report-views.js';

/**
 * The editor's warnings for a stored channel, for the review and report: stresses over rating, ratings
 * not entered (stress not checked), counter overflow, the isolation rating at the lead's margin and the rest. A channel the engine now refuses
 * (stored before a bound existed) says why instead of hiding it.
 */
export function chainWarningsOf(definition: ChannelDefinition, isolationMarginPct = 0): ReportChainWarning[] {
  try {
    // The editor checks the isolator without a margin; the review adds the one set with the margin inputs.
    const warnings = [...nominalReadouts(definition).warnings.filter((w) => !ISOLATION_WARNING_CODES.has(w.code)), ...isolationWarnings(definition, isolationMarginPct)];
    return warnings.map(({ level, message, where }) => ({ level, message, where }));
  } catch (err) {
    return [{ level: 'warning', message: `the chain cannot be computed: ${(err as Error).message}`, where: 'channel' }];
  }
}
