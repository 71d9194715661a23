import { formatBudgetValue, formatSensitivityValue } from '@shared/units';

/** Dimensionless inputs read better in ppm or %, per-kelvin and per-volt ones in ppm/K and ppm/V (shared with the PDF). */
export const formatInputValue = formatBudgetValue;

/** Sensitivity coefficient c = ∂(error in V)/∂(input), with its unit V ÷ [input] (shared with the PDF). */
export const formatSensitivity = (value: number, unit: string): string => formatSensitivityValue(value, unit);
