// End-to-end figures through the running server, started as `npm start` starts it (built client, worker bundled at
// build time, warm study threads): study time from POST to stored result, its slope in trials, peak memory of the
// server process (main thread and its workers together), event-loop delay, the margin study, and what the sign-in
// page moves over the wire. Printed beside each target, never asserted.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { build as buildWorker } from 'esbuild';
import { build as buildClient } from 'vite';
import { MAX_TRIALS } from '../../shared/schemas/runs.js';
import { verdict } from './verdict.js';

const ROOT = path.resolve(import.meta.dirname, '..', '..');

/** Peak and current resident memory of a process (its threads included), from Linux's /proc. */
function memoryMiB(pid: number): { peak: number; now: number } {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  const kib = (key: string) => Number(status.match(new RegExp(`${key}:\\s+(\\d+)`))?.[1] ?? NaN);
  return { peak: kib('VmHWM') / 1024, now: kib('VmRSS') / 1024 };
}

/** Starts counting the peak afresh (Linux: writing 5 to clear_refs resets VmHWM); false where not allowed. */
function resetPeak(pid: number): boolean {
  try {
    fs.writeFileSync(`/proc/${pid}/clear_refs`, '5');
    return true;
  } catch {
    return false;
  }
}

/** Bytes a browser that accepts br and gzip receives for one path (headers excluded), and its encoding. */
function overTheWire(url: string): Promise<{ bytes: number; encoding: string; status: number; cache: string }> {
  return new Promise((resolve, reject) => {
    http.get(url, { headers: { 'accept-encoding': 'br, gzip' } }, (res) => {
      let bytes = 0;
      res.on('data', (c: Buffer) => { bytes += c.length; });
      res.on('end', () => resolve({
        bytes, encoding: String(res.headers['content-encoding'] ?? 'identity'), status: res.statusCode ?? 0, cache: String(res.headers['cache-control'] ?? ''),
      }));
    }).on('error', reject);
  });
}

async function signInPageWeight(url: string): Promise<void> {
  const shell = await (await fetch(url)).text();
  const files = [...shell.matchAll(/(?:src|href)="(\/assets\/[^"]+\.(?:js|css))"/g)].map((m) => m[1]);
  let total = (await overTheWire(url)).bytes;
  const encodings = new Set<string>();
  let cache = '';
  for (const file of files) {
    const got = await overTheWire(url + file.slice(1));
    total += got.bytes;
    encodings.add(got.encoding);
    cache = got.cache;
  }
  const kB = total / 1000;
  console.log(`sign-in page over the wire: ${kB.toFixed(0)} kB (shell + ${files.length} scripts and styles, ${[...encodings].join('/')}; assets cached "${cache}") — target ≤ 150 kB: ${verdict(kB <= 150)}`);
}

interface Session { url: string; cookie: string; revisionId: number }

async function waitForRun(s: Session, runId: number): Promise<{ state: string; durationMs: number; error?: string }> {
  for (;;) {
    const run = (await (await fetch(`${s.url}api/runs/${runId}`, { headers: { cookie: s.cookie } })).json()).run;
    if (run.state !== 'queued' && run.state !== 'running') return run;
    await new Promise((r) => setTimeout(r, 10));
  }
}

/** Seconds from POST to a stored result, as a person waits for it. */
async function timeStudy(s: Session, kind: 'studies' | 'margin-studies', body: object): Promise<number> {
  const start = performance.now();
  const res = await fetch(`${s.url}api/revisions/${s.revisionId}/${kind}`, {
    method: 'POST', headers: { cookie: s.cookie, 'content-type': 'application/json' }, body: JSON.stringify(body),
  });
  if (res.status !== 202) throw new Error(`${kind} request failed: ${res.status} ${await res.text()}`);
  const run = await waitForRun(s, (await res.json()).run.id);
  if (run.state !== 'done') throw new Error(`${kind} ended ${run.state}: ${run.error}`);
  return (performance.now() - start) / 1000;
}

function slope(points: { trials: number; seconds: number }[]): { perMillion: number; intercept: number } {
  const n = points.length;
  const mx = points.reduce((a, p) => a + p.trials, 0) / n;
  const my = points.reduce((a, p) => a + p.seconds, 0) / n;
  const sxy = points.reduce((a, p) => a + (p.trials - mx) * (p.seconds - my), 0);
  const sxx = points.reduce((a, p) => a + (p.trials - mx) ** 2, 0);
  const b = sxy / sxx;
  return { perMillion: b * 1e6, intercept: my - b * mx };
}

