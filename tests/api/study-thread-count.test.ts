import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { channelStudy } from '../../shared/propagation/index.js';
import type { ChannelDefinition } from '../../shared/schemas/chain.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

async function waitForRun(agent: Agent, id: number, timeoutMs = 120_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const { body } = await agent.get(`/api/runs/${id}`);
    if (!['queued', 'running'].includes(body.run.state)) return body.run;
    if (Date.now() > end) throw new Error(`run ${id} still ${body.run.state}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The stored result of one study of a new design's first revision in an app with `threads` study threads. */
async function storedStudy(threads: number, apps: TestApp[], valuesBudgetBytes?: number) {
  const t = await createTestApp({ studyThreads: threads });
  apps.push(t);
  if (valuesBudgetBytes) t.scheduler.valuesBudgetBytes = valuesBudgetBytes;
  const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
  const { body } = await designer.post('/api/designs').send({ name: 'Thread-count subject' });
  const revisionId = body.design.revisions[0].id;
  const started = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 4_500, seed: 77, gridPoints: 4 });
  expect(started.status).toBe(202);
  const run = await waitForRun(designer, started.body.run.id);
  expect(run.state).toBe('done');
  const revision = (await designer.get(`/api/revisions/${revisionId}`)).body.revision;
  return { result: run.result, channels: revision.channels as { key: string; definition: ChannelDefinition }[] };
}

describe('a study through the server, whatever the number of study threads', () => {
  const apps: TestApp[] = [];
  afterAll(async () => { for (const t of apps) await t.close(); });

  it('stores the same result with one thread, with three, and in one pass per voltage, equal to the one-thread engine', async () => {
    const one = await storedStudy(1, apps);
    const three = await storedStudy(3, apps);
    expect(JSON.stringify(three.result)).toBe(JSON.stringify(one.result)); // same seed → same result: JCGM 101:2008 7.2 reproducible generator
    const onePerPass = await storedStudy(2, apps, 4_500 * 8); // room for one voltage: four passes per channel
    expect(JSON.stringify(onePerPass.result)).toBe(JSON.stringify(one.result)); // each pass draws the same trials (in this test)
    const engine = channelStudy(one.channels[0].definition, { seed: 77, trials: 4_500, gridPoints: 4 });
    expect(JSON.stringify(one.result.channels[0].study)).toBe(JSON.stringify(engine)); // the engine in this thread, unsplit (in this test)
  }, 240_000);
});
