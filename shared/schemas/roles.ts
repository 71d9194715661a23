import { z } from 'zod';

/** The four roles; each API route names which of them may call it. */
export const ROLES = ['admin', 'designer', 'tester', 'lead'] as const;
export const roleSchema = z.enum(ROLES, { error: 'role must be one of admin, designer, tester, lead' });
export type Role = z.infer<typeof roleSchema>;
