import type { RandomGenerator } from 'pure-rand/types/RandomGenerator';

const TWO_POW_M26 = 1.4901161193847656e-8;
const TWO_POW_M53 = 1.1102230246251565e-16;

/**
 * Draws variates from one block's xoroshiro128+ stream without allocating per draw. The generator's
 * four state words are copied into this object and stepped here (the same recurrence as pure-rand's
 * xoroshiro128plus, so the same numbers), which keeps the hot loop free of a call through another
 * object. Normals use Box–Muller and keep the second value of each pair, so a source must stay with
 * one block.
 */
export class VariateSource {
  private spare = 0;
  private hasSpare = false;
  private s01: number;
  private s00: number;
  private s11: number;
  private s10: number;

  /** @throws if the generator is not a xoroshiro128+ stream (four 32-bit state words) */
  constructor(rng: RandomGenerator) {
    const state = rng.getState();
    if (state.length !== 4) throw new Error('a variate source needs a xoroshiro128+ stream');
    this.s01 = state[0] | 0;
    this.s00 = state[1] | 0;
    this.s11 = state[2] | 0;
    this.s10 = state[3] | 0;
  }

  /** Next 32-bit output, signed, as pure-rand's xoroshiro128plus next() gives it. */
  private next(): number {
    const out = (this.s00 + this.s10) | 0;
    const a0 = this.s10 ^ this.s00;
    const a1 = this.s11 ^ this.s01;
    const s00 = this.s00;
    const s01 = this.s01;
    this.s00 = (s00 << 24) ^ (s01 >>> 8) ^ a0 ^ (a0 << 16);
    this.s01 = (s01 << 24) ^ (s00 >>> 8) ^ a1 ^ ((a1 << 16) | (a0 >>> 16));
    this.s10 = (a1 << 5) ^ (a0 >>> 27);
    this.s11 = (a0 << 5) ^ (a1 >>> 27);
    return out;
  }

  /** Uniform on [0, 1) with 53 random bits (two 32-bit draws). */
  uniform(): number {
    return (this.next() & 0x3ffffff) * TWO_POW_M26 + (this.next() & 0x7ffffff) * TWO_POW_M53;
  }

  /** Uniform on [0, 1) with 32 random bits (one draw): for phases, where 2⁻³² steps are ample. */
  uniform32(): number {
    return (this.next() >>> 0) * 2.3283064365386963e-10;
  }

  /** Standard normal N(0, 1) by Box–Muller. */
  normal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    const radius = Math.sqrt(-2 * Math.log(1 - this.uniform()));
    const angle = 2 * Math.PI * this.uniform();
    this.spare = radius * Math.sin(angle);
    this.hasSpare = true;
    return radius * Math.cos(angle);
  }

  /** Rectangular on [lower, upper). */
  rectangular(lower: number, upper: number): number {
    return lower + (upper - lower) * this.uniform();
  }

  /** Symmetric triangular on (lower, upper): mean of two uniforms. */
  triangular(lower: number, upper: number): number {
    return lower + (upper - lower) * 0.5 * (this.uniform() + this.uniform());
  }

  /** U-shaped (arcsine) on [lower, upper]: centre + a·cos(πU). */
  arcsine(lower: number, upper: number): number {
    return 0.5 * (lower + upper) + 0.5 * (upper - lower) * Math.cos(Math.PI * this.uniform());
  }

  /**
   * A variate of unit half-width for a distribution code (see distributionCode):
   * rectangular/triangular/U-shaped on [−1, 1]; normal N(0, 1/k²) so that ±1 is ±k·σ.
   */
  unit(code: number, coverageFactor: number): number {
    switch (code) {
      case 0:
        return 2 * this.uniform() - 1;
      case 1:
        return this.normal() / coverageFactor;
      case 2:
        return this.uniform() + this.uniform() - 1;
      default:
        return Math.cos(Math.PI * this.uniform());
    }
  }
}
