import type { FixedPointForm } from '../../../shared/fit/fixed-point.js';
import type { CountReadingForm } from '../../../shared/fit/count-reading.js';

/** A stated bound printed with two significant digits, rounded up so it stays a bound. */
export const boundText = (v: number): string => {
  if (v === 0) return '0';
  const step = 10 ** (Math.floor(Math.log10(v)) - 1);
  return (Math.ceil(v / step) * step).toExponential(1);
};

/**
 * The header's constants, coefficient tables and reading functions for one channel, every name under the
 * prefix (p upper case for macros, lower case for the rest). The fixed-point function is fixedPointReading in C:
 * the two must stay step for step the same, and the firmware export test compiles this and compares.
 */
export function cReadingCode(p: string, floatLiterals: readonly string[], form: FixedPointForm): string {
  const l = p.toLowerCase();
  const n = floatLiterals.length;
  return `#define ${p}_COEFF_COUNT ${n}
#define ${p}_FREQ_FRAC_BITS ${form.frequencyFracBits}
#define ${p}_MID_FX INT64_C(${form.midFx})
#define ${p}_HALF_FX INT64_C(${form.halfFx})
#define ${p}_LOW_FX INT64_C(${form.lowFx})
#define ${p}_HIGH_FX INT64_C(${form.highFx})
#define ${p}_U_FRAC_BITS ${form.uFracBits}
#define ${p}_VOLTS_FRAC_BITS ${form.voltsFracBits}

static const float ${l}_coeff[${n}] = { ${floatLiterals.join(', ')} };
static const int32_t ${l}_u_q[${n}] = { ${form.scaled.map((s) => `${s.q}`).join(', ')} };
static const uint8_t ${l}_u_shift[${n}] = { ${form.scaled.map((s) => `${s.shift}u`).join(', ')} };

/* round(n / d) for d > 0, halves away from zero. C99 division truncates toward zero; no negative value is shifted. */
static inline int64_t ${l}_div_round(int64_t n, int64_t d)
{
    return n >= 0 ? (n + d / 2) / d : -((-n + d / 2) / d);
}

/* Volts from the frequency in Hz in single precision: Horner's rule on ${l}_coeff. */
static inline float ${l}_volts_float(float f_hz)
{
    float v = 0.0f;
    int k;
    for (k = ${p}_COEFF_COUNT - 1; k >= 0; k--) v = v * f_hz + ${l}_coeff[k];
    return v;
}

/*
 * Volts x 2^${p}_VOLTS_FRAC_BITS from f_fx = the frequency in Hz x 2^${p}_FREQ_FRAC_BITS, in integers only.
 * The input is clamped to [LOW_FX, HIGH_FX], half the calibrated span beyond either end, so |u| <= 2 (u in Q30),
 * every running sum stays below 2^31 and every product below 2^62: nothing overflows int64.
 */
static inline int32_t ${l}_volts_fixed(uint32_t f_fx)
{
    const int64_t f_in = f_fx;
    const int64_t f = f_in < ${p}_LOW_FX ? ${p}_LOW_FX : f_in > ${p}_HIGH_FX ? ${p}_HIGH_FX : f_in;
    const int64_t u = ${l}_div_round((f - ${p}_MID_FX) * ((int64_t)1 << ${p}_U_FRAC_BITS), ${p}_HALF_FX);
    int64_t acc = 0;
    int k;
    for (k = ${p}_COEFF_COUNT - 1; k >= 0; k--) {
        /* coefficient k in units of the sum; at least 0 by construction, and |q| <= 2^30 leaves 0 past 31 */
        const int d = ${l}_u_shift[k] - ${p}_VOLTS_FRAC_BITS;
        const int64_t term = d > 31 ? 0 : ${l}_div_round(${l}_u_q[k], (int64_t)1 << d);
        acc = ${l}_div_round(acc * u, (int64_t)1 << ${p}_U_FRAC_BITS) + term;
    }
    return (int32_t)acc;
}
`;
}

/**
 * The count reading: whole millivolts from the raw capture in integers only, through the fixed-point reading
 * above. countReadingMv (shared/fit/count-reading.ts) is this function step for step; the integer read-back
 * test compiles both and compares them bit for bit.
 */
export function cCountReadingCode(p: string, form: CountReadingForm): string {
  const l = p.toLowerCase();
  const period = form.method === 'period';
  const constants = period
    ? `/* K = round(N x f_clk x 2^FREQ_FRAC_BITS / P); f = N x f_clk / (P x counts). Below 2^63, so K + counts / 2 stays within uint64_t. */
#define ${p}_COUNTS_K UINT64_C(${form.constant})`
    : `/* M = round(2^(FREQ_FRAC_BITS + S) / T_gate); f = counts / T_gate. Counts are clamped to CLAMP first, so counts x M + 2^(S-1) < 2^63. */
#define ${p}_COUNTS_M UINT64_C(${form.constant})
#define ${p}_COUNTS_S ${form.shift}
#define ${p}_COUNTS_CLAMP UINT64_C(${form.countsClamp})`;
  const toInput = period
    ? `    f_fx = counts == 0u ? (uint64_t)${p}_HIGH_FX : (${p}_COUNTS_K + counts / 2u) / counts;`
    : `    const uint64_t c = counts > ${p}_COUNTS_CLAMP ? ${p}_COUNTS_CLAMP : counts;
    f_fx = (c * ${p}_COUNTS_M${form.shift > 0 ? ` + ((uint64_t)1 << (${p}_COUNTS_S - 1))` : ''}) >> ${p}_COUNTS_S;`;
  return `${constants}
#define ${p}_COUNTS_MIN UINT64_C(${form.countsRange.min})
#define ${p}_COUNTS_MAX UINT64_C(${form.countsRange.max})

/*
 * Millivolts from the raw ${period ? 'period capture (timer ticks over the averaged periods)' : 'gated count (input edges counted in the gate)'}, integers only:
 * the counts become the fixed-point frequency input (clamped to HIGH_FX), ${l}_volts_fixed reads it, and the
 * result is rounded to whole millivolts (halves away from zero).
 */
static inline int32_t ${l}_millivolts_from_counts(uint64_t counts)
{
    uint64_t f_fx;
    int64_t v;
${toInput}
    if (f_fx > (uint64_t)${p}_HIGH_FX) f_fx = (uint64_t)${p}_HIGH_FX;
    v = ${l}_volts_fixed((uint32_t)f_fx);
    return (int32_t)${l}_div_round(v * 1000, (int64_t)1 << ${p}_VOLTS_FRAC_BITS);
}
`;
}
