// Reads the NIST StRD linear least-squares datasets copied into tests/fixtures.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export interface CertifiedParameter {
  name: string;
  estimate: string;
  std_dev: string;
}

export interface CertifiedDataset {
  model: string;
  intercept: boolean;
  parameters: CertifiedParameter[];
  residual_sd: string;
  r_squared: string;
  columns: string[];
  data: string[][];
}

const path = fileURLToPath(new URL('../../fixtures/nist-strd/certified.json', import.meta.url));
const certified = JSON.parse(readFileSync(path, 'utf8')) as Record<string, CertifiedDataset>;

/** The x and y columns and certified values of one dataset, deep-frozen. */
export function loadDataset(name: 'Norris' | 'NoInt1' | 'NoInt2' | 'Pontius') {
  const dataset = certified[name];
  const yColumn = dataset.columns.indexOf('y');
  const xColumn = dataset.columns.indexOf('x');
  return deepFreeze({
    x: dataset.data.map((row) => Number(row[xColumn])),
    y: dataset.data.map((row) => Number(row[yColumn])),
    estimates: dataset.parameters.map((parameter) => Number(parameter.estimate)),
    standardDeviations: dataset.parameters.map((parameter) => Number(parameter.std_dev)),
    residualSd: Number(dataset.residual_sd),
    rSquared: Number(dataset.r_squared),
  });
}

/** Number of matching significant digits, −log10(|a − c|/|c|) (∞ when equal). */
export function matchingDigits(actual: number, certifiedValue: number): number {
  if (actual === certifiedValue) return Infinity;
  return -Math.log10(Math.abs(actual - certifiedValue) / Math.abs(certifiedValue));
}

export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const inner of Object.values(value as object)) deepFreeze(inner);
    Object.freeze(value);
  }
  return value;
}
