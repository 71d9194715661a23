// Load check: signed-in reads of lists and a design at a steady 200 requests/s for 20 s against the real server on
// loopback, while 10⁶-trial uncertainty studies run in its worker pool the whole time (a new one is requested as
// each finishes). Prints latency, errors and event-loop delay. Run: npm run load. Targets: p99 < 50 ms, 0 errors.
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

/** autocannon's instance is an event emitter that settles with its result; its typings offer one or the other. */
function start(options: autocannon.Options) {
  let settle!: (r: autocannon.Result) => void;
  let fail!: (e: unknown) => void;
  const done = new Promise<autocannon.Result>((res, rej) => { settle = res; fail = rej; });
  const events = autocannon(options, (err, result) => (err ? fail(err) : settle(result)));
  return { events, done };
}

const RATE = 200;
const SECONDS = 20;
const CLIENTS = RATE;
/** Connections open and warm up for this long before the measured window; see steadyLoad. */
const WARM_UP_S = 3;

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-load-'));
const server = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
  cwd: ROOT,
  env: { ...process.env, TSX_TSCONFIG_PATH: 'tsconfig.server.json', PORT: '0', DATABASE_PATH: path.join(dir, 'load.sqlite'), RATE_LIMITS: 'false', TALLYVOLT_REPORT_EVENT_LOOP: '1', ...(process.env.STUDY_THREADS ? { STUDY_THREADS: process.env.STUDY_THREADS } : {}) },
  stdio: ['ignore', 'pipe', 'inherit'],
});
let output = '';
server.stdout.on('data', (c: Buffer) => { output += c.toString(); });
const stop = () => { server.kill('SIGTERM'); fs.rmSync(dir, { recursive: true, force: true }); };

interface LoadResult { latencies: number[]; errors: number; non2xx: number; steadyRate: number }

/**
 * A steady rate. autocannon's own rate option lets each connection send its whole quota back to back at the top
 * of every second, so "200/s" arrives as one burst of 200 followed by idle time, and its coordinated-omission
 * correction then assumes a 1 ms interval. Here each of 200 autocannon instances has one connection sending one
 * request a second, and they start 5 ms apart, so requests arrive evenly, like 200 open pages each reading once a
 * second. A stalled server still shows: a connection's next request waits behind its slow one.
 * Only responses in the 20 s after a warm-up count: starting 200 instances keeps the load process itself busy
 * for the first second or two, and those latencies measure the generator, not the server.
 */
async function steadyLoad(url: string, cookie: string, paths: string[]): Promise<LoadResult> {
  const latencies: number[] = [];
  let errors = 0;
  let non2xx = 0;
  const started = performance.now();
  const windowStart = started + WARM_UP_S * 1000;
  const windowEnd = windowStart + SECONDS * 1000;
  const runs: Promise<unknown>[] = [];
  for (let k = 0; k < CLIENTS; k++) {
    const order = paths.map((_, i) => paths[(i + k) % paths.length]);
    const instance = start({
      url, connections: 1, connectionRate: RATE / CLIENTS, duration: WARM_UP_S + SECONDS, headers: { cookie },
      requests: order.map((p) => ({ method: 'GET', path: p })),
      skipAggregateResult: true,
    });
    instance.events.on('response', (_client: unknown, status: number, _bytes: number, ms: number) => {
      const now = performance.now();
      if (now < windowStart || now >= windowEnd) return;
      latencies.push(ms);
      if (status < 200 || status > 299) non2xx++;
    });
    instance.events.on('reqError', () => { errors++; });
    runs.push(instance.done);
    await new Promise((r) => setTimeout(r, 1000 / RATE));
  }
  await Promise.all(runs);
  latencies.sort((a, b) => a - b);
  return { latencies, errors, non2xx, steadyRate: latencies.length / SECONDS };
}

/** LOAD_PACING=burst: autocannon's own pacing (10 connections, overallRate 200), for comparison with the steady load. */
async function burstLoad(url: string, cookie: string, paths: string[]): Promise<LoadResult> {
  const latencies: number[] = [];
  const instance = start({
    url, connections: 10, overallRate: RATE, duration: SECONDS, headers: { cookie },
    requests: paths.map((p) => ({ method: 'GET', path: p })),
  });
  instance.events.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => { latencies.push(ms); });
  const result = await instance.done;
  latencies.sort((a, b) => a - b);
  return { latencies, errors: result.errors, non2xx: result.non2xx, steadyRate: result.requests.average };
}

