import { z } from 'zod';
import { channelSchema } from './chain.js';
import { listQuerySchema } from './common.js';
import { baseVersionSchema } from './save-version.js';

export const REVISION_STATES = ['draft', 'in_review', 'approved', 'changes_requested'] as const;
export type RevisionState = (typeof REVISION_STATES)[number];

/** The words people read for each state. */
export const REVISION_STATE_LABELS: Record<RevisionState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  changes_requested: 'Changes requested',
};

const designName = z
  .string({ error: 'name is required' })
  .trim()
  .min(2, { error: 'name must be at least 2 characters' })
  .max(120, { error: 'name must be at most 120 characters' });
const purpose = z.string({ error: 'purpose must be text' }).trim().max(2000, { error: 'purpose must be at most 2000 characters' });

export const designCreateSchema = z.strictObject({
  name: designName,
  purpose: purpose.default(''),
});
export type DesignCreateBody = z.infer<typeof designCreateSchema>;

export const designPatchSchema = z
  .strictObject({ name: designName.optional(), purpose: purpose.optional() })
  .refine((v) => v.name !== undefined || v.purpose !== undefined, { error: 'give name or purpose to change' });
export type DesignPatchBody = z.infer<typeof designPatchSchema>;

export const DESIGN_SORTS = ['name', 'owner', 'updatedAt', 'createdAt'] as const;
export type DesignSort = (typeof DESIGN_SORTS)[number];
export const designListQuerySchema = listQuerySchema.extend({
  search: z.string().trim().max(120, { error: 'search must be at most 120 characters' }).optional(),
  sort: z.enum(DESIGN_SORTS, { error: `sort must be one of ${DESIGN_SORTS.join(', ')}` }).default('updatedAt'),
  order: z.enum(['asc', 'desc'], { error: 'order must be asc or desc' }).default('desc'),
});

export const channelKeySchema = z
  .string({ error: 'channel key is required' })
  .regex(/^[a-z][a-z0-9-]{0,39}$/, { error: 'channel key must be lower-case letters, digits or dashes, starting with a letter' });

/** The whole content of a draft revision: its channels, in order. */
export const revisionChannelsSchema = z.strictObject({
  channels: z
    .array(z.strictObject({ key: channelKeySchema, definition: channelSchema }))
    .min(1, { error: 'a revision needs at least one channel' })
    .max(8, { error: 'a revision has at most 8 channels' })
    .refine((cs) => new Set(cs.map((c) => c.key)).size === cs.length, { error: 'channel keys must be different' }),
  note: z.string().max(2000, { error: 'note must be at most 2000 characters' }).optional(),
  /** The revision version the channels were edited from; a stale one is refused. */
  baseVersion: baseVersionSchema,
});
export type RevisionChannelsBody = z.infer<typeof revisionChannelsSchema>;

export const nextRevisionSchema = z.strictObject({
  fromRevisionId: z.number({ error: 'fromRevisionId must be a number' }).int().positive(),
});
