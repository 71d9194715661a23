/** Link/pack ratio over time: lowest, nominal and highest of the trials used. */
export interface RatioEnvelope {
  timeS: number[];
  lowest: number[];
  nominal: number[];
  highest: number[];
}

/**
 * Envelope of the true link/pack ratio s(1 − e^(−t/τ)) over a time grid 0…endS across the
 * given trials' (s, τ) pairs (handbook RC charging).
 * @param steady steady-state fractions s of the trials
 * @param tauS time constants τ of the trials, s
 * @param nominal the design's own (s, τ)
 * @param endS end of the time grid, s (> 0)
 * @param points grid points, integer ≥ 2
 * @throws if endS is not > 0, points < 2, or the arrays differ in length
 * @example ratioEnvelope(s, tau, { steady: 1, tauS: 0.9 }, 5, 60)
 */
export function ratioEnvelope(
  steady: Float64Array, tauS: Float64Array, nominal: { steady: number; tauS: number }, endS: number, points: number,
): RatioEnvelope {
  if (!(endS > 0) || !Number.isFinite(endS)) throw new Error('envelope end time must be > 0 s');
  if (!Number.isInteger(points) || points < 2) throw new Error('envelope points must be an integer ≥ 2');
  if (steady.length !== tauS.length) throw new Error('steady fractions and time constants must pair up');
  const ratio = (s: number, tau: number, t: number): number => (tau === 0 ? s : s * (1 - Math.exp(-t / tau)));
  const envelope: RatioEnvelope = { timeS: [], lowest: [], nominal: [], highest: [] };
  for (let p = 0; p < points; p++) {
    const t = (endS * p) / (points - 1);
    let low = Infinity;
    let high = -Infinity;
    for (let i = 0; i < steady.length; i++) {
      const r = ratio(steady[i], tauS[i], t);
      if (r < low) low = r;
      if (r > high) high = r;
    }
    envelope.timeS.push(t);
    envelope.lowest.push(low);
    envelope.nominal.push(ratio(nominal.steady, nominal.tauS, t));
    envelope.highest.push(high);
  }
  return envelope;
}