/** Keeps one 10⁶-trial study running until `until` resolves, requesting the next as each finishes. */
async function keepStudying(url: string, cookie: string, revisionId: number, until: Promise<unknown>) {
  let finished = false;
  void until.then(() => { finished = true; });
  const states: string[] = [];
  while (!finished) {
    const res = await fetch(`${url}/api/revisions/${revisionId}/studies`, {
      method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify({ trials: 1_000_000, seed: states.length + 1 }),
    });
    if (res.status !== 202) throw new Error(`study request failed: ${res.status} ${await res.text()}`);
    const runId = (await res.json()).run.id;
    for (;;) {
      await new Promise((r) => setTimeout(r, 250));
      const run = (await (await fetch(`${url}/api/runs/${runId}`, { headers: { cookie } })).json()).run;
      if (run.state !== 'queued' && run.state !== 'running') { states.push(`${run.state} in ${run.durationMs} ms`); break; }
      if (finished) { states.push(`${run.state} at ${(run.progress * 100).toFixed(0)} % when the load ended`); break; }
    }
  }
  return states;
}

try {
  const started = Date.now();
  while (!/serving on (http:\/\/\S+)/.test(output)) {
    if (Date.now() - started > 60_000) throw new Error(`server did not start:\n${output}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  const url = output.match(/serving on (http:\/\/\S+)/)![1];
  const signIn = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST', headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'designer@example.test', password: 'tallyvolt-designer' }),
  });
  const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
  const design = (await (await fetch(`${url}/api/designs`, { headers: { cookie } })).json()).items[0];
  const revisionId = design.latestRevision.id;
  const loopLinesBefore = output.split('\n').length;
  // The loop report prints once a second; skip the warm-up's lines so the figure covers the measured window.

  const load = (process.env.LOAD_PACING === 'burst' ? burstLoad : steadyLoad)(url, cookie, ['/api/designs', `/api/designs/${design.id}`, `/api/revisions/${revisionId}`, '/api/stock', '/api/boards']);
  // LOAD_WITHOUT_STUDY=1 measures the same reads on an idle server, to tell the studies' cost from the rest.
  const studies = process.env.LOAD_WITHOUT_STUDY ? Promise.resolve(null) : keepStudying(url, cookie, revisionId, load);
  const [{ latencies, errors, non2xx, steadyRate }, studyStates] = await Promise.all([load, studies]);

  const loopMax = output.split('\n').slice(loopLinesBefore).map((l) => l.match(/\[loop\] max ([\d.]+)/)).filter(Boolean).map((m) => Number(m![1]))
    .slice(process.env.LOAD_PACING === 'burst' ? 0 : WARM_UP_S);
  const q = (p: number) => latencies[Math.min(latencies.length - 1, Math.ceil(p * latencies.length) - 1)].toFixed(1);
  console.log(process.env.LOAD_PACING === 'burst'
    ? `requests: ${latencies.length}, ${steadyRate.toFixed(0)}/s average, paced by autocannon (each second's quota sent at its start)`
    : `requests: ${latencies.length} in the ${SECONDS} s after a ${WARM_UP_S} s warm-up, ${steadyRate.toFixed(0)}/s (${CLIENTS} connections, each one request a second, started ${1000 / RATE} ms apart)`);
  console.log(`latency: p50 ${q(0.5)} ms, p99 ${q(0.99)} ms, max ${q(1)} ms (target p99 < 50 ms)`);
  console.log(`errors: ${errors}, non-2xx: ${non2xx} (target 0)`);
  console.log(`maximum event-loop delay during the load: ${Math.max(0, ...loopMax).toFixed(1)} ms (per second: ${loopMax.map((v) => v.toFixed(0)).join(' ')})`);
  console.log(studyStates ? `10⁶-trial studies during the load: ${studyStates.join('; ')}` : 'no study during the load (LOAD_WITHOUT_STUDY)');
} finally {
  stop();
}
