import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { readPublicUrl } from './common/public-url.js';
import { DEFAULT_SIGN_IN_DELAY, type SignInDelayOptions } from './common/sign-in-delay.js';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

export interface AppConfig {
  port: number;
  host: string;
  databasePath: string;
  /** DATABASE_URL (postgres://…): PostgreSQL for all data and pg-boss for studies; unset: the SQLite file. */
  databaseUrl: string | null;
  smtpUrl: string | null;
  mailFrom: string;
  /** Base URL used in links inside e-mails (see publicBaseUrl for the address used without it). */
  publicUrl: string | null;
  sessionSecret: string | null;
  trustProxy: boolean;
  rateLimits: boolean;
  /** Per-account sign-in delay after failures (SIGN_IN_DELAY_MS doubling up to SIGN_IN_DELAY_CAP_MS); on with rateLimits. */
  signInDelay: SignInDelayOptions;
  distDir: string;
  /** Worker threads for studies (default: one per core but one). */
  studyThreads: number;
  /** How long a writer waits for SQLite's lock before the request gets a 503. */
  busyTimeoutMs: number;
}

function flag(value: string | undefined, fallback: boolean): boolean {
  if (value === undefined || value === '') return fallback;
  return !['0', 'false', 'no', 'off'].includes(value.toLowerCase());
}

function readDatabaseUrl(value: string | undefined): string | null {
  if (!value) return null;
  if (!/^postgres(ql)?:\/\//i.test(value)) throw new Error('DATABASE_URL must start with postgres:// or postgresql://');
  return value;
}

/** What the data source opens: the PostgreSQL URL when one is set, else the SQLite file. */
export function databaseTarget(config: Pick<AppConfig, 'databasePath' | 'databaseUrl'>): string {
  return config.databaseUrl ?? config.databasePath;
}

/** Reads configuration from the environment; every variable is listed in the README. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const port = Number(env.PORT ?? 3000);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT must be 0–65535, got ${env.PORT}`);
  return {
    port,
    host: env.HOST ?? '127.0.0.1',
    databasePath: env.DATABASE_PATH ?? path.join(projectRoot, 'data', 'tallyvolt.sqlite'),
    databaseUrl: readDatabaseUrl(env.DATABASE_URL),
    smtpUrl: env.SMTP_URL || null,
    mailFrom: env.MAIL_FROM ?? 'Tallyvolt <tallyvolt@example.test>',
    publicUrl: readPublicUrl(env.PUBLIC_URL),
    sessionSecret: env.SESSION_SECRET || null,
    trustProxy: flag(env.TRUST_PROXY, false),
    rateLimits: flag(env.RATE_LIMITS, true),
    signInDelay: {
      firstMs: Math.max(1, Number(env.SIGN_IN_DELAY_MS) || DEFAULT_SIGN_IN_DELAY.firstMs),
      capMs: Math.max(1, Number(env.SIGN_IN_DELAY_CAP_MS) || DEFAULT_SIGN_IN_DELAY.capMs),
    },
    distDir: env.DIST_DIR ?? path.join(projectRoot, 'dist'),
    busyTimeoutMs: Math.max(0, Number(env.DB_BUSY_TIMEOUT_MS) || 5000),
    // One core stays free for the event loop, so requests are answered while a study runs.
    studyThreads: Math.max(1, Number(env.STUDY_THREADS) || os.availableParallelism() - 1),
  };
}
