import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';
import { ARTIFACTS_DIR } from '../helpers/built-client.js';
import { hashPassword } from '../../server/common/passwords.js';
import { CalibrationPoint } from '../../server/entities/CalibrationPoint.js';
import { Channel } from '../../server/entities/Channel.js';
import { MarginInputsRecord } from '../../server/entities/MarginInputsRecord.js';
import { User } from '../../server/entities/User.js';

/** A second designer (invented) working on the same draft as the demo designer. */
const SECOND = { email: 'designer-two@example.test', displayName: 'Pell Arrowby', password: 'tallyvolt-designer-two' };

async function signIn(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === '/');
}

describe('two designers saving the same draft revision', () => {
  let rig: BrowserRig;
  let second: BrowserContext;
  let profile = '';
  let sharedRevisionId = 0;
  beforeAll(async () => {
    rig = await openBrowserRig();
    const users = rig.app.dataSource.getRepository(User);
    await users.save(users.create({ email: SECOND.email, displayName: SECOND.displayName, role: 'designer', passwordHash: await hashPassword(SECOND.password), active: true }));
    profile = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-chromium-second-'));
    second = await chromium.launchPersistentContext(profile, {
      executablePath: '/usr/bin/chromium', headless: true, viewport: { width: 1280, height: 860 },
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
  }, 120_000);
  afterAll(async () => {
    await second?.close();
    if (profile) fs.rmSync(profile, { recursive: true, force: true });
    await rig?.close();
  });

  it('refuses the later save, names who saved first, and keeps the later editor\'s change to put back over theirs', async () => {
    const first = rig.page;
    const other = second.pages()[0] ?? (await second.newPage());
    await signIn(first, rig.baseUrl, 'designer@example.test', 'tallyvolt-designer');
    await signIn(other, rig.baseUrl, SECOND.email, SECOND.password);

    const designer = await rig.app.signIn('designer@example.test', 'tallyvolt-designer');
    const revisionId = (await designer.post('/api/designs').send({ name: 'Shared draft' })).body.design.revisions[0].id;
    const url = `${rig.baseUrl}/revisions/${revisionId}`;
    await first.goto(url);
    await other.goto(url);
    const bottom = (page: Page, channel: string) => page.getByRole('tabpanel', { name: channel }).getByLabel('Bottom resistor resistance');
    // The editor loads its fonts and chunks first: give the first render time.
    await expect.poll(() => bottom(first, 'Pack side').isVisible(), { timeout: 20_000 }).toBe(true);
    await expect.poll(() => bottom(other, 'Pack side').isVisible(), { timeout: 20_000 }).toBe(true);

    // The first designer changes the pack side and saves.
    await bottom(first, 'Pack side').fill('33.2k');
    await bottom(first, 'Pack side').press('Tab');
    await first.getByRole('button', { name: 'Save', exact: true }).click();
    await expect.poll(() => first.getByText('All changes saved').isVisible()).toBe(true);

    // The second, still on the version both loaded, changes the link side and saves: refused, with who saved first.
    await other.getByRole('tab', { name: /Link side/ }).click();
    await bottom(other, 'Link side').fill('30.1k');
    await bottom(other, 'Link side').press('Tab');
    await other.getByRole('button', { name: 'Save', exact: true }).click();
    const notice = other.getByRole('alert').filter({ hasText: 'someone else saved first' });
    await expect.poll(() => notice.isVisible()).toBe(true);
    expect(await notice.innerText()).toMatch(/Tamsin Fenwright saved this revision's channels at .* while you were editing/);
    expect(await bottom(other, 'Link side').inputValue()).toBe('30.1k'); // their own edit is still on screen
    await other.screenshot({ path: path.join(ARTIFACTS_DIR, 'conflict-notice.png'), fullPage: true });

    // Loading their version shows it, and lists the second designer's own unsaved value beside the saved one.
    await other.getByRole('button', { name: 'Load their version' }).click();
    const kept = other.getByRole('region', { name: /Your unsaved channel values/ });
    await expect.poll(() => kept.isVisible()).toBe(true);
    expect(await kept.getByRole('row', { name: /Link side · Divider, bottom resistor/ }).innerText()).toMatch(/30100 Ω\s+32400 Ω/);
    await other.getByRole('tab', { name: /Pack side/ }).click();
    await expect.poll(() => bottom(other, 'Pack side').inputValue()).toBe('33.2k'); // the first designer's change is loaded
    await other.screenshot({ path: path.join(ARTIFACTS_DIR, 'conflict-kept.png'), fullPage: true });

    // Putting it back re-applies only the second designer's change over the saved version; saving now succeeds.
    await other.getByRole('button', { name: 'Put my changes back' }).click();
    expect(await bottom(other, 'Pack side').inputValue()).toBe('33.2k');
    await other.getByRole('tab', { name: /Link side/ }).click();
    await expect.poll(() => bottom(other, 'Link side').inputValue()).toBe('30.1k');
    await other.getByRole('button', { name: 'Save', exact: true }).click();
    await expect.poll(() => other.getByText('All changes saved').isVisible()).toBe(true);

    const stored = await rig.app.dataSource.getRepository(Channel).findBy({ revisionId });
    expect(stored.find((c) => c.key === 'pack')!.definition.divider.bottom.nominalOhm).toBe(33_200); // the first designer's value
    expect(stored.find((c) => c.key === 'link')!.definition.divider.bottom.nominalOhm).toBe(30_100); // the second designer's value
    sharedRevisionId = revisionId;
  }, 180_000);

  it('does the same for the margin inputs of that draft', async () => {
    const first = rig.page;
    const other = second.pages()[0];
    const url = `${rig.baseUrl}/revisions/${sharedRevisionId}/margin`;
    await first.goto(url);
    await other.goto(url);
    await expect.poll(() => first.locator('#mf-timeout').inputValue(), { timeout: 20_000 }).toBe('5');
    await expect.poll(() => other.locator('#mf-r').inputValue(), { timeout: 20_000 }).toBe('1.5k');

    await first.locator('#mf-timeout').fill('6');
    await first.locator('#mf-timeout').press('Tab');
    await first.getByRole('button', { name: 'Save the margin inputs' }).click();
    await expect.poll(() => first.getByText('Margin inputs saved').first().isVisible()).toBe(true);

    await other.locator('#mf-r').fill('2.2k');
    await other.locator('#mf-r').press('Tab');
    await other.getByRole('button', { name: 'Save the margin inputs' }).click();
    const notice = other.getByRole('alert').filter({ hasText: 'someone else saved first' });
    await expect.poll(() => notice.isVisible()).toBe(true);
    expect(await notice.innerText()).toMatch(/Tamsin Fenwright saved this revision's margin inputs at .* while you were editing/);
    expect(await other.locator('#mf-r').inputValue()).toBe('2.2k'); // their own edit is still on screen

    await other.getByRole('button', { name: 'Load their version' }).click();
    const kept = other.getByRole('region', { name: /Your unsaved margin inputs/ });
    await expect.poll(() => kept.isVisible()).toBe(true);
    expect(await kept.getByRole('row', { name: /Pre-charge resistance/ }).innerText()).toMatch(/2200 Ω\s+1500 Ω/);
    await expect.poll(() => other.locator('#mf-timeout').inputValue()).toBe('6'); // the first designer's change is loaded
    await other.screenshot({ path: path.join(ARTIFACTS_DIR, 'conflict-margin-kept.png'), fullPage: true });

    await other.getByRole('button', { name: 'Put my changes back' }).click();
    await expect.poll(() => other.locator('#mf-r').inputValue()).toBe('2.2k');
    expect(await other.locator('#mf-timeout').inputValue()).toBe('6');
    await other.getByRole('button', { name: 'Save the margin inputs' }).click();
    await expect.poll(async () => (await rig.app.dataSource.getRepository(MarginInputsRecord).findOneBy({ revisionId: sharedRevisionId }))?.version).toBe(2); // two saves, one version step each (the rule under test)
    const record = await rig.app.dataSource.getRepository(MarginInputsRecord).findOneByOrFail({ revisionId: sharedRevisionId });
    expect(record.inputs).toMatchObject({ timeoutS: 6, prechargeOhm: 2200 }); // the first designer's timeout and the second's resistance
  }, 120_000);

  it('refuses an exclusion made on calibration points someone else changed, and keeps it to put back', async () => {
    const tester = await rig.app.signIn('tester@example.test', 'tallyvolt-tester');
    const board = (await tester.post('/api/boards').send({ serialNumber: 'SHARED-1', revisionId: sharedRevisionId, buildDate: '2026-11-28', confirmDraft: true })).body.board;
    const session = (await tester.post(`/api/boards/${board.id}/sessions`).send({
      channelKey: 'pack', performedOn: '2026-11-29', ambientC: 23, reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
    })).body.session;
    const points = [100, 200, 300, 400].map((v) => ({ appliedV: v, frequencyHz: 500 + 80 * v })); // invented bench pairs
    expect((await tester.put(`/api/calibrations/${session.id}/points`).send({ points, baseVersion: session.pointsVersion })).status).toBe(200);

    const first = rig.page;
    const other = second.pages()[0];
    for (const [page, email, password] of [[first, 'tester@example.test', 'tallyvolt-tester'], [other, 'admin@example.test', 'tallyvolt-admin']] as const) {
      await page.getByRole('button', { name: 'Sign out' }).click();
      await signIn(page, rig.baseUrl, email, password);
      await page.goto(`${rig.baseUrl}/calibrations/${session.id}`);
      await expect.poll(() => page.getByRole('button', { name: 'Exclude point 4' }).isVisible(), { timeout: 20_000 }).toBe(true);
    }
    const exclude = async (page: Page, n: number, reason: string) => {
      await page.getByRole('button', { name: `Exclude point ${n}` }).click();
      const dialog = page.getByRole('dialog', { name: `Exclude point ${n}` });
      await dialog.getByLabel('Reason for excluding').fill(reason);
      await dialog.getByRole('button', { name: 'Exclude point' }).click();
    };

    await exclude(first, 2, 'Reference meter changed range');
    await expect.poll(() => first.getByRole('button', { name: 'Restore point 2' }).isVisible()).toBe(true);

    await exclude(other, 3, 'Lead slipped off the test point');
    const notice = other.getByRole('alert').filter({ hasText: 'someone else saved first' });
    await expect.poll(() => notice.isVisible()).toBe(true);
    expect(await notice.innerText()).toMatch(/Ivo Kestrand saved the points of this session at .* while you were editing/);

    await other.getByRole('button', { name: 'Load their version' }).click();
    const kept = other.getByRole('region', { name: /Your unsaved points/ });
    await expect.poll(() => kept.isVisible()).toBe(true);
    expect(await kept.getByRole('row', { name: /Point 3/ }).innerText()).toMatch(/excluded: Lead slipped off the test point/);
    await expect.poll(() => other.getByRole('button', { name: 'Restore point 2' }).isVisible()).toBe(true); // the tester's exclusion is loaded
    await other.screenshot({ path: path.join(ARTIFACTS_DIR, 'conflict-points-kept.png'), fullPage: true });

    await other.getByRole('button', { name: 'Put my changes back' }).click();
    await other.getByRole('button', { name: 'Save points' }).click();
    await expect.poll(async () => (await rig.app.dataSource.getRepository(CalibrationPoint).find({ where: { sessionId: session.id }, order: { position: 'ASC' } }))
      .map((p) => p.excluded)).toEqual([false, true, true, false]); // the tester's exclusion of point 2 and the admin's of point 3
  }, 120_000);
});
