export { checkDecadeValues, decadeValuesInRange, nearestDecadeValue } from './e-series-values.js';
