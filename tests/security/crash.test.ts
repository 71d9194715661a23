import 'reflect-metadata';
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/bootstrap.js';
import { StockPart } from '../../server/entities/StockPart.js';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-crash-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

/** Starts the real server process and resolves with its URL and a way to wait for a line of its output. */
function startServer(databasePath: string) {
  // One process (tsx as a loader, not its CLI, which would run the server in a child we could not kill).
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: ROOT,
    env: { ...process.env, TSX_TSCONFIG_PATH: 'tsconfig.server.json', PORT: '0', DATABASE_PATH: databasePath, DIST_DIR: path.join(dir, 'no-dist'), TALLYVOLT_FAULT_PAUSE_IMPORT_MS: '60000', STUDY_THREADS: '1' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const waiters: { pattern: RegExp; resolve: (m: RegExpMatchArray) => void }[] = [];
  const feed = (chunk: Buffer) => {
    output += chunk.toString();
    for (const w of [...waiters]) {
      const m = output.match(w.pattern);
      if (m) { waiters.splice(waiters.indexOf(w), 1); w.resolve(m); }
    }
  };
  child.stdout.on('data', feed);
  child.stderr.on('data', feed);
  const waitFor = (pattern: RegExp, ms = 60_000) => new Promise<RegExpMatchArray>((resolve, reject) => {
    const m = output.match(pattern);
    if (m) return resolve(m);
    const timer = setTimeout(() => reject(new Error(`no ${pattern} in server output:\n${output}`)), ms);
    waiters.push({ pattern, resolve: (x) => { clearTimeout(timer); resolve(x); } });
  });
  return { child, waitFor };
}

describe('a crash in the middle of an import', () => {
  it('leaves the database intact and stores none of the batch', async () => {
    const databasePath = path.join(dir, 'crash.sqlite');
    const server = startServer(databasePath);
    const [, url] = await server.waitFor(/serving on (http:\/\/\S+)/);
    const signIn = await fetch(`${url}/api/auth/sign-in`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'designer@example.test', password: 'tallyvolt-designer' }),
    });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
    const rows = Array.from({ length: 5000 }, (_, i) => `${1000 + i},1,${i}`);
    const form = new FormData();
    form.append('file', new Blob([['value,tolerance_pct,quantity', ...rows].join('\n')]), 'big.csv');
    const importing = fetch(`${url}/api/stock/import?mode=all`, { method: 'POST', headers: { cookie }, body: form }).catch((e: Error) => e);
    await server.waitFor(/import paused inside its transaction/);
    server.child.kill('SIGKILL');
    expect(await importing).toBeInstanceOf(Error); // the connection died with the process
    await new Promise((resolve) => server.child.once('exit', resolve));

    const restarted = await openDatabase(databasePath);
    try {
      expect(await restarted.query('PRAGMA integrity_check')).toEqual([{ integrity_check: 'ok' }]);
      const stock = await restarted.getRepository(StockPart).find();
      expect(stock.filter((p) => p.ohms === 1001 || p.ohms === 5999)).toEqual([]); // rows from the killed batch
      expect(stock).toHaveLength(8); // the demo shelf only
    } finally {
      await restarted.destroy();
    }
  }, 120_000);
});
