import { z } from 'zod';
import { listQuerySchema } from './common.js';

const comment = z.string({ error: 'comment must be text' }).trim().max(4000, { error: 'comment must be at most 4000 characters' });

/** Shortest written reason accepted for an override: a few words, not a single character. */
export const MIN_JUSTIFICATION_CHARS = 20;

/**
 * Approving may carry a comment. Against failing checks it must also carry a justification and acknowledge
 * each failing check by key; the server compares both with the checks it computes itself.
 */
export const approveSchema = z.strictObject({
  comment: comment.default(''),
  justification: z.string({ error: 'justification must be text' }).trim().max(4000, { error: 'justification must be at most 4000 characters' }).default(''),
  acknowledged: z.array(z.string({ error: 'acknowledged must list check keys' }).max(120), { error: 'acknowledged must list check keys' })
    .max(200, { error: 'acknowledged lists at most 200 checks' }).default([]),
});
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
