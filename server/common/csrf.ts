import type { RequestHandler } from 'express';
import { ForbiddenError } from './errors.js';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request defence for the cookie session: a state-changing request must come from our own
 * pages. Browsers say where a request comes from (Sec-Fetch-Site, else Origin); a cross-site one is refused.
 * Requests with neither header are not from a browser page (scripts, tests) and carry no ambient cookie risk.
 */
export const sameOriginOnly: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const site = req.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') {
    return next(new ForbiddenError('cross-site request refused: send it from Tallyvolt\'s own pages'));
  }
  const origin = req.get('origin');
  if (origin && origin !== 'null') {
    let host: string;
    try {
      host = new URL(origin).host;
    } catch {
      return next(new ForbiddenError('cross-site request refused: the Origin header is not a valid URL'));
    }
    if (host !== req.get('host')) return next(new ForbiddenError('cross-site request refused: send it from Tallyvolt\'s own pages'));
  } else if (origin === 'null') {
    return next(new ForbiddenError('cross-site request refused: requests from opaque origins are not accepted'));
  }
  next();
};
