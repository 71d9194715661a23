export { parseQuantity, parseEngineering, parseDecimal } from './parse-engineering.js';
export type { ParsedQuantity } from './parse-engineering.js';
export { formatEng } from './format-engineering.js';
export type { FormatEngOptions } from './format-engineering.js';
export { parseRkm, formatRkm, isRkmCode } from './rkm-code.js';
export { SI_PREFIX_EXPONENTS, normaliseUnit } from './si-prefixes.js';
export { divideUnits, sensitivityUnit } from './derived-unit.js';
export { formatPlainNumber, formatBudgetValue, formatSensitivityValue, budgetRowTexts } from './budget-format.js';
export type { BudgetRowTexts } from './budget-format.js';
