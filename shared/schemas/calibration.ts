import { z } from 'zod';
import { channelKeySchema } from './designs.js';
import { baseVersionSchema } from './save-version.js';

const finite = (name: string) =>
  z.number({ error: `${name} must be a number` }).refine(Number.isFinite, { error: `${name} must be finite` });

export const CALIBRATION_STATES = ['draft', 'complete'] as const;
export type CalibrationState = (typeof CALIBRATION_STATES)[number];

const isoDate = (name: string) =>
  z.string({ error: `${name} is required` }).regex(/^\d{4}-\d{2}-\d{2}$/, { error: `${name} must be a date like 2026-12-02` })
    .refine((s) => !Number.isNaN(Date.parse(s)), { error: `${name} is not a real date` });

export const boardCreateSchema = z.strictObject({
  serialNumber: z.string({ error: 'serial number is required' }).trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9 ._/#-]{0,39}$/, { error: 'serial number must be 1–40 letters, digits or . _ / # - (starting with a letter or digit)' }),
  revisionId: z.number({ error: 'revisionId must be a number' }).int().positive({ error: 'revisionId must be positive' }),
  buildDate: isoDate('build date'),
  note: z.string().max(1000, { error: 'note must be at most 1000 characters' }).default(''),
  /** Must be true to build a board to a revision that is neither approved nor in review (a draft, or one sent back). */
  confirmDraft: z.boolean({ error: 'confirmDraft must be true or false' }).default(false),
});
export type BoardCreateBody = z.infer<typeof boardCreateSchema>;

export const fitSettingsSchema = z.strictObject({
  degree: z.union([z.literal(1), z.literal(2), z.literal(3)], { error: 'degree must be 1, 2 or 3' }).default(1),
  intercept: z.boolean({ error: 'intercept must be true or false' }).default(true),
  /** Weight points by 1/u² when they carry a standard uncertainty. */
  weighted: z.boolean({ error: 'weighted must be true or false' }).default(true),
  /**
   * How the u of a weighted fit are read: 'absolute' (known standard uncertainties: covariance (AᵀWA)⁻¹, no
   * rescaling) or 'relative' (only their proportions: scaled by χ²/ν, the Birge ratio squared). Absent means relative.
   */
  weighting: z.enum(['relative', 'absolute'], { error: 'weighting must be relative or absolute' }).optional(),
});
export type FitSettings = z.infer<typeof fitSettingsSchema>;

/** Reference instrument accuracy stated as ±(% of reading + volts), the usual meter specification. */
export const referenceSpecSchema = z.strictObject({
  description: z.string({ error: 'reference instrument is required' }).trim().min(2, { error: 'describe the reference instrument' })
    .max(200, { error: 'reference instrument must be at most 200 characters' }),
  percentOfReading: finite('reference % of reading').refine((v) => v >= 0 && v <= 10, { error: 'reference % of reading must be 0–10 %' }),
  plusVolts: finite('reference volts').refine((v) => v >= 0 && v <= 100, { error: 'reference volts must be 0–100 V' }),
  /** How the specification's bounds are read: rectangular (a limit) or a stated k. */
  coverageFactor: finite('reference coverage factor').refine((v) => v === 0 || (v >= 1 && v <= 3), { error: 'reference coverage factor must be 0 (rectangular limit) or 1–3' }).default(0),
});
export type ReferenceSpec = z.infer<typeof referenceSpecSchema>;

const traceText = (name: string) =>
  z.string({ error: `${name} must be text` }).trim().max(80, { error: `${name} must be at most 80 characters` })
    .transform((s) => (s === '' ? null : s)).nullable();

/**
 * The reference instrument's traceability: its own identifier (asset tag), the number of its calibration certificate
 * and the date that calibration is due. Each may be left empty (null) on a session recorded without them.
 */
export const referenceTraceabilityShape = {
  referenceInstrumentId: traceText('reference instrument identifier'),
  referenceCertificate: traceText('reference certificate number'),
  referenceDueOn: z.union([z.literal('').transform(() => null), isoDate('reference calibration due date')]).nullable(),
};
const traceabilityDefaults = {
  referenceInstrumentId: referenceTraceabilityShape.referenceInstrumentId.default(null),
  referenceCertificate: referenceTraceabilityShape.referenceCertificate.default(null),
  referenceDueOn: referenceTraceabilityShape.referenceDueOn.default(null),
};

