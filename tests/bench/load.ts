// Load check: signed-in reads of lists and a design at 200 requests/s for 20 s against the real server on loopback while a
// 10⁶-trial uncertainty study runs in its worker pool. Prints latency, errors and event-loop delay.
// Run: npm run load. Targets: p99 < 50 ms, 0 errors.
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

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
  const get = async (p: string) => (await fetch(`${url}${p}`, { headers: { cookie } })).json();
  const design = (await get('/api/designs')).items[0];
  const revisionId = design.latestRevision.id;
  // LOAD_WITHOUT_STUDY=1 measures the same reads on an idle server, to tell the study's cost from the rest.
  const withStudy = !process.env.LOAD_WITHOUT_STUDY;
  const study = withStudy ? await fetch(`${url}/api/revisions/${revisionId}/studies`, {
    method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify({ trials: 1_000_000, seed: 1 }),
  }) : null;
  const runId = study ? (await study.json()).run.id : null;
  const loopLinesBefore = output.split('\n').length;

  const result = await autocannon({
    url,
    connections: 10,
    overallRate: 200,
    duration: 20,
    headers: { cookie },
    requests: [
      { method: 'GET', path: '/api/designs' },
      { method: 'GET', path: `/api/designs/${design.id}` },
      { method: 'GET', path: `/api/revisions/${revisionId}` },
      { method: 'GET', path: '/api/stock' },
      { method: 'GET', path: '/api/boards' },
    ],
  });
  const run = runId ? (await get(`/api/runs/${runId}`)).run : null;
  const loopMax = output.split('\n').slice(loopLinesBefore).map((l) => l.match(/\[loop\] max ([\d.]+)/)).filter(Boolean).map((m) => Number(m![1]));
  console.log(`requests: ${result.requests.total} in ${result.duration} s (${result.requests.average.toFixed(0)}/s average)`);
  console.log(`latency: p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms (target p99 < 50 ms)`);
  console.log(`errors: ${result.errors}, timeouts: ${result.timeouts}, non-2xx: ${result.non2xx} (target 0)`);
  console.log(`maximum event-loop delay during the load: ${Math.max(0, ...loopMax).toFixed(1)} ms (per second: ${loopMax.map((v) => v.toFixed(0)).join(' ')})`);
  console.log(run ? `study during the load: ${run.state}, progress ${(run.progress * 100).toFixed(0)} %, ${run.durationMs ?? '—'} ms` : 'no study during the load (LOAD_WITHOUT_STUDY)');
} finally {
  stop();
}
