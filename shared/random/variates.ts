import type { RandomGenerator } from 'pure-rand/types/RandomGenerator';

const TWO_POW_M26 = 1.4901161193847656e-8;
const TWO_POW_M53 = 1.1102230246251565e-16;

/**
 * Draws variates from one pure-rand generator without allocating per draw. Normals use
 * Box–Muller and keep the second value of each pair, so a source must stay with one block.
 */
export class VariateSource {
  private spare = 0;
  private hasSpare = false;

  constructor(private readonly rng: RandomGenerator) {}

  /** Uniform on [0, 1) with 53 random bits (two 32-bit draws). */
  uniform(): number {
    return (this.rng.next() & 0x3ffffff) * TWO_POW_M26 + (this.rng.next() & 0x7ffffff) * TWO_POW_M53;
  }

  /** Uniform on [0, 1) with 32 random bits (one draw): for phases, where 2⁻³² steps are ample. */
  uniform32(): number {
    return (this.rng.next() >>> 0) * 2.3283064365386963e-10;
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
