import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';
import { ARTIFACTS_DIR } from '../helpers/built-client.js';
import { putChannels, putMarginInputs } from '../helpers/saves.js';

describe('revision comparison and isolation rating in the browser', () => {
  let rig: BrowserRig;
  let revisionId = 0;
  beforeAll(async () => {
    rig = await openBrowserRig();
    // The demo has A approved and B in review; the designer starts C from B and changes two values.
    const designer = await rig.app.signIn('designer@example.test', 'tallyvolt-designer');
    const design = (await designer.get('/api/designs')).body.items[0];
    const revisions = (await designer.get(`/api/designs/${design.id}`)).body.design.revisions;
    const started = await designer.post(`/api/designs/${design.id}/revisions`).send({ fromRevisionId: revisions[1].id });
    revisionId = started.body.revision.id;
    const channels = started.body.revision.channels.map((c: { key: string; definition: Record<string, unknown> }) => ({ key: c.key, definition: c.definition }));
    channels[0].definition.divider.bottom.nominalOhm = 4.75e3;
    channels[0].definition.isolator = { maxSignalRateBd: 1e6, ratedWorkingVoltageV: 400 };
    expect((await putChannels(designer, revisionId, { channels })).status).toBe(200);
    const inputs = (await designer.get(`/api/revisions/${revisionId}/margin-inputs`)).body.inputs;
    expect((await putMarginInputs(designer, revisionId, { ...inputs, isolationMarginPct: 25 })).status).toBe(200);
  });
  afterAll(async () => { await rig?.close(); });

  it('shows the lead every changed value old → new, marked, and the isolation warning at the set margin', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('lead@example.test');
    await page.getByLabel('Password').fill('tallyvolt-lead');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.goto(`${rig.baseUrl}/revisions/${revisionId}/review`);

    const changes = page.getByRole('region', { name: 'Revision comparison' });
    await changes.waitFor();
    const previous = changes.getByRole('table', { name: /Against revision B/ });
    const bottom = previous.getByRole('row', { name: /Bottom resistor resistance/ });
    await expect.poll(() => bottom.innerText()).toMatch(/4\.75 kΩ\s+▲ changed/);
    expect(await previous.getByRole('row', { name: /Isolation margin/ }).innerText()).toMatch(/—\s+25 %\s+▲ changed/);
    expect(await changes.getByRole('table', { name: /Against revision A/ }).isVisible()).toBe(true);

    await changes.screenshot({ path: path.join(ARTIFACTS_DIR, 'review-revision-compare.png') });

    // Unchanged values are one click away.
    const before = await previous.getByRole('row').count();
    await changes.getByLabel('Show unchanged values too').check();
    await expect.poll(() => previous.getByRole('row').count()).toBeGreaterThan(before);
    expect(await previous.getByRole('row', { name: /^Pack side · Divider Top resistor 1 resistance/ }).innerText()).toMatch(/1 MΩ\s+1 MΩ\s+same/);

    // Range maximum 500 V × 1.25 = 625 V against a 400 V rating (hand arithmetic in this test).
    const warnings = page.getByRole('region', { name: 'Design warnings' });
    expect(await warnings.innerText()).toContain('625 V, exceeds the isolator\'s rated working voltage 400 V');
  });

  it('gives the designer the isolation rating fields in the editor, warned at the range maximum', async () => {
    const { page } = rig;
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('tallyvolt-designer');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.goto(`${rig.baseUrl}/revisions/${revisionId}`);
    const rated = page.getByLabel(/^Rated working voltage/).first();
    await rated.waitFor();
    expect(await rated.inputValue()).toBe('400');
    await expect.poll(() => page.getByLabel(/^Standard or rules followed/).count()).toBeGreaterThan(0);
    // The editor checks without the margin: 500 V > 400 V (hand arithmetic in this test).
    expect(await page.locator('main').innerText()).toMatch(/the range maximum 500 V exceeds the isolator's rated working voltage 400 V/i);
  });

  it('prints the changed values in the report', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/revisions/${revisionId}/report`);
    const changes = page.getByRole('region', { name: 'Revision comparison' });
    await changes.waitFor();
    expect(await changes.innerText()).toContain('4.75 kΩ');
    expect(await changes.getByLabel('Show unchanged values too').count()).toBe(0);
  });
});
