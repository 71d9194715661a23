import fs from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';
import helmet from 'helmet';
import compression from 'compression';
import { authRoutes } from './api/auth/auth.router.js';
import { passwordResetRoutes } from './api/auth/password-reset.router.js';
import { invitesRoutes } from './api/invites/invites.router.js';
import { outboxRoutes } from './api/outbox/outbox.router.js';
import { usersRoutes } from './api/users/users.router.js';
import { seriesRoutes } from './api/series/series.router.js';
import { stockRoutes } from './api/stock/stock.router.js';
import { designsRoutes } from './api/designs/designs.router.js';
import { revisionsRoutes } from './api/revisions/revisions.router.js';
import { revisionStudiesRoutes, runsRoutes } from './api/runs/runs.router.js';
import { boardsRoutes } from './api/boards/boards.router.js';
import { marginRoutes } from './api/margin/margin.router.js';
import { revisionReviewRoutes, reviewsRoutes } from './api/reviews/reviews.router.js';
import { reportRoutes } from './api/reports/reports.router.js';
import { calibrationRoutes } from './api/calibration/calibration.router.js';
import type { AppDeps } from './common/deps.js';
import { apiNotFound, errorHandler } from './common/errors.js';
import { configurePassport } from './common/passport.js';
import { inviteLimit, passwordResetLimit, signInLimits } from './common/rate-limits.js';
import { mountRoutes, type RouteTableRow } from './common/routes.js';
import { createSessionMiddleware } from './common/session.js';
import { sameOriginOnly } from './common/csrf.js';

export const JSON_BODY_LIMIT = '256kb';

export interface BuiltApp {
  app: express.Express;
  /** Every API route with the roles it admits; the access tests walk this table. */
  routeTable: RouteTableRow[];
}

export function createApp(deps: AppDeps): BuiltApp {
  const { dataSource, config } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  // upgrade-insecure-requests over plain HTTP (HOST=0.0.0.0 on a network) sends the browser to https for
  // every script, and the page stays blank: ask for it only on a request that came over HTTPS.
  const overHttps = helmet();
  const overHttp = helmet({ contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } } });
  app.use((req, res, next) => (req.secure ? overHttps : overHttp)(req, res, next));
  app.use(express.json({ limit: JSON_BODY_LIMIT }));
  app.use(createSessionMiddleware(dataSource, config));
  const passport = configurePassport(dataSource);
  app.use(passport.initialize());
  app.use(passport.session());

  app.use('/api', sameOriginOnly);
  const api = Router();
  const signIn = signInLimits(config.rateLimits, config.signInDelay);
  const routeTable: RouteTableRow[] = [
    ...mountRoutes(api, '/auth', authRoutes(passport, signIn)),
    ...mountRoutes(api, '/auth/password-reset', passwordResetRoutes(deps, passwordResetLimit(config.rateLimits), signIn.delay)),
    ...mountRoutes(api, '/users', usersRoutes(deps)),
    ...mountRoutes(api, '/invites', invitesRoutes(deps, inviteLimit(config.rateLimits))),
    ...mountRoutes(api, '/outbox', outboxRoutes(deps)),
    ...mountRoutes(api, '/series', seriesRoutes(deps)),
    ...mountRoutes(api, '/stock', stockRoutes(deps)),
    ...mountRoutes(api, '/designs', designsRoutes(deps)),
    ...mountRoutes(api, '/revisions', [...revisionsRoutes(deps), ...revisionStudiesRoutes(deps, deps.scheduler)]),
    ...mountRoutes(api, '/revisions', [...marginRoutes(deps), ...revisionReviewRoutes(deps), ...reportRoutes(deps)]),
    ...mountRoutes(api, '/reviews', reviewsRoutes(deps)),
    ...mountRoutes(api, '/runs', runsRoutes(deps, deps.scheduler)),
    ...mountRoutes(api, '/boards', boardsRoutes(deps)),
    ...mountRoutes(api, '/calibrations', calibrationRoutes(deps)),
  ].map((row) => ({ ...row, path: `/api${row.path}` }));
  app.use('/api', api);
  app.use('/api', apiNotFound);

  if (fs.existsSync(path.join(config.distDir, 'index.html'))) {
    // Client files go out compressed; hashed assets never change under their name, so they are kept a year
    app.use(compression());
    app.use('/assets', express.static(path.join(config.distDir, 'assets'), { index: false, immutable: true, maxAge: '1y' }));
    app.use(express.static(config.distDir, { index: false, maxAge: '1h' }));
    // Client-side routes: every other GET gets the app shell.
    // Relative to the client folder: the static sender refuses an absolute path through a dot-folder
    // (a checkout under ~/.local/share) as a dotfile.
    app.get('/{*splat}', (_req, res) => res.sendFile('index.html', { root: config.distDir }));
  }
  app.use(errorHandler);
  return { app, routeTable };
}
