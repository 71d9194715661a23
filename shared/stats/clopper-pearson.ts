import jStat from 'jstat';

function checkConfidence(confidence: number): void {
  if (!(confidence > 0 && confidence < 1)) throw new Error('confidence must be in (0, 1)');
}

/**
 * One-sided Clopper–Pearson upper confidence bound for a binomial probability after x events in
 * n independent trials: the p with P(X ≤ x | n, p) = 1 − confidence, i.e. the `confidence`
 * quantile of Beta(x + 1, n − x); 1 when x = n. With x = 0 it is 1 − (1 − confidence)^(1/n),
 * about 3/n at 95 % (the rule of three). A fractional x (an event count rescaled to fewer
 * independent trials) is taken through the same beta quantile.
 * @param events x, 0 ≤ x ≤ n (may be fractional)
 * @param trials n > 0 independent trials (may be fractional)
 * @param confidence one-sided confidence level in (0, 1), default 0.95
 * @returns the upper bound, a probability in (0, 1]
 * @throws if n is not > 0, x is outside [0, n], or the confidence is outside (0, 1)
 * @example clopperPearsonUpper(0, 1000) // 0.002991…
 */
export function clopperPearsonUpper(events: number, trials: number, confidence = 0.95): number {
  checkConfidence(confidence);
  if (!(trials > 0) || !Number.isFinite(trials)) throw new Error('trials must be > 0');
  if (!(events >= 0 && events <= trials)) throw new Error('events must be in [0, trials]');
  if (events === trials) return 1;
  if (events === 0) return -Math.expm1(Math.log1p(-confidence) / trials);
  return jStat.beta.inv(confidence, events + 1, trials - events) as number;
}

/**
 * One-sided Clopper–Pearson lower confidence bound: the p with P(X ≥ x | n, p) = 1 − confidence,
 * the `1 − confidence` quantile of Beta(x, n − x + 1); 0 when x = 0.
 * @param events x, 0 ≤ x ≤ n (may be fractional)
 * @param trials n > 0 independent trials (may be fractional)
 * @param confidence one-sided confidence level in (0, 1), default 0.95
 * @throws if n is not > 0, x is outside [0, n], or the confidence is outside (0, 1)
 * @example clopperPearsonLower(10, 10) // 0.7411…
 */
export function clopperPearsonLower(events: number, trials: number, confidence = 0.95): number {
  checkConfidence(confidence);
  if (!(trials > 0) || !Number.isFinite(trials)) throw new Error('trials must be > 0');
  if (!(events >= 0 && events <= trials)) throw new Error('events must be in [0, trials]');
  if (events === 0) return 0;
  if (events === trials) return Math.exp(Math.log1p(-confidence) / trials);
  return jStat.beta.inv(1 - confidence, events, trials - events + 1) as number;
}

/**
 * Fewest independent trials that can show a probability ≤ `probability` at the given confidence
 * when no event occurs: the least n with 1 − (1 − confidence)^(1/n) ≤ probability, i.e.
 * n = ⌈ln(1 − confidence)/ln(1 − probability)⌉ (about 3/probability at 95 %).
 * @param probability the probability to be shown, in (0, 1)
 * @param confidence one-sided confidence level in (0, 1), default 0.95
 * @throws if either argument is outside (0, 1)
 * @example trialsToShow(0.001) // 2995
 */
export function trialsToShow(probability: number, confidence = 0.95): number {
  checkConfidence(confidence);
  if (!(probability > 0 && probability < 1)) throw new Error('probability must be in (0, 1)');
  const n = Math.ceil(Math.log1p(-confidence) / Math.log1p(-probability));
  // The ratio may land a hair above an integer; step back while n − 1 already suffices.
  return n > 1 && clopperPearsonUpper(0, n - 1, confidence) <= probability ? n - 1 : n;
}
