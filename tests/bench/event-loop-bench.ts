// While a 10⁶-trial uncertainty study runs in the server's worker pool, how long is the event loop blocked?
import 'reflect-metadata';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { createTestApp } from '../helpers/test-app.js';

export async function benchEventLoopDuringStudy(): Promise<void> {
  const t = await createTestApp({ rateLimits: false });
  try {
    const agent = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const { body } = await agent.post('/api/designs').send({ name: 'Bench subject' });
    const revisionId = body.design.revisions[0].id;
    const histogram = monitorEventLoopDelay({ resolution: 5 });
    histogram.enable();
    const start = performance.now();
    const started = await agent.post(`/api/revisions/${revisionId}/studies`).send({ trials: 1_000_000, seed: 42 });
    let polls = 0;
    let worstPollMs = 0;
    for (;;) {
      const before = performance.now();
      const { body: run } = await agent.get(`/api/runs/${started.body.run.id}`);
      worstPollMs = Math.max(worstPollMs, performance.now() - before);
      polls++;
      if (!['queued', 'running'].includes(run.run.state)) {
        if (run.run.state !== 'done') throw new Error(`study ended ${run.run.state}: ${run.run.error}`);
        break;
      }
      await new Promise((r) => setTimeout(r, 50));
    }
    histogram.disable();
    const seconds = (performance.now() - start) / 1000;
    console.log(`10⁶-trial two-channel study through the server: ${seconds.toFixed(2)} s; ${polls} status polls meanwhile, slowest ${worstPollMs.toFixed(1)} ms`);
    console.log(`event-loop delay during the study: max ${(histogram.max / 1e6).toFixed(1)} ms, p99 ${(histogram.percentile(99) / 1e6).toFixed(1)} ms, mean ${(histogram.mean / 1e6).toFixed(1)} ms`);
  } finally {
    await t.close();
  }
}
