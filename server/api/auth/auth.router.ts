import type { PassportStatic } from 'passport';
import { signInSchema } from '../../../shared/schemas/auth.js';
import { UnauthorisedError } from '../../common/errors.js';
import type { SignInLimits } from '../../common/rate-limits.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import type { User } from '../../entities/User.js';
import { SIGN_IN_FAILED } from '../../common/passport.js';
import { SESSION_COOKIE } from '../../common/session.js';
import { signInTooSoon } from '../../common/sign-in-delay.js';
import { toPublicUser } from '../users/users.mapper.js';

export function authRoutes(passport: PassportStatic, limits: SignInLimits): RouteSpec[] {
  return [
    defineRoute({
      method: 'post', path: '/sign-in', access: 'public', body: signInSchema,
      before: [limits.perIp],
      handler: ({ body, req, res }) =>
        new Promise<void>((resolve, reject) => {
          const wait = limits.delay?.waitSeconds(body.email) ?? 0;
          if (wait > 0) {
            res.set('Retry-After', String(wait));
            return reject(signInTooSoon(wait));
          }
          req.body = body;
          passport.authenticate('local', (err: unknown, user: User | false) => {
            if (err) return reject(err);
            if (!user) {
              limits.delay?.failed(body.email);
              return reject(new UnauthorisedError(SIGN_IN_FAILED));
            }
            limits.delay?.succeeded(body.email);
            // passport ≥ 0.6 regenerates the session here, so a planted session id is useless.
            req.logIn(user, (loginErr) => {
              if (loginErr) return reject(loginErr);
              res.json({ user: toPublicUser(user) });
              resolve();
            });
          })(req, res, reject);
        }),
    }),
    defineRoute({
      method: 'post', path: '/sign-out', access: 'public',
      handler: ({ req, res }) =>
        new Promise<void>((resolve, reject) => {
          req.logOut((err) => {
            if (err) return reject(err);
            req.session.destroy((destroyErr) => {
              if (destroyErr) return reject(destroyErr);
              res.clearCookie(SESSION_COOKIE);
              res.status(204).end();
              resolve();
            });
          });
        }),
    }),
    // The client's start-up question "is anyone signed in?": nobody is a normal answer, not an error,
    // so a signed-out page load logs no failed request. /me keeps its 401 for callers that need a user.
    defineRoute({
      method: 'get', path: '/session', access: 'public',
      handler: ({ user, res }) => {
        res.json({ user: user ? toPublicUser(user) : null });
      },
    }),
    defineRoute({
      method: 'get', path: '/me', access: 'signed-in',
      handler: ({ user, res }) => {
        res.json({ user: toPublicUser(user) });
      },
    }),
  ];
}
