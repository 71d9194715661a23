import { z } from 'zod';

export const idParamSchema = z.strictObject({
  id: z.coerce.number({ error: 'id must be a number' }).int({ error: 'id must be a whole number' }).positive({ error: 'id must be positive' }),
});

export const listQuerySchema = z.strictObject({
  page: z.coerce.number({ error: 'page must be a number' }).int({ error: 'page must be a whole number' }).min(1, { error: 'page must be ≥ 1' }).default(1),
  pageSize: z.coerce
    .number({ error: 'pageSize must be a number' })
    .int({ error: 'pageSize must be a whole number' })
    .min(1, { error: 'pageSize must be ≥ 1' })
    .max(200, { error: 'pageSize must be ≤ 200' })
    .default(50),
});

/** One problem in an uploaded file: its line number (the header is line 1), column and what is wrong. */
export interface RowProblem {
  row: number;
  column: string;
  problem: string;
}
