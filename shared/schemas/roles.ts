import { z } from 'zod';

/** The four roles; each API route names which of them may call it. */
export const ROLES = ['admin', 'designer', 'tester', 'lead'] as const;
export const roleSchema = z.enum(ROLES, { error: 'role must be one of admin, designer, tester, lead' });
export type Role = z.infer<typeof roleSchema>;

/**
 * Who may do what, named once: the server's route rules and the client's `session.can(...)` both read these,
 * so a page never offers an action the API would refuse.
 */
export const ROLE_GROUPS = {
  /** Anyone signed in with a role: reads designs, stock, boards, calibrations and reviews. */
  everyone: ROLES,
  /** Create and edit designs and revisions, start uncertainty studies, submit or reopen a revision. */
  designWriters: ['designer', 'admin'],
  /** Add, change, delete and import stock parts and the team's own preferred-value series. */
  stockKeepers: ['designer', 'admin'],
  /** Start (and, when they started it, cancel) a margin study; leads check margins before deciding. */
  marginRunners: ['designer', 'lead', 'admin'],
  /** Approve a revision or request changes. */
  reviewers: ['lead', 'admin'],
  /** Register boards, record and fit calibration points, complete or reopen a session. */
  calibrators: ['tester', 'admin'],
  /** People, invitations and the mail outbox. */
  administrators: ['admin'],
} as const satisfies Record<string, readonly Role[]>;
export type RoleGroup = keyof typeof ROLE_GROUPS;