export const sessionCreateSchema = z.strictObject({
  channelKey: channelKeySchema,
  performedOn: isoDate('date'),
  ...traceabilityDefaults,
  ambientC: finite('ambient temperature').refine((v) => v >= -40 && v <= 85, { error: 'ambient temperature must be −40…85 °C' }),
  reference: referenceSpecSchema,
  fit: fitSettingsSchema.default({ degree: 1, intercept: true, weighted: true }),
  note: z.string().max(1000, { error: 'note must be at most 1000 characters' }).default(''),
});
export type SessionCreateBody = z.infer<typeof sessionCreateSchema>;

// A patch leaves traceability fields it does not name as they are.
export const sessionPatchSchema = sessionCreateSchema.omit({ channelKey: true }).extend(referenceTraceabilityShape).partial();
export type SessionPatchBody = z.infer<typeof sessionPatchSchema>;

/** One bench pair: the applied (reference) voltage and what the board measured. */
export const calibrationPointSchema = z.strictObject({
  appliedV: finite('applied voltage').refine((v) => v >= -2000 && v <= 2000, { error: 'applied voltage must be within ±2000 V' }),
  frequencyHz: finite('frequency').refine((v) => v > 0 && v <= 1e9, { error: 'frequency must be > 0 Hz' }),
  /** Raw timer counts, when the frequency was derived from them. */
  counts: z.number().int({ error: 'counts must be a whole number' }).positive({ error: 'counts must be > 0' }).nullable().default(null),
  /** Standard uncertainty of the frequency reading, Hz. */
  uncertaintyHz: finite('uncertainty').refine((v) => v > 0, { error: 'uncertainty must be > 0 Hz' }).nullable().default(null),
  excluded: z.boolean().default(false),
  excludedReason: z.string().max(300, { error: 'reason must be at most 300 characters' }).default(''),
}).refine((p) => !p.excluded || p.excludedReason.trim().length > 0, { error: 'give a reason for excluding a point', path: ['excludedReason'] });
export type CalibrationPointBody = z.infer<typeof calibrationPointSchema>;

/**
 * Most points one calibration session holds, on every path (table save, CSV preview and import). A bench
 * calibration uses tens; the limit bounds what one request stores, fits and sends back.
 */
export const MAX_POINTS_PER_SESSION = 500;

/** The refusal when a session would hold more than the limit, naming both counts. */
export const pointsLimitMessage = (count: number): string =>
  `a session holds at most ${MAX_POINTS_PER_SESSION} points; this would make ${count}`;

export const pointsReplaceSchema = z.strictObject({
  // The length is checked before any point is read, so an oversized table costs no more than the limit.
  points: z.array(z.unknown(), { error: 'points must be a list' })
    .max(MAX_POINTS_PER_SESSION, { error: (issue) => pointsLimitMessage((issue.input as unknown[]).length) })
    .pipe(z.array(calibrationPointSchema)),
  /** The session's pointsVersion the table was edited from; a stale one is refused. */
  baseVersion: baseVersionSchema,
});

export const pointExclusionSchema = z.strictObject({
  excluded: z.boolean({ error: 'excluded must be true or false' }),
  reason: z.string().trim().max(300, { error: 'reason must be at most 300 characters' }).default(''),
  baseVersion: baseVersionSchema,
}).refine((p) => !p.excluded || p.reason.length > 0, { error: 'give a reason for excluding a point', path: ['reason'] });

/** Which CSV columns hold what; the import asks for this mapping after reading the header. */
export const csvMappingSchema = z.strictObject({
  appliedV: z.string({ error: 'choose the column with the applied voltage' }).min(1, { error: 'choose the column with the applied voltage' }),
  frequencyHz: z.string().min(1).optional(),
  counts: z.string().min(1).optional(),
  uncertaintyHz: z.string().min(1).optional(),
  /** ',' for files written with decimal commas (usually semicolon-separated). */
  decimalSeparator: z.enum(['.', ','], { error: 'decimal separator must be . or ,' }).optional(),
}).refine((m) => (m.frequencyHz === undefined) !== (m.counts === undefined), { error: 'choose either a frequency column or a counts column', path: ['frequencyHz'] });
export type CsvMapping = z.infer<typeof csvMappingSchema>;
