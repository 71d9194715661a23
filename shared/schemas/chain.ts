import { z } from 'zod';

/** Largest number of resistors in a divider's top string. */
export const MAX_TOP_RESISTORS = 8;

const finite = (name: string) => z.number({ error: `${name} must be a number` }).refine(Number.isFinite, { error: `${name} must be finite` });
const positive = (name: string, unit: string) => finite(name).refine((v) => v > 0, { error: `${name} must be > 0 ${unit}` });
const nonNegative = (name: string, unit: string) => finite(name).refine((v) => v >= 0, { error: `${name} must be ≥ 0 ${unit}` });

export const distributionSchema = z.enum(['rectangular', 'normal', 'triangular', 'u-shaped'], {
  error: 'distribution must be rectangular, normal, triangular or u-shaped',
});

export const resistorSchema = z.strictObject({
  nominalOhm: positive('resistance', 'Ω'),
  tolerancePct: nonNegative('tolerance', '%').default(1),
  toleranceDistribution: distributionSchema.default('rectangular'),
  /** For a normal tolerance: tolerance = k·σ. */
  toleranceCoverageFactor: positive('coverage factor', '').default(2),
  /** Bound ±TCR, sampled rectangular. */
  tcrPpmPerK: nonNegative('TCR', 'ppm/K').default(0),
  /** Bound ±voltage coefficient, sampled rectangular. */
  voltageCoefficientPpmPerV: nonNegative('voltage coefficient', 'ppm/V').default(0),
  ratedVoltageV: positive('rated voltage', 'V').optional(),
  ratedPowerW: positive('rated power', 'W').optional(),
  thermalResistanceKPerW: nonNegative('thermal resistance', 'K/W').default(0),
});

export const dividerSchema = z.strictObject({
  top: z.array(resistorSchema).min(1, { error: 'top string must have at least 1 resistor' }).max(MAX_TOP_RESISTORS, { error: `top string must have at most ${MAX_TOP_RESISTORS} resistors` }),
  bottom: resistorSchema,
  /** Warn when a resistor's voltage or power exceeds this fraction of its rating. */
  deratingFraction: finite('derating fraction').refine((v) => v > 0 && v <= 1, { error: 'derating fraction must be in (0, 1]' }).default(0.8),
});

export const converterSchema = z.strictObject({
  gainHzPerV: positive('converter gain', 'Hz/V'),
  offsetHz: nonNegative('converter offset', 'Hz').default(0),
  gainErrorPct: nonNegative('gain error', '%').default(0),
  offsetErrorHz: nonNegative('offset error', 'Hz').default(0),
  gainTempcoPpmPerK: nonNegative('gain tempco', 'ppm/K').default(0),
  offsetDriftHzPerK: nonNegative('offset drift', 'Hz/K').default(0),
  /** Peak of a bow 4x(1 − x) across full scale, random sign and size within ± this. */
  nonlinearityPctFs: nonNegative('nonlinearity', '% FS').default(0),
  fullScaleHz: positive('full-scale frequency', 'Hz'),
  inputResistanceOhm: positive('converter input resistance', 'Ω').optional(),
  /** Bound ±input bias current, sampled rectangular. */
  inputBiasCurrentA: nonNegative('input bias current', 'A').default(0),
});

export const isolatorSchema = z.strictObject({
  maxSignalRateBd: positive('isolator signalling rate', 'Bd'),
  pulseWidthDistortionS: nonNegative('pulse-width distortion', 's').default(0),
});

export const periodCaptureSchema = z.strictObject({
  method: z.literal('period'),
  clockHz: positive('timer clock', 'Hz'),
  prescaler: z.number().int({ error: 'prescaler must be a whole number' }).min(1, { error: 'prescaler must be ≥ 1' }).default(1),
  periodsAveraged: z.number().int({ error: 'periods averaged must be a whole number' }).min(1, { error: 'periods averaged must be ≥ 1' }).default(1),
  counterBits: z.number().int().min(8, { error: 'counter width must be ≥ 8 bits' }).max(64, { error: 'counter width must be ≤ 64 bits' }).default(32),
  clockTolerancePpm: nonNegative('clock tolerance', 'ppm').default(0),
});

export const gatedCaptureSchema = z.strictObject({
  method: z.literal('gated'),
  gateS: positive('gate time', 's'),
  counterBits: z.number().int().min(8, { error: 'counter width must be ≥ 8 bits' }).max(64, { error: 'counter width must be ≤ 64 bits' }).default(32),
  clockTolerancePpm: nonNegative('clock tolerance', 'ppm').default(0),
});

export const captureSchema = z.discriminatedUnion('method', [periodCaptureSchema, gatedCaptureSchema], {
  error: 'capture method must be period or gated',
});

export const reconstructionSchema = z.discriminatedUnion('mode', [
  z.strictObject({ mode: z.literal('nominal') }),
  z.strictObject({
    mode: z.literal('calibrated'),
    temperatureC: finite('calibration temperature'),
    /** Two-point calibration voltages; default: the ends of the range. */
    pointsV: z.tuple([finite('calibration point'), finite('calibration point')]).optional(),
    /** Expanded uncertainty (k = coverageFactor) of the calibrated gain, as a fraction. */
    gainUncertaintyFraction: nonNegative('calibration gain uncertainty', '').default(0),
    offsetUncertaintyV: nonNegative('calibration offset uncertainty', 'V').default(0),
    coverageFactor: positive('calibration coverage factor', '').default(2),
  }),
], { error: 'reconstruction mode must be nominal or calibrated' });

export const environmentSchema = z.strictObject({
  minC: finite('minimum temperature'),
  maxC: finite('maximum temperature'),
  /** Temperature at which nominal values and tolerances hold. */
  referenceC: finite('reference temperature').default(25),
}).refine((e) => e.maxC >= e.minC, { error: 'temperature range reversed' });

export const channelSchema = z.strictObject({
  name: z.string().trim().min(1, { error: 'channel name is required' }).max(80).default('channel'),
  rangeV: z.strictObject({ minV: nonNegative('range minimum', 'V'), maxV: positive('range maximum', 'V') })
    .refine((r) => r.maxV > r.minV, { error: 'voltage range reversed' }),
  divider: dividerSchema,
  converter: converterSchema,
  isolator: isolatorSchema.optional(),
  capture: captureSchema,
  reconstruction: reconstructionSchema.default({ mode: 'nominal' }),
  environment: environmentSchema,
});

export type Distribution = z.infer<typeof distributionSchema>;
export type ResistorDefinition = z.infer<typeof resistorSchema>;
export type DividerDefinition = z.infer<typeof dividerSchema>;
export type ConverterDefinition = z.infer<typeof converterSchema>;
export type IsolatorDefinition = z.infer<typeof isolatorSchema>;
export type CaptureDefinition = z.infer<typeof captureSchema>;
export type ReconstructionDefinition = z.infer<typeof reconstructionSchema>;
export type EnvironmentDefinition = z.infer<typeof environmentSchema>;
/** A fully specified channel (defaults applied): what the chain engine takes. */
export type ChannelDefinition = z.infer<typeof channelSchema>;
/** A channel as a form or request may send it (defaults optional). */
export type ChannelDefinitionInput = z.input<typeof channelSchema>;
