import type { z } from 'zod';
import { marginInputsSchema } from './margin.js';
import { baseVersionSchema } from './save-version.js';

/** The body of a margin-inputs save: the inputs themselves and the version they were edited from. */
export const marginInputsSaveSchema = marginInputsSchema.safeExtend({ baseVersion: baseVersionSchema });
export type MarginInputsSaveBody = z.input<typeof marginInputsSaveSchema>;
