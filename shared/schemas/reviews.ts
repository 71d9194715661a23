import { z } from 'zod';
import { listQuerySchema } from './common.js';

const comment = z.string({ error: 'comment must be text' }).trim().max(4000, { error: 'comment must be at most 4000 characters' });

/** Approving may carry a comment. */
export const approveSchema = z.strictObject({ comment: comment.default('') });
export type ApproveBody = z.infer<typeof approveSchema>;

/** Sending a revision back must say what to change. */
export const requestChangesSchema = z.strictObject({
  comment: z.string({ error: 'comment is required: say what to change' }).trim()
    .min(1, { error: 'comment is required: say what to change' }).max(4000, { error: 'comment must be at most 4000 characters' }),
});
export type RequestChangesBody = z.infer<typeof requestChangesSchema>;

export const REVIEW_LIST_STATES = ['in_review', 'changes_requested', 'approved', 'all'] as const;
export const reviewListQuerySchema = listQuerySchema.extend({
  state: z.enum(REVIEW_LIST_STATES, { error: `state must be one of ${REVIEW_LIST_STATES.join(', ')}` }).default('in_review'),
});
export type ReviewListQuery = z.infer<typeof reviewListQuerySchema>;
