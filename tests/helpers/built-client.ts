import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';

export const ARTIFACTS_DIR = path.resolve(import.meta.dirname, '..', 'artifacts');

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Each test run builds into its own folder, so two runs at once never serve each other's half-written files. */
export function builtClientDir(runId: string): string {
  return path.join(ARTIFACTS_DIR, `dist-${runId.replace(/[^A-Za-z0-9-]/g, '_')}`);
}

/**
 * Builds the client into tests/artifacts/dist-<run> (not dist/) the first time a browser test asks during
 * this run; test files in other workers wait on a lock folder instead of building again.
 */
export async function ensureBuiltClient(): Promise<string> {
  const runId = process.env.TALLYVOLT_TEST_RUN ?? 'standalone';
  const outDir = builtClientDir(runId);
  const lock = `${outDir}.lock`;
  fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
  for (;;) {
    try {
      fs.mkdirSync(lock);
      break;
    } catch {
      // A lock left by a killed run is stale after five minutes.
      const age = Date.now() - (fs.statSync(lock, { throwIfNoEntry: false })?.mtimeMs ?? Date.now());
      if (age > 300_000) fs.rmSync(lock, { recursive: true, force: true });
      await sleep(250);
    }
  }
  try {
    if (runId === 'standalone' || !fs.existsSync(path.join(outDir, 'index.html'))) {
      await build({
        configFile: path.resolve(import.meta.dirname, '..', '..', 'vite.config.ts'),
        logLevel: 'warn',
        build: { outDir, emptyOutDir: true },
      });
    }
  } finally {
    fs.rmdirSync(lock);
  }
  return outDir;
}
