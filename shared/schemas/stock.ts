import { z } from 'zod';
import { listQuerySchema } from './common.js';

const finite = (name: string) =>
  z.number({ error: `${name} must be a number` }).refine(Number.isFinite, { error: `${name} must be finite` });

/** The most parts the stock holds; an import or a new part past it is refused, so lists and downloads stay bounded. */
export const STOCK_PART_LIMIT = 10_000;

/** One stock part as the API and the CSV import accept it (resistance already parsed to ohms). */
export const stockPartSchema = z.strictObject({
  ohms: finite('ohms').refine((v) => v > 0, { error: 'ohms must be > 0' }).refine((v) => v <= 1e12, { error: 'ohms must be ≤ 1 TΩ' }),
  tolerancePct: finite('tolerancePct').refine((v) => v > 0 && v <= 50, { error: 'tolerancePct must be in (0, 50] %' }),
  tcrPpmPerK: finite('tcrPpmPerK').refine((v) => v >= 0 && v <= 10_000, { error: 'tcrPpmPerK must be 0–10000 ppm/K' }).default(0),
  voltageCoefficientPpmPerV: finite('voltageCoefficientPpmPerV').refine((v) => v >= 0 && v <= 1000, { error: 'voltageCoefficientPpmPerV must be 0–1000 ppm/V' }).default(0),
  ratedVoltageV: finite('ratedVoltageV').refine((v) => v > 0 && v <= 1e6, { error: 'ratedVoltageV must be > 0 V' }).nullable().default(null),
  ratedPowerW: finite('ratedPowerW').refine((v) => v > 0 && v <= 1e4, { error: 'ratedPowerW must be > 0 W' }).nullable().default(null),
  package: z.string({ error: 'package must be text' }).trim().max(40, { error: 'package must be at most 40 characters' }).default(''),
  quantity: z.number({ error: 'quantity must be a number' }).int({ error: 'quantity must be a whole number' })
    .min(0, { error: 'quantity must be ≥ 0' }).max(10_000_000, { error: 'quantity must be ≤ 10000000' }).default(0),
  note: z.string({ error: 'note must be text' }).max(500, { error: 'note must be at most 500 characters' }).default(''),
});
export type StockPartBody = z.infer<typeof stockPartSchema>;

export const stockPartPatchSchema = stockPartSchema.partial();

export const STOCK_SORTS = ['ohms', 'tolerancePct', 'quantity', 'updatedAt'] as const;
export const stockListQuerySchema = listQuerySchema.extend({
  sort: z.enum(STOCK_SORTS, { error: `sort must be one of ${STOCK_SORTS.join(', ')}` }).default('ohms'),
  order: z.enum(['asc', 'desc'], { error: 'order must be asc or desc' }).default('asc'),
  search: z.string().trim().max(60, { error: 'search must be at most 60 characters' }).optional(),
});

/** CSV columns of the stock file, in export order; `value` takes engineering notation or an RKM code. */
export const STOCK_CSV_COLUMNS = ['value', 'tolerance_pct', 'tcr_ppm_per_k', 'voltage_coefficient_ppm_per_v', 'rated_voltage_v', 'rated_power_w', 'package', 'quantity', 'note'] as const;
export const STOCK_CSV_REQUIRED = ['value', 'tolerance_pct'] as const;
