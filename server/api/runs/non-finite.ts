/**
 * The path of the first number in a study result that is NaN or ±Infinity (`channels[1].study.points[4].monteCarlo.mean`),
 * or null when every number is finite. JSON would store such a number as null and the study would look done.
 */
export function firstNonFinite(value: unknown, path = 'result'): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? null : path;
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) {
    const numbers = value as unknown as ArrayLike<number | bigint>;
    for (let i = 0; i < numbers.length; i++) {
      const n = numbers[i];
      if (typeof n === 'number' && !Number.isFinite(n)) return `${path}[${i}]`;
    }
    return null;
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = firstNonFinite(value[i], `${path}[${i}]`);
      if (found) return found;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [key, v] of Object.entries(value)) {
      const found = firstNonFinite(v, `${path}.${key}`);
      if (found) return found;
    }
  }
  return null;
}

/** Why a run whose result holds a non-finite number failed, naming where it appeared. */
export const nonFiniteReason = (path: string): string =>
  `the study produced a number that is not finite at ${path}; an input is outside what the chain model can compute, so no result was kept`;
