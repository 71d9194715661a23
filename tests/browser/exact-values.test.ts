import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

type Agent = Awaited<ReturnType<BrowserRig['app']['signIn']>>;

interface ChannelBody { key: string; definition: { divider: { top: { nominalOhm: number }[]; bottom: { nominalOhm: number } }; converter: { fullScaleHz: number } } }

async function waitForRun(agent: Agent, id: number) {
  for (let i = 0; i < 600; i++) {
    const { body } = await agent.get(`/api/runs/${id}`);
    if (!['queued', 'running'].includes(body.run.state)) return body.run;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`run ${id} did not finish`);
}

describe('fields keep the exact value behind what they show', () => {
  let rig: BrowserRig;
  let designer: Agent;
  let revisionId = 0;
  const pack = async () => ((await designer.get(`/api/revisions/${revisionId}`)).body.revision.channels as ChannelBody[]).find((c) => c.key === 'pack')!;

  beforeAll(async () => {
    rig = await openBrowserRig();
    designer = await rig.app.signIn('designer@example.test', 'tallyvolt-designer');
    const created = await designer.post('/api/designs').send({ name: 'Exact values check' });
    revisionId = created.body.design.revisions[0].id;
    // Stored values with more digits than the fields show (six significant digits).
    const { revision } = (await designer.get(`/api/revisions/${revisionId}`)).body;
    const channels = (revision.channels as ChannelBody[]).map((c) => ({ key: c.key, definition: structuredClone(c.definition) }));
    channels[0].definition.divider.top[0].nominalOhm = 1234567.891;
    channels[0].definition.converter.fullScaleHz = 40581.9371;
    const saved = await designer.put(`/api/revisions/${revisionId}/channels`).send({ channels, baseVersion: revision.version ?? 0 });
    expect(saved.status).toBe(200);
    const study = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 1000, gridPoints: 2, seed: 479167870 });
    expect(study.status).toBe(202);
    expect((await waitForRun(designer, study.body.run.id)).state).toBe('done');
  });
  afterAll(async () => { await rig?.close(); });

  it('saves loaded and typed values exactly after tabbing through their fields', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('tallyvolt-designer');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.goto(`${rig.baseUrl}/revisions/${revisionId}`);
    const panel = page.getByRole('tabpanel', { name: 'Pack side' });
    const top = panel.getByLabel('Top resistor 1 resistance');
    const fullScale = panel.getByLabel('Full-scale frequency');
    const bottom = panel.getByLabel('Bottom resistor resistance');
    await expect.poll(() => top.inputValue()).toBe('1.23457M'); // shown at six significant digits
    expect(await fullScale.inputValue()).toBe('40.5819k');

    // Through each shown value and back, as a person tabbing along the form would.
    for (const field of [top, fullScale]) {
      await field.focus();
      await page.keyboard.press('Tab');
      await page.keyboard.press('Shift+Tab');
      await page.keyboard.press('Tab');
    }
    await bottom.fill('33.21234k');
    await bottom.press('Tab');
    await expect.poll(() => bottom.inputValue()).toBe('33.2123k');
    await bottom.focus();
    await page.keyboard.press('Tab');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await expect.poll(async () => (await pack()).definition.divider.bottom.nominalOhm).toBe(33212.34); // as typed
    const stored = (await pack()).definition;
    expect(stored.divider.top[0].nominalOhm).toBe(1234567.891); // as loaded
    expect(stored.converter.fullScaleHz).toBe(40581.9371); // as loaded
  }, 90_000);

  it('reruns with the exact seed after tabbing through the seed field', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/revisions/${revisionId}/study`);
    await page.getByRole('button', { name: 'Rerun with this seed' }).click();
    const seed = page.getByRole('textbox', { name: 'Seed' });
    await expect.poll(() => seed.inputValue()).toBe('479167870'); // every digit of a whole number is shown
    await seed.focus();
    await page.keyboard.press('Tab');
    await page.getByLabel('Number of trials').fill('1k');
    await page.getByLabel('Number of trials').press('Tab');
    await page.getByRole('button', { name: 'Start the study' }).click();
    await expect.poll(async () => (await designer.get(`/api/revisions/${revisionId}/studies`)).body.items.length, { timeout: 20_000 }).toBe(2);
    const runs = (await designer.get(`/api/revisions/${revisionId}/studies`)).body.items as { seed: number }[];
    expect(runs.map((r) => r.seed)).toEqual([479167870, 479167870]); // the seed the first study used
  }, 90_000);
});
