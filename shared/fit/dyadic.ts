/**
 * Exact binary fractions n·2^e (n a BigInt): every finite double is one, and sums and products of them stay
 * exact, so integer firmware arithmetic can be checked against a polynomial without any rounding of our own.
 */

/** The exact value n·2^e. */
export interface Dyadic {
  n: bigint;
  e: number;
}

const bits = new DataView(new ArrayBuffer(8));

/**
 * The double x as an exact n·2^e (IEEE 754 binary64: 52 fraction bits, exponent bias 1023).
 * @param x any finite number
 * @throws Error when x is not finite
 * @example dyadic(0.75) // { n: 3n, e: −2 }
 */
export function dyadic(x: number): Dyadic {
  if (!Number.isFinite(x)) throw new Error('a dyadic value needs a finite number');
  if (x === 0) return { n: 0n, e: 0 };
  bits.setFloat64(0, x);
  const high = bits.getUint32(0);
  const biased = (high >>> 20) & 0x7ff;
  const fraction = (BigInt(high & 0xfffff) << 32n) | BigInt(bits.getUint32(4));
  const magnitude = biased === 0 ? fraction : fraction | (1n << 52n);
  return { n: x < 0 ? -magnitude : magnitude, e: (biased === 0 ? 1 : biased) - 1075 };
}

/** a + b, exact. */
export function addDyadic(a: Dyadic, b: Dyadic): Dyadic {
  const e = Math.min(a.e, b.e);
  return { n: (a.n << BigInt(a.e - e)) + (b.n << BigInt(b.e - e)), e };
}

/** a·b, exact. */
export function mulDyadic(a: Dyadic, b: Dyadic): Dyadic {
  return { n: a.n * b.n, e: a.e + b.e };
}

/** −a, exact. */
export const negDyadic = (a: Dyadic): Dyadic => ({ n: -a.n, e: a.e });
/** |a|, exact. */
export const absDyadic = (a: Dyadic): Dyadic => ({ n: a.n < 0n ? -a.n : a.n, e: a.e });

/** Number of binary digits of |n| (0 for 0). */
export function bitLength(n: bigint): number {
  return (n < 0n ? -n : n).toString(2).length - (n === 0n ? 1 : 0);
}

/**
 * round(n/d) with halves away from zero, written with truncating division only, exactly as the C helper of the
 * firmware header does it (C99 6.5.5: integer division truncates toward zero).
 * @throws Error when d ≤ 0
 * @example divRound(-5n, 2n) // −3n
 */
export function divRound(n: bigint, d: bigint): bigint {
  if (d <= 0n) throw new Error('divisor must be > 0');
  return n >= 0n ? (n + d / 2n) / d : -((-n + d / 2n) / d);
}

/** round(a·2^s), halves away from zero: a held as an integer in units of 2^−s. */
export function roundToScale(a: Dyadic, s: number): bigint {
  const shift = a.e + s;
  return shift >= 0 ? a.n << BigInt(shift) : divRound(a.n, 1n << BigInt(-shift));
}

/** ceil(a·2^s): the smallest integer count of 2^−s not below a. */
export function ceilToScale(a: Dyadic, s: number): bigint {
  const shift = a.e + s;
  if (shift >= 0) return a.n << BigInt(shift);
  const d = 1n << BigInt(-shift);
  return a.n >= 0n ? (a.n + d - 1n) / d : -(-a.n / d);
}

/** The smallest integer E with |a| ≤ 2^E; −Infinity for 0. */
export function ceilLog2(a: Dyadic): number {
  if (a.n === 0n) return -Infinity;
  const magnitude = a.n < 0n ? -a.n : a.n;
  const length = bitLength(magnitude);
  const powerOfTwo = (magnitude & (magnitude - 1n)) === 0n;
  return a.e + (powerOfTwo ? length - 1 : length);
}

/** The double nearest a, to within one rounding of its leading 64 bits (for reports, not for further exact work). */
export function dyadicToNumber(a: Dyadic): number {
  const excess = Math.max(0, bitLength(a.n) - 64);
  const e = a.e + excess;
  // two factors, so that 2^e alone cannot underflow or overflow where the product would not
  return Number(a.n >> BigInt(excess)) * 2 ** Math.trunc(e / 2) * 2 ** (e - Math.trunc(e / 2));
}
