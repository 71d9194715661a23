import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import session from 'express-session';
import { TypeormStore } from 'connect-typeorm';
import type { DataSource } from 'typeorm';
import type { AppConfig } from '../config.js';
import { SessionRecord } from '../entities/SessionRecord.js';

export const SESSION_COOKIE = 'tallyvolt.sid';
const TWELVE_HOURS_MS = 12 * 3600 * 1000;

/** Without SESSION_SECRET, keep a random one beside the database so sessions survive a restart. */
function sessionSecret(config: AppConfig): string {
  if (config.sessionSecret) return config.sessionSecret;
  if (config.databasePath === ':memory:') return crypto.randomBytes(32).toString('hex');
  const file = path.join(path.dirname(config.databasePath), 'session-secret');
  if (!fs.existsSync(file)) fs.writeFileSync(file, crypto.randomBytes(32).toString('hex'), { mode: 0o600 });
  return fs.readFileSync(file, 'utf8').trim();
}

/** Sessions live in SQLite (table `sessions`); the cookie is httpOnly, SameSite=Lax, Secure whenever the request is HTTPS. */
export function createSessionMiddleware(dataSource: DataSource, config: AppConfig) {
  const store = new TypeormStore({
    cleanupLimit: 2,
    ttl: TWELVE_HOURS_MS / 1000,
    // Without this the store disconnects for good on the first error (e.g. a busy database).
    onError: (_store, err) => console.error('[session] store error:', err.message),
  }).connect(dataSource.getRepository(SessionRecord));
  return session({
    name: SESSION_COOKIE,
    secret: sessionSecret(config),
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.trustProxy,
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: TWELVE_HOURS_MS },
  });
}
