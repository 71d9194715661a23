/** What a session records about its reference instrument's own calibration, and whether it had lapsed. */
export interface ReferenceTraceability {
  instrumentId: string | null;
  certificateNumber: string | null;
  /** ISO date the reference's calibration falls due, or null when not recorded. */
  dueOn: string | null;
  /** True when the session was performed after the due date (on the due date itself is still within it). */
  overdue: boolean;
}

/**
 * The traceability of a session's reference instrument, with the overdue flag: performed strictly after the due
 * date. ISO dates (YYYY-MM-DD) compare correctly as strings.
 * @param performedOn ISO date the session was performed
 * @param stored the identifier, certificate number and due date as stored (absent in records made before they were kept)
 * @throws never
 * @example referenceTraceability('2026-11-20', { instrumentId: 'REF-7', certificateNumber: 'C-1', dueOn: '2026-11-19' }).overdue // true
 */
export function referenceTraceability(
  performedOn: string,
  stored: { instrumentId?: string | null; certificateNumber?: string | null; dueOn?: string | null } | null | undefined,
): ReferenceTraceability {
  const dueOn = stored?.dueOn ?? null;
  return {
    instrumentId: stored?.instrumentId ?? null,
    certificateNumber: stored?.certificateNumber ?? null,
    dueOn,
    overdue: dueOn !== null && performedOn > dueOn,
  };
}
