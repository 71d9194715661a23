/** Resistances of the link-side RC network, Ω; a leakage of Infinity means none. */
export interface LinkNetwork {
  prechargeOhm: number;
  leakageOhm: number;
  capacitanceF: number;
}

function checkNetwork(n: LinkNetwork): void {
  if (!(n.prechargeOhm >= 0)) throw new Error('pre-charge resistance must be ≥ 0 Ω');
  if (!(n.leakageOhm > 0)) throw new Error('leakage resistance must be > 0 Ω');
  if (!(n.capacitanceF > 0) || !Number.isFinite(n.capacitanceF)) throw new Error('link capacitance must be > 0 F');
  if (n.prechargeOhm === Infinity && n.leakageOhm === Infinity) throw new Error('pre-charge and leakage cannot both be open');
}

/**
 * Steady-state fraction of the pack voltage the link reaches: R_l/(R_p + R_l) (handbook RC
 * charging through a divider); 1 with no leakage, 0 with an open pre-charge path.
 * @param network R_p ≥ 0 Ω, R_l > 0 Ω (Infinity: none), C > 0 F
 * @throws if a value is out of range
 * @example steadyStateFraction({ prechargeOhm: 1.5e3, leakageOhm: 1.5e6, capacitanceF: 600e-6 }) // 0.999
 */
export function steadyStateFraction(network: LinkNetwork): number {
  checkNetwork(network);
  if (network.prechargeOhm === Infinity) return 0;
  if (network.leakageOhm === Infinity) return 1;
  return network.leakageOhm / (network.prechargeOhm + network.leakageOhm);
}

/**
 * Time constant of the link charging: τ = (R_p ‖ R_l)·C (handbook RC charging).
 * @param network R_p ≥ 0 Ω, R_l > 0 Ω (Infinity: none), C > 0 F
 * @returns τ in s
 * @throws if a value is out of range
 * @example timeConstantS({ prechargeOhm: 1.5e3, leakageOhm: Infinity, capacitanceF: 600e-6 }) // 0.9 s
 */
export function timeConstantS(network: LinkNetwork): number {
  checkNetwork(network);
  const { prechargeOhm: rp, leakageOhm: rl } = network;
  const parallel = rp === Infinity ? rl : rl === Infinity ? rp : (rp * rl) / (rp + rl);
  return parallel * network.capacitanceF;
}

/**
 * Link voltage as a fraction of the pack voltage t seconds after pre-charge starts from 0 V:
 * s·(1 − e^(−t/τ)) with s the steady-state fraction (handbook RC charging).
 * @param timeS t ≥ 0 s
 * @param network R_p, R_l, C
 * @throws if t is negative or the network is invalid
 * @example linkFractionAt(0.9 * Math.log(10), network) // 0.9 without leakage
 */
export function linkFractionAt(timeS: number, network: LinkNetwork): number {
  if (!(timeS >= 0)) throw new Error('time must be ≥ 0 s');
  const tau = timeConstantS(network);
  const s = steadyStateFraction(network);
  return tau === 0 ? s : s * (1 - Math.exp(-timeS / tau));
}

/**
 * Time for the link to reach fraction p of the pack voltage: t = −τ·ln(1 − p·(R_p + R_l)/R_l)
 * (handbook RC charging with a parallel leakage); Infinity when p ≥ R_l/(R_p + R_l) (never).
 * @param fraction p in (0, 1]
 * @param network R_p, R_l, C
 * @returns t in s, or Infinity if the fraction is never reached
 * @throws if p is outside (0, 1] or the network is invalid
 * @example timeToFractionS(0.95, { prechargeOhm: 1.5e3, leakageOhm: Infinity, capacitanceF: 600e-6 }) // 0.9·ln 20 s
 */
export function timeToFractionS(fraction: number, network: LinkNetwork): number {
  if (!(fraction > 0 && fraction <= 1)) throw new Error('fraction of pack voltage must be in (0, 1]');
  const s = steadyStateFraction(network);
  if (fraction >= s) return Infinity;
  return -timeConstantS(network) * Math.log(1 - fraction / s);
}
