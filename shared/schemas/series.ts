import { z } from 'zod';

/** The most values one decade of a team's series holds: as fine as E192, the finest IEC 60063 series. */
export const MAX_SERIES_VALUES = 192;

/** Names shaped like an IEC 60063 series (E3, E24…) are kept for the standard rows. */
const STANDARD_NAME = /^e\d+$/i;

export const seriesNameSchema = z.string({ error: 'name must be text' }).trim()
  .min(1, { error: 'name is required' })
  .max(40, { error: 'name must be at most 40 characters' })
  .refine((name) => !STANDARD_NAME.test(name), { error: 'name must not look like an IEC 60063 series (E3…E192); those are stored already' });

/** One value of one decade: a team's series is written the way IEC 60063 writes its tables, 1 ≤ v < 10. */
export const seriesValueSchema = z.number({ error: 'value must be a number' })
  .refine(Number.isFinite, { error: 'value must be finite' })
  .refine((v) => v >= 1 && v < 10, { error: 'value must be ≥ 1 and < 10 (one decade; 4.7 stands for 4.7 Ω, 47 Ω, 470 Ω…)' });

export const seriesValuesSchema = z.array(seriesValueSchema, { error: 'values must be a list of numbers' })
  .min(1, { error: 'values must hold at least one value' })
  .max(MAX_SERIES_VALUES, { error: `values must hold at most ${MAX_SERIES_VALUES} values per decade` })
  .refine((values) => new Set(values).size === values.length, { error: 'values must not repeat a value' })
  .transform((values) => [...values].sort((a, b) => a - b));

/** A team's own series by form: a name and one decade of values. */
export const seriesCreateSchema = z.strictObject({ name: seriesNameSchema, values: seriesValuesSchema });
export type SeriesCreateBody = z.infer<typeof seriesCreateSchema>;

/** Any stored series' name in a path (standard or the team's own). */
export const seriesNameParamsSchema = z.strictObject({
  name: z.string().trim().min(1, { error: 'name is required' }).max(40, { error: 'name must be at most 40 characters' }),
});

/** A CSV of one series: one value per row in the `value` column. */
export const SERIES_CSV_COLUMNS = ['value'] as const;

export const seriesImportQuerySchema = z.strictObject({
  name: seriesNameSchema,
  mode: z.enum(['preview', 'all', 'valid-only'], { error: 'mode must be preview, all or valid-only' }).default('preview'),
});
