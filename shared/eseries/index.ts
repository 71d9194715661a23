export { E_SERIES_MANTISSAS } from './e-series-tables.js';
export type { ESeriesName } from './e-series-tables.js';
export {
  listESeriesNames,
  isESeriesName,
  eSeriesMantissas,
  eSeriesValuesInRange,
  nearestESeriesValue,
} from './e-series-values.js';
