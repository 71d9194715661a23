import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import session from 'express-session';
import { TypeormStore } from 'connect-typeorm';
import type { DataSource, EntityManager, Repository } from 'typeorm';
import type { AppConfig } from '../config.js';
import { SessionRecord } from '../entities/SessionRecord.js';

export const SESSION_COOKIE = 'tallyvolt.sid';
const TWELVE_HOURS_MS = 12 * 3600 * 1000;

/** Without SESSION_SECRET, keep a random one beside the database so sessions survive a restart. */
function sessionSecret(config: AppConfig): string {
  if (config.sessionSecret) return config.sessionSecret;
  // Every instance behind the proxy must sign cookies alike, and a file beside one instance is not shared.
  if (config.databaseUrl) throw new Error('SESSION_SECRET must be set when DATABASE_URL is set');
  if (config.databasePath === ':memory:') return crypto.randomBytes(32).toString('hex');
  const file = path.join(path.dirname(config.databasePath), 'session-secret');
  if (!fs.existsSync(file)) fs.writeFileSync(file, crypto.randomBytes(32).toString('hex'), { mode: 0o600 });
  return fs.readFileSync(file, 'utf8').trim();
}

const TOUCH_EVERY_MS = 5 * 60 * 1000;

/**
 * A sliding expiry makes the store write on every request; writing at most every five minutes per
 * session keeps the same idle timeout (to within five minutes of twelve hours) at a fraction of the writes.
 */
function throttleTouches(store: TypeormStore): void {
  const lastTouch = new Map<string, number>();
  const touch = store.touch.bind(store);
  store.touch = (sid, sess, callback) => {
    const now = Date.now();
    if (now - (lastTouch.get(sid) ?? 0) < TOUCH_EVERY_MS) return callback?.();
    if (lastTouch.size > 10_000) lastTouch.clear();
    lastTouch.set(sid, now);
    touch(sid, sess, callback);
  };
}

/**
 * The store's own read writes the current time into its SQL as a literal (TypeORM puts numeric parameters inline
 * on SQLite), so each request prepared a fresh statement, evicted a cached one and left both for the old-space
 * collector: the main cause of 20–50 ms collector pauses under steady load. Reading by id alone and checking the
 * expiry here uses one prepared statement for every session read.
 */
function readByIdOnly(store: TypeormStore, sessions: Repository<SessionRecord>): void {
  store.get = (sid, callback) => {
    sessions
      .findOne({ where: { id: sid } })
      .then((record) => {
        // bigint comes back as a number from SQLite and as a string from PostgreSQL.
        if (!record || Number(record.expiredAt) <= Date.now()) return callback(null, null);
        callback(null, JSON.parse(record.json));
      })
      .catch((err: unknown) => callback(err));
  };
}

/** Sessions live in the database (table `sessions`, SQLite or PostgreSQL), so every instance sees them; the cookie is httpOnly, SameSite=Lax, Secure whenever the request is HTTPS. */
export function createSessionMiddleware(dataSource: DataSource, config: AppConfig) {
  const store = new TypeormStore({
    cleanupLimit: 2,
    ttl: TWELVE_HOURS_MS / 1000,
    // Without this the store disconnects for good on the first error (e.g. a busy database).
    onError: (_store, err) => console.error('[session] store error:', err.message),
  }).connect(dataSource.getRepository(SessionRecord));
  readByIdOnly(store, dataSource.getRepository(SessionRecord));
  throttleTouches(store);
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

/**
 * Deletes every stored session of one person (passport keeps the user id at `passport.user` in the session JSON),
 * inside the caller's transaction, so a deactivated person or a reset password leaves no session to come back to.
 * Parsed here rather than matched in SQL so the same code serves SQLite and PostgreSQL.
 */
export async function endSessionsOf(manager: EntityManager, userId: number): Promise<number> {
  const repo = manager.getRepository(SessionRecord);
  const rows = await repo.find({ select: { id: true, json: true }, withDeleted: true });
  const ids = rows.filter((row) => {
    try {
      return (JSON.parse(row.json) as { passport?: { user?: unknown } }).passport?.user === userId;
    } catch {
      return false;
    }
  }).map((row) => row.id);
  for (let i = 0; i < ids.length; i += 500) await repo.delete(ids.slice(i, i + 500));
  return ids.length;
}
