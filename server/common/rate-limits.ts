import { rateLimit, ipKeyGenerator, type Store } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';
import { DEFAULT_SIGN_IN_DELAY, SignInDelay, type SignInDelayOptions } from './sign-in-delay.js';

const FIFTEEN_MINUTES_MS = 15 * 60 * 1000;

export interface SignInLimits {
  perIp: RequestHandler;
  /** Growing per-account wait after failures; null when rate limits are off. */
  delay: SignInDelay | null;
}

const passThrough: RequestHandler = (_req, _res, next) => next();

/**
 * Where counters live: in this process (SQLite, one instance) unless start-up names a shared store, so that
 * instances behind one proxy count together. Set by the app's start-up just while it builds its routes.
 */
let sharedStore: ((prefix: string) => Store) | null = null;
export function withRateLimitStore<T>(store: ((prefix: string) => Store) | null, build: () => T): T {
  sharedStore = store;
  try {
    return build();
  } finally {
    sharedStore = null;
  }
}

function limiter(prefix: string, limit: number, message: string, keyGenerator: (req: Request) => string, countFailuresOnly: boolean) {
  return rateLimit({
    ...(sharedStore ? { store: sharedStore(prefix) } : {}),
    windowMs: FIFTEEN_MINUTES_MS,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: countFailuresOnly,
    keyGenerator,
    handler: (_req, res) => res.status(429).json({ error: message }),
  });
}

/**
 * Sign-in is limited per client address (all attempts), so one address cannot spray many accounts, and per
 * account by a growing delay rather than a lockout, so many addresses cannot hammer one account yet no stranger
 * can lock its owner out.
 */
export function signInLimits(enabled: boolean, delay: SignInDelayOptions = DEFAULT_SIGN_IN_DELAY, perIp = 30): SignInLimits {
  if (!enabled) return { perIp: passThrough, delay: null };
  return {
    perIp: limiter('sign-in', perIp, 'too many sign-in attempts from this address; wait 15 minutes and try again',
      (req) => ipKeyGenerator(req.ip ?? 'unknown'), false),
    delay: new SignInDelay(delay),
  };
}

/** Password-reset requests and completions are limited per address, like sign-in. */
export function passwordResetLimit(enabled: boolean, limit = 10): RequestHandler {
  if (!enabled) return passThrough;
  return limiter('password-reset', limit, 'too many password-reset attempts from this address; wait 15 minutes and try again',
    (req) => ipKeyGenerator(req.ip ?? 'unknown'), false);
}

/** Invitation acceptance is limited per address: tokens are long, but guessing should still be slow. */
export function inviteLimit(enabled: boolean, limit = 30): RequestHandler {
  if (!enabled) return passThrough;
  return limiter('invite', limit, 'too many invitation attempts from this address; wait 15 minutes and try again',
    (req) => ipKeyGenerator(req.ip ?? 'unknown'), false);
}
