import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';

export const ARTIFACTS_DIR = path.resolve(import.meta.dirname, '..', 'artifacts');
export const BUILT_CLIENT_DIR = path.join(ARTIFACTS_DIR, 'dist');
const STAMP = path.join(ARTIFACTS_DIR, 'dist-run-id');
const LOCK = path.join(ARTIFACTS_DIR, 'dist-build.lock');

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Builds the client into tests/artifacts/dist (not dist/) the first time a browser test asks during this
 * run; test files in other workers wait on a lock folder instead of building again.
 */
export async function ensureBuiltClient(): Promise<string> {
  const runId = process.env.TALLYVOLT_TEST_RUN ?? 'standalone';
  fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
  for (;;) {
    try {
      fs.mkdirSync(LOCK);
      break;
    } catch {
      // A lock left by a killed run is stale after five minutes.
      const age = Date.now() - (fs.statSync(LOCK, { throwIfNoEntry: false })?.mtimeMs ?? Date.now());
      if (age > 300_000) fs.rmSync(LOCK, { recursive: true, force: true });
      await sleep(250);
    }
  }
  try {
    const built = fs.existsSync(STAMP) && fs.readFileSync(STAMP, 'utf8') === runId && fs.existsSync(path.join(BUILT_CLIENT_DIR, 'index.html'));
    if (!built) {
      await build({
        configFile: path.resolve(import.meta.dirname, '..', '..', 'vite.config.ts'),
        logLevel: 'warn',
        build: { outDir: BUILT_CLIENT_DIR, emptyOutDir: true },
      });
      fs.writeFileSync(STAMP, runId);
    }
  } finally {
    fs.rmdirSync(LOCK);
  }
  return BUILT_CLIENT_DIR;
}
