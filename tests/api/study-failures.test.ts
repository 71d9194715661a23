import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { firstNonFinite } from '../../server/api/runs/non-finite.js';

async function waitForRun(agent: Awaited<ReturnType<TestApp['signIn']>>, id: number, timeoutMs = 60_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const { body } = await agent.get(`/api/runs/${id}`);
    if (!['queued', 'running'].includes(body.run.state)) return body.run;
    if (Date.now() > end) throw new Error(`run ${id} still ${body.run.state}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('studies that cannot give finite numbers', () => {
  let t: TestApp;
  let revisionId: number;
  beforeAll(async () => {
    t = await createTestApp();
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const { body } = await designer.post('/api/designs').send({ name: 'Bounds subject' });
    revisionId = body.design.revisions[0].id;
  });
  afterAll(async () => { await t.close(); });

  it('refuses a non-physical channel input when it is saved, naming the field and its limit', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const revision = (await designer.get(`/api/revisions/${revisionId}`)).body.revision;
    type Definition = { divider: { top: { tolerancePct: number }[] }; rangeV: { maxV: number }; environment: { maxC: number } };
    const channels = revision.channels.map((c: { key: string; definition: Definition }) => ({ key: c.key, definition: structuredClone(c.definition) }));
    channels[0].definition.divider.top[0].tolerancePct = 300;
    channels[1].definition.rangeV.maxV = 1e308;
    channels[1].definition.environment.maxC = 1e300;
    const res = await designer.put(`/api/revisions/${revisionId}/channels`).send({ channels, baseVersion: revision.version });
    expect(res.status).toBe(400);
    expect(res.body.fields).toMatchObject({
      'channels.0.definition.divider.top.0.tolerancePct': 'tolerance must be ≤ 50 %', // bound chosen in shared/chain/bounds.ts
      'channels.1.definition.rangeV.maxV': 'range maximum must be ≤ 100 kV', // bound chosen in shared/chain/bounds.ts
      'channels.1.definition.environment.maxC': 'maximum temperature must be ≤ 500 °C', // bound chosen in shared/chain/bounds.ts
    });
    const after = (await designer.get(`/api/revisions/${revisionId}`)).body.revision;
    expect(after.channels[0].definition.divider.top[0].tolerancePct).toBe(revision.channels[0].definition.divider.top[0].tolerancePct);
  });

  it('lists a rating that was not entered in the review report as a stress check not made', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const revision = (await designer.get(`/api/revisions/${revisionId}`)).body.revision;
    type Definition = { divider: { top: { ratedPowerW?: number }[] } };
    const channels = revision.channels.map((c: { key: string; definition: Definition }) => ({ key: c.key, definition: structuredClone(c.definition) }));
    delete channels[0].definition.divider.top[0].ratedPowerW;
    const saved = await designer.put(`/api/revisions/${revisionId}/channels`).send({ channels, baseVersion: revision.version });
    expect(saved.status).toBe(200);
    const report = (await designer.get(`/api/revisions/${revisionId}/report`)).body.report;
    const warnings = report.channels[0].warnings as { level: string; message: string; where: string }[];
    const note = warnings.find((w) => w.where === 'divider.top[0]');
    expect(note).toMatchObject({ level: 'info' });
    // template: 500 V over 4 × 1 MΩ + 32.4 kΩ ‖ 10 MΩ, P = I²R (Ohm's law, in the test)
    const loaded = (32.4e3 * 10e6) / (32.4e3 + 10e6);
    const watts = (500 / (4e6 + loaded)) ** 2 * 1e6;
    expect(note?.message).toBe(`top resistor 1 power rating not entered: stress not checked (dissipates ${Number(watts.toPrecision(3))} W at 500 V)`);
    expect(report.channels[1].warnings.some((w: { where: string }) => w.where === 'divider.top[0]')).toBe(false);
  });

  it('ends a run as failed, naming where, when its result holds a number that is not finite', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const run = t.pool.run.bind(t.pool);
    // Stands in for an engine result that overflowed: the real study, with one number made infinite on its way back.
    const spy = vi.spyOn(t.pool, 'run').mockImplementation(async (task, options) => {
      const result = await run(task, options) as { points: { monteCarlo: { standardDeviation: number } }[] };
      if (task.kind === 'channel-uncertainty') result.points[1].monteCarlo.standardDeviation = Number.POSITIVE_INFINITY;
      // A fixed-size study summarises each voltage in its own task
      if (task.kind === 'channel-summary' && task.outputs[0] === 1) (result as unknown as { standardDeviation: number }[])[0].standardDeviation = Number.POSITIVE_INFINITY;
      return result as never;
    });
    try {
      const started = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2000, seed: 4, gridPoints: 3 });
      expect(started.status).toBe(202);
      const failed = await waitForRun(designer, started.body.run.id);
      expect(failed.state).toBe('failed');
      expect(failed.error).toMatch(/not finite at result\.channels\[0\]\.study\.points\[1\]\.monteCarlo\.standardDeviation/);
      expect(failed.result ?? null).toBeNull();
    } finally {
      spy.mockRestore();
    }
    const again = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2000, seed: 4, gridPoints: 3 });
    expect((await waitForRun(designer, again.body.run.id)).state).toBe('done');
  });

  it('finds the first non-finite number anywhere in a result', () => {
    expect(firstNonFinite({ a: [1, { b: 2 }], c: Float64Array.of(1, 2) })).toBeNull();
    expect(firstNonFinite({ a: [1, { b: Number.NaN }] })).toBe('result.a[1].b');
    expect(firstNonFinite({ c: Float64Array.of(1, -Infinity) })).toBe('result.c[1]');
    expect(firstNonFinite({ n: null, s: 'x', ok: true })).toBeNull();
  });
});
