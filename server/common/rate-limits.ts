import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';

const FIFTEEN_MINUTES_MS = 15 * 60 * 1000;

export interface SignInLimits {
  perIp: RequestHandler;
  perAccount: RequestHandler;
}

const passThrough: RequestHandler = (_req, _res, next) => next();

function limiter(limit: number, message: string, keyGenerator: (req: Request) => string, countFailuresOnly: boolean) {
  return rateLimit({
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
 * Sign-in is limited per client address (all attempts) and per account (failed attempts only), so one
 * address cannot spray many accounts and many addresses cannot hammer one account.
 */
export function signInLimits(enabled: boolean, perIp = 30, perAccount = 5): SignInLimits {
  if (!enabled) return { perIp: passThrough, perAccount: passThrough };
  return {
    perIp: limiter(perIp, 'too many sign-in attempts from this address; wait 15 minutes and try again',
      (req) => ipKeyGenerator(req.ip ?? 'unknown'), false),
    perAccount: limiter(perAccount, 'too many failed sign-ins for this account; wait 15 minutes and try again',
      (req) => `account:${String(req.body?.email ?? '').trim().toLowerCase()}`, true),
  };
}

/** Invitation acceptance is limited per address: tokens are long, but guessing should still be slow. */
export function inviteLimit(enabled: boolean, limit = 30): RequestHandler {
  if (!enabled) return passThrough;
  return limiter(limit, 'too many invitation attempts from this address; wait 15 minutes and try again',
    (req) => ipKeyGenerator(req.ip ?? 'unknown'), false);
}
