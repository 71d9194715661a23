import { z } from 'zod';
import { BOUNDS, boundProblem, MAX_PERIODS_AVERAGED, MAX_PRESCALER, TEMPERATURE_BOUND, type InputBound } from '../chain/bounds.js';

/** Largest number of resistors in a divider's top string. */
export const MAX_TOP_RESISTORS = 8;

const finite = (name: string) => z.number({ error: `${name} must be a number` }).refine(Number.isFinite, { error: `${name} must be finite` });
/** A number within its physical bound; the message names the input and the limit (`tolerance must be ≤ 50 %`). */
const within = (name: string, bound: InputBound) => z.number({
  error: (issue) => boundProblem(issue.input, name, bound) ?? `${name} must be a number`,
}).superRefine((v, ctx) => {
  const problem = boundProblem(v, name, bound);
  if (problem) ctx.addIssue({ code: 'custom', message: problem, input: v });
});
const temperature = (name: string) => within(name, TEMPERATURE_BOUND);

export const distributionSchema = z.enum(['rectangular', 'normal', 'triangular', 'u-shaped'], {
  error: 'distribution must be rectangular, normal, triangular or u-shaped',
});

export const resistorSchema = z.strictObject({
  nominalOhm: within('resistance', BOUNDS.resistance),
  tolerancePct: within('tolerance', BOUNDS.tolerance).default(1),
  toleranceDistribution: distributionSchema.default('rectangular'),
  /** For a normal tolerance: tolerance = k·σ. */
  toleranceCoverageFactor: within('coverage factor', BOUNDS.coverageFactor).default(2),
  /** Bound ±TCR, sampled rectangular. */
  tcrPpmPerK: within('TCR', BOUNDS.tcr).default(0),
  /** Bound ±voltage coefficient, sampled rectangular. */
  voltageCoefficientPpmPerV: within('voltage coefficient', BOUNDS.voltageCoefficient).default(0),
  ratedVoltageV: within('rated voltage', BOUNDS.ratedVoltage).optional(),
  ratedPowerW: within('rated power', BOUNDS.ratedPower).optional(),
  thermalResistanceKPerW: within('thermal resistance', BOUNDS.thermalResistance).default(0),
});

export const dividerSchema = z.strictObject({
  top: z.array(resistorSchema).min(1, { error: 'top string must have at least 1 resistor' }).max(MAX_TOP_RESISTORS, { error: `top string must have at most ${MAX_TOP_RESISTORS} resistors` }),
  bottom: resistorSchema,
  /** Warn when a resistor's voltage or power exceeds this fraction of its rating. */
  deratingFraction: finite('derating fraction').refine((v) => v > 0 && v <= 1, { error: 'derating fraction must be in (0, 1]' }).default(0.8),
});

export const converterSchema = z.strictObject({
  gainHzPerV: within('converter gain', BOUNDS.converterGain),
  offsetHz: within('converter offset', BOUNDS.frequency).default(0),
  gainErrorPct: within('gain error', BOUNDS.gainError).default(0),
  offsetErrorHz: within('offset error', BOUNDS.frequency).default(0),
  gainTempcoPpmPerK: within('gain tempco', BOUNDS.gainTempco).default(0),
  offsetDriftHzPerK: within('offset drift', BOUNDS.offsetDrift).default(0),
  /** Peak of a bow 4x(1 − x) across full scale, random sign and size within ± this. */
  nonlinearityPctFs: within('nonlinearity', BOUNDS.nonlinearity).default(0),
  fullScaleHz: within('full-scale frequency', BOUNDS.fullScale),
  inputResistanceOhm: within('converter input resistance', BOUNDS.inputResistance).optional(),
  /** Bound ±, sampled rectangular; ignored without an input resistance. */
  inputResistanceTolerancePct: within('input resistance tolerance', BOUNDS.inputResistanceTolerance).default(0),
  /** Bound ±, sampled rectangular; ignored without an input resistance. */
  inputResistanceTempcoPpmPerK: within('input resistance tempco', BOUNDS.inputResistanceTempco).default(0),
  /** Bound ±input bias current, sampled rectangular. */
  inputBiasCurrentA: within('input bias current', BOUNDS.inputBiasCurrent).default(0),
});

/** A layout distance across the isolation barrier, mm: above a metre it is no longer a board. */
const DISTANCE_BOUND: InputBound = { min: 0, max: 1000, unit: 'mm', maxText: '1000 mm', positive: true };