export async function benchServer(): Promise<void> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-bench-'));
  const distDir = path.join(dir, 'dist');
  const bundle = path.join(dir, 'study-worker.mjs');
  await buildClient({ configFile: path.join(ROOT, 'vite.config.ts'), logLevel: 'silent', build: { outDir: distDir, emptyOutDir: true } });
  // The same build as `npm run build:worker`
  await buildWorker({
    entryPoints: [path.join(ROOT, 'server/workers/study.worker.ts')], bundle: true, platform: 'node', format: 'esm', target: 'node20',
    packages: 'external', tsconfig: path.join(ROOT, 'tsconfig.server.json'), outfile: bundle, logLevel: 'warning',
  });
  fs.symlinkSync(path.join(ROOT, 'node_modules'), path.join(dir, 'node_modules'));
  const server = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: ROOT,
    env: {
      ...process.env, TSX_TSCONFIG_PATH: 'tsconfig.server.json', PORT: '0', DATABASE_PATH: path.join(dir, 'bench.sqlite'), DIST_DIR: distDir,
      STUDY_WORKER_BUNDLE: bundle, RATE_LIMITS: 'false', TALLYVOLT_REPORT_EVENT_LOOP: '1',
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  let output = '';
  server.stdout.on('data', (c: Buffer) => { output += c.toString(); });
  try {
    const started = Date.now();
    while (!/serving on (http:\/\/\S+)/.test(output)) {
      if (Date.now() - started > 120_000) throw new Error(`server did not start:\n${output}`);
      await new Promise((r) => setTimeout(r, 100));
    }
    const url = `${output.match(/serving on (http:\/\/\S+)/)![1]}/`;
    const signIn = await fetch(`${url}api/auth/sign-in`, {
      method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'designer@example.test', password: 'tallyvolt-designer' }),
    });
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
    const design = (await (await fetch(`${url}api/designs`, { headers: { cookie } })).json()).items[0];
    const s: Session = { url, cookie, revisionId: design.latestRevision.id };
    console.log(`server: ${os.availableParallelism()} cores, study threads ${process.env.STUDY_THREADS ?? 'by default one fewer than the cores'} (STUDY_THREADS), load average ${os.loadavg()[0].toFixed(1)} at start`);
    await signInPageWeight(url);

    await new Promise((r) => setTimeout(r, 3000)); // idle first: the first study must find its threads warm
    const first = await timeStudy(s, 'studies', { trials: 1_000_000, seed: 1 });
    console.log(`first 10⁶-trial study after start and idling (two channels × 11 voltages, POST to stored result): ${first.toFixed(2)} s`);

    const points: { trials: number; seconds: number }[] = [];
    for (const trials of [10_000, 100_000, 500_000, 1_000_000, MAX_TRIALS]) {
      const runs: number[] = [];
      for (let seed = 2; seed < 5; seed++) runs.push(await timeStudy(s, 'studies', { trials, seed }));
      runs.sort((a, b) => a - b);
      points.push({ trials, seconds: runs[1] });
    }
    const lineFit = slope(points);
    console.log(`uncertainty study, POST to stored result, median of 3: ${points.map((p) => `${p.trials.toExponential(0)} trials ${p.seconds.toFixed(2)} s`).join('; ')}`);
    console.log(`  slope ${lineFit.perMillion.toFixed(2)} s per 10⁶ trials, intercept ${(lineFit.intercept * 1000).toFixed(0)} ms (fit over 10⁴…${MAX_TRIALS.toExponential(0)})`);
    const million = points.find((p) => p.trials === 1_000_000)!.seconds;
    const largest = points[points.length - 1].seconds;
    console.log(`  10⁶ trials: ${million.toFixed(2)} s — target ≤ 1.5 s: ${verdict(million <= 1.5)}; ${MAX_TRIALS.toExponential(0)} trials: ${largest.toFixed(2)} s — target ≤ 3 s: ${verdict(largest <= 3)}`);

    const loopBefore = output.split('\n').length;
    const peaks: string[] = [];
    let largestPeak = 0;
    for (const gridPoints of [11, 41]) {
      const reset = resetPeak(server.pid!);
      await timeStudy(s, 'studies', { trials: MAX_TRIALS, seed: 9, gridPoints });
      const mem = memoryMiB(server.pid!);
      if (gridPoints === 11) largestPeak = mem.peak;
      peaks.push(`${gridPoints} voltages: ${mem.peak.toFixed(0)} MiB${reset ? '' : ' (peak since start: clear_refs not allowed)'}`);
    }
    const loopMax = output.split('\n').slice(loopBefore).map((l) => l.match(/\[loop\] max ([\d.]+)/)).filter(Boolean).map((m) => Number(m![1]));
    console.log(`peak memory of the server and its workers, ${MAX_TRIALS.toExponential(0)}-trial two-channel study: ${peaks.join('; ')} — target ≤ 400 MiB (11 voltages): ${verdict(largestPeak <= 400)}`);
    const worstLoop = Math.max(0, ...loopMax);
    console.log(`event-loop delay while those studies ran: max ${worstLoop.toFixed(1)} ms — target ≤ 50 ms: ${verdict(worstLoop <= 50)} (npm run load measures p99 under requests)`);

    const margin: number[] = [];
    for (let seed = 1; seed <= 3; seed++) margin.push(await timeStudy(s, 'margin-studies', { trials: 1_000_000, seed }));
    margin.sort((a, b) => a - b);
    console.log(`margin study, 10⁶ trials, POST to stored result, median of 3: ${margin[1].toFixed(2)} s — target ≤ 0.5 s: ${verdict(margin[1] <= 0.5)}`);
  } finally {
    server.kill('SIGTERM');
    await new Promise((r) => server.once('exit', r));
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
