import { computed, type Ref } from 'vue';
import { formatEng } from '@shared/units';
import type { SessionDetail } from '@/services/calibrations';
import { formatPlain } from '@/utils/formatQuantity';
import { digitsFor, formatWithUncertainty } from '@/utils/formatUncertain';

export interface CoefficientRow {
  power: number;
  name: string;
  symbol: string;
  unit: string;
  value: string;
  uncertainty: string | null;
}

const NAMES = ['Offset', 'Gain', 'Quadratic term', 'Cubic term'];
const FORWARD_UNITS = ['Hz', 'Hz/V', 'Hz/V²', 'Hz/V³'];
const INVERSE_UNITS = ['V', 'V/Hz', 'V/Hz²', 'V/Hz³'];
const SUBSCRIPTS = ['₀', '₁', '₂', '₃'];
const POWERS = ['', '', '²', '³'];

function plainScatterHz(points: { residualHz: number | null }[], degreesOfFreedom: number): number {
  const squares = points.reduce((sum, p) => sum + (p.residualHz ?? 0) ** 2, 0);
  return Math.sqrt(squares / degreesOfFreedom);
}

/** What the fit panel, the charts and the points table read from a session's analysis. */
export function useCalibrationFit(session: Ref<SessionDetail | null>) {
  const fit = computed(() => session.value?.analysis.fit ?? null);
  const comparison = computed(() => session.value?.analysis.comparison ?? null);
  const reason = computed(() => session.value?.analysis.reason ?? null);

  /** Residual, studentised residual and suspect flag by stored point id. */
  const diagnostics = computed(() => new Map((fit.value?.points ?? []).map((p) => [p.id, p])));

  const coefficients = computed<CoefficientRow[]>(() => {
    const f = fit.value;
    if (!f) return [];
    return f.coefficients.map((b, k) => {
      const absent = k === 0 && !f.settings.intercept;
      const shown = formatWithUncertainty(b, absent ? null : f.standardErrors[k], FORWARD_UNITS[k]);
      return {
        power: k, name: absent ? 'Offset (held at zero)' : NAMES[k], symbol: `b${SUBSCRIPTS[k]}`, unit: FORWARD_UNITS[k],
        value: absent ? '0 Hz' : shown.value, uncertainty: absent ? null : shown.uncertainty,
      };
    });
  });

  /** V = c₀ + c₁·f (+ …): the firmware's form, with the digits the forward fit's uncertainty carries. */
  const firmware = computed(() => {
    const f = fit.value;
    if (!f) return null;
    const relative = f.coefficients[1] ? Math.abs(f.standardErrors[1] / f.coefficients[1]) : 0;
    const terms = f.inverse.coefficients.map((c, k) => {
      // Extra digits beyond the uncertainty for the higher terms, whose products with f^k are large.
      const digits = k === 0 ? digitsFor(c, f.standardErrors[0] / Math.abs(f.coefficients[1] || 1)) : Math.min(12, digitsFor(c, Math.abs(c) * relative) + k);
      return { symbol: `c${SUBSCRIPTS[k]}`, value: c === 0 ? `0 ${INVERSE_UNITS[k]}` : formatEng(c, INVERSE_UNITS[k], Math.max(digits, 3)), power: k };
    });
    const formula = 'V = ' + terms.map((t) => (t.power === 0 ? t.symbol : `${t.symbol}·f${POWERS[t.power]}`)).join(' + ');
    return { terms, formula, exact: f.inverse.exact, maxInverseErrorV: f.inverse.maxInverseErrorV };
  });

  const summary = computed(() => {
    const f = fit.value;
    if (!f) return null;
    return {
      // A weighted fit's s is at unit weight (the Birge ratio, no unit), so the scatter in hertz is the plain √(Σe²/ν).
      residualSd: formatEng(f.settings.weighted ? plainScatterHz(f.points, f.degreesOfFreedom) : f.residualStandardDeviationHz, 'Hz', 3),
      rSquared: f.rSquared >= 0.999999 ? formatPlain(f.rSquared, '', 9) : formatPlain(f.rSquared, '', 6),
      pointsUsed: f.pointsUsed,
      degreesOfFreedom: f.degreesOfFreedom,
      settings: `${['', 'Straight line', 'Quadratic', 'Cubic'][f.settings.degree]}, ${f.settings.intercept ? 'with offset' : 'through the origin'}, ${
        !f.settings.weighted ? 'unweighted' : f.weighting === 'absolute' ? 'weighted by 1/u² with u known' : 'weighted by 1/u², scaled by the scatter'}`,
      /** √(χ²/ν): near 1 when the stated u match the scatter. */
      birgeRatio: f.birgeRatio === null ? null : formatPlain(f.birgeRatio, '', 3),
    };
  });

  return { fit, comparison, reason, diagnostics, coefficients, firmware, summary };
}
