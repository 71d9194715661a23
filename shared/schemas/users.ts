import { z } from 'zod';
import { roleSchema, type Role } from './roles.js';

export const userPatchSchema = z
  .strictObject({
    role: roleSchema.optional(),
    active: z.boolean({ error: 'active must be true or false' }).optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, { error: 'give role or active to change' });
export type UserPatchBody = z.infer<typeof userPatchSchema>;

/** What the API returns for a person; never the password hash. */
export interface PublicUser {
  id: number;
  email: string;
  displayName: string;
  role: Role;
  active: boolean;
  createdAt: string;
}
