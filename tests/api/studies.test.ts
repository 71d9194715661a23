import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { putChannels } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { AnalysisRun } from '../../server/entities/AnalysisRun.js';
import { channelStudy } from '../../shared/propagation/index.js';

async function waitForRun(agent: Awaited<ReturnType<TestApp['signIn']>>, id: number, timeoutMs = 60_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const { body } = await agent.get(`/api/runs/${id}`);
    if (!['queued', 'running'].includes(body.run.state)) return body.run;
    if (Date.now() > end) throw new Error(`run ${id} still ${body.run.state}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('uncertainty studies in the worker pool', () => {
  let t: TestApp;
  let revisionId: number;
  beforeAll(async () => {
    t = await createTestApp();
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const { body } = await designer.post('/api/designs').send({ name: 'Study subject' });
    revisionId = body.design.revisions[0].id;
  });
  afterAll(async () => { await t.close(); });

  it('runs a study, stores the result, and reproduces it from the same seed', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const started = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 5000, seed: 1234, gridPoints: 5 });
    expect(started.status).toBe(202);
    expect(started.body.run).toMatchObject({ state: 'queued', seed: 1234, trials: 5000 });
    const run = await waitForRun(designer, started.body.run.id);
    expect(run.state).toBe('done');
    expect(run.progress).toBe(1);
    expect(run.current).toBe(true);
    expect(run.durationMs).toBeGreaterThanOrEqual(0);
    const channels = run.result.channels;
    expect(channels.map((c: { key: string }) => c.key)).toEqual(['pack', 'link']);
    const point = channels[0].study.points[4];
    expect(point.voltageV).toBe(500);
    expect(point.monteCarlo.trials).toBe(5000);
    expect(point.gum.budget.length).toBeGreaterThan(3);
    expect(['exhaustive', 'signs-and-flips']).toContain(point.worstCase.method);

    // The stored result is what the engine gives when called directly with the same seed.
    const definition = run.inputs.channels[1].definition;
    const direct = channelStudy(definition, { seed: 1234, trials: 5000, gridPoints: 5, coverageProbability: 0.95 });
    expect(channels[1].study).toEqual(JSON.parse(JSON.stringify(direct)));

    const again = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 5000, seed: 1234, gridPoints: 5 });
    const rerun = await waitForRun(designer, again.body.run.id);
    expect(rerun.result).toEqual(run.result); // same seed, same numbers

    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const list = await lead.get(`/api/revisions/${revisionId}/studies`);
    expect(list.body.items.length).toBeGreaterThanOrEqual(2);
    expect(list.body.items[0].result).toBeUndefined(); // lists stay small
    expect((await lead.post(`/api/revisions/${revisionId}/studies`).send({ trials: 5000 })).status).toBe(403);
  });

  it('refuses bad study settings naming the field', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const res = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 10, coverageProbability: 2 });
    expect(res.status).toBe(400);
    expect(res.body.fields).toMatchObject({ trials: 'trials must be ≥ 1000', coverageProbability: 'coverageProbability must be < 1' });
    const both = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 5000, significantDigits: 2 });
    expect(both.status).toBe(400);
    expect(both.body.error).toMatch(/not both/);
  });

  it('marks a study stale once the draft changes', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const started = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2000, seed: 5 });
    await waitForRun(designer, started.body.run.id);
    const rev = (await designer.get(`/api/revisions/${revisionId}`)).body.revision;
    const channels = rev.channels.map((c: { key: string; definition: { divider: { bottom: { nominalOhm: number } } } }) => ({ key: c.key, definition: c.definition }));
    channels[0].definition.divider.bottom.nominalOhm = 33.2e3;
    await putChannels(designer, revisionId, { channels });
    const after = await designer.get(`/api/runs/${started.body.run.id}`);
    expect(after.body.run.current).toBe(false);
  });

  it('cancels a running study and limits how many one person may queue', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const big = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2_000_000, seed: 9 });
    expect(big.status).toBe(202);
    const second = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2_000_000, seed: 10 });
    expect(second.status).toBe(202);
    const third = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2000 });
    expect(third.status).toBe(429);
    expect(third.body.error).toMatch(/already have 2 studies/);
    expect((await designer.post(`/api/runs/${big.body.run.id}/cancel`)).status).toBe(202);
    expect((await designer.post(`/api/runs/${second.body.run.id}/cancel`)).status).toBe(202);
    const cancelled = await waitForRun(designer, big.body.run.id);
    expect(cancelled.state).toBe('cancelled');
    expect((await waitForRun(designer, second.body.run.id)).state).toBe('cancelled');
    const again = await designer.post(`/api/runs/${big.body.run.id}/cancel`);
    expect(again.status).toBe(409);
  });

  it('marks a run failed with the engine\'s reason and keeps serving', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const good = (await designer.get(`/api/revisions/${revisionId}`)).body.revision.channels[0].definition;
    // Stored directly, past the schema, as a corrupted snapshot would be.
    const repo = t.dataSource.getRepository(AnalysisRun);
    const bad = await repo.save(repo.create({
      revisionId, kind: 'uncertainty', inputsHash: 'x', seed: 1, trials: 2000, adaptiveDigits: null, state: 'queued', requestedById: 2,
      inputs: { channels: [{ key: 'pack', definition: { ...good, capture: { ...good.capture, clockHz: 0 } } }], coverageProbability: 0.95, gridPoints: 5 },
    }));
    t.scheduler.enqueue(bad.id);
    const failed = await waitForRun(designer, bad.id);
    expect(failed.state).toBe('failed');
    expect(failed.error).toMatch(/timer clock must be > 0 Hz/);
    expect((await designer.get('/api/auth/me')).status).toBe(200);
  });

  it('survives a worker thread that dies, and runs the next task', async () => {
    await expect(t.pool.run({ kind: 'fault', mode: 'exit' })).rejects.toThrow();
    await expect(t.pool.run({ kind: 'fault', mode: 'throw' })).rejects.toThrow('fault task asked to fail');
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const started = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2000, seed: 3 });
    expect((await waitForRun(designer, started.body.run.id)).state).toBe('done');
  });
});