export const isolatorSchema = z.strictObject({
  maxSignalRateBd: within('isolator signalling rate', BOUNDS.signalRate),
  pulseWidthDistortionS: within('pulse-width distortion', BOUNDS.pulseWidthDistortion).default(0),
  /** The isolator's rated working voltage across its barrier (its data sheet), V. */
  ratedWorkingVoltageV: within('rated working voltage', BOUNDS.ratedVoltage).optional(),
  /** The isolator's rated insulation test voltage, V. */
  ratedTestVoltageV: within('rated insulation test voltage', BOUNDS.ratedVoltage).optional(),
  /** Creepage and clearance the layout provides across the barrier, mm. */
  creepageMm: within('creepage', DISTANCE_BOUND).optional(),
  clearanceMm: within('clearance', DISTANCE_BOUND).optional(),
  /** The standard or rules the required values come from, as the designer names them; Tallyvolt holds no copy of any table. */
  isolationRule: z.string({ error: 'isolation rule must be text' }).trim().max(120, { error: 'isolation rule must be at most 120 characters' }).optional(),
  requiredCreepageMm: within('required creepage', DISTANCE_BOUND).optional(),
  requiredClearanceMm: within('required clearance', DISTANCE_BOUND).optional(),
  requiredTestVoltageV: within('required insulation test voltage', BOUNDS.ratedVoltage).optional(),
});

export const periodCaptureSchema = z.strictObject({
  method: z.literal('period'),
  clockHz: within('timer clock', BOUNDS.clock),
  prescaler: z.number().int({ error: 'prescaler must be a whole number' }).min(1, { error: 'prescaler must be ≥ 1' })
    .max(MAX_PRESCALER, { error: `prescaler must be ≤ ${MAX_PRESCALER}` }).default(1),
  periodsAveraged: z.number().int({ error: 'periods averaged must be a whole number' }).min(1, { error: 'periods averaged must be ≥ 1' })
    .max(MAX_PERIODS_AVERAGED, { error: `periods averaged must be ≤ ${MAX_PERIODS_AVERAGED}` }).default(1),
  counterBits: z.number().int().min(8, { error: 'counter width must be ≥ 8 bits' }).max(64, { error: 'counter width must be ≤ 64 bits' }).default(32),
  clockTolerancePpm: within('clock tolerance', BOUNDS.clockTolerance).default(0),
});

export const gatedCaptureSchema = z.strictObject({
  method: z.literal('gated'),
  gateS: within('gate time', BOUNDS.gate),
  counterBits: z.number().int().min(8, { error: 'counter width must be ≥ 8 bits' }).max(64, { error: 'counter width must be ≤ 64 bits' }).default(32),
  clockTolerancePpm: within('clock tolerance', BOUNDS.clockTolerance).default(0),
});

export const captureSchema = z.discriminatedUnion('method', [periodCaptureSchema, gatedCaptureSchema], {
  error: 'capture method must be period or gated',
});

export const reconstructionSchema = z.discriminatedUnion('mode', [
  z.strictObject({ mode: z.literal('nominal') }),
  z.strictObject({
    mode: z.literal('calibrated'),
    temperatureC: temperature('calibration temperature'),
    /** Two-point calibration voltages; default: the ends of the range. */
    pointsV: z.tuple([within('calibration point', BOUNDS.calibrationPoint), within('calibration point', BOUNDS.calibrationPoint)]).optional(),
    /** Expanded uncertainty (k = coverageFactor) of the calibrated gain, as a fraction. */
    gainUncertaintyFraction: within('calibration gain uncertainty', BOUNDS.calibrationGainUncertainty).default(0),
    offsetUncertaintyV: within('calibration offset uncertainty', BOUNDS.calibrationOffsetUncertainty).default(0),
    coverageFactor: within('calibration coverage factor', BOUNDS.coverageFactor).default(2),
  }),
], { error: 'reconstruction mode must be nominal or calibrated' });

export const environmentSchema = z.strictObject({
  minC: temperature('minimum temperature'),
  maxC: temperature('maximum temperature'),
  /** Temperature at which nominal values and tolerances hold. */
  referenceC: temperature('reference temperature').default(25),
}).refine((e) => e.maxC >= e.minC, { error: 'temperature range reversed' });

export const channelSchema = z.strictObject({
  name: z.string().trim().min(1, { error: 'channel name is required' }).max(80).default('channel'),
  rangeV: z.strictObject({ minV: within('range minimum', BOUNDS.rangeMin), maxV: within('range maximum', BOUNDS.rangeMax) })
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
