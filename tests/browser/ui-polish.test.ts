import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';
import { Revision } from '../../server/entities/Revision.js';
import { CalibrationSession } from '../../server/entities/CalibrationSession.js';

async function signIn(rig: BrowserRig, email: string, password: string) {
  const { page } = rig;
  // A test that failed half-way may have left someone signed in.
  await page.context().clearCookies();
  await page.goto(`${rig.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === '/');
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
  await expect.poll(() => page.getByRole('button', { name: 'Sign in' }).isVisible(), { timeout: 20_000 }).toBe(true);
}

describe('rough edges: sign-out, notices, caution, charts, outbox', () => {
  let rig: BrowserRig;
  const consoleErrors: string[] = [];
  beforeAll(async () => {
    rig = await openBrowserRig();
    rig.page.on('console', (message) => { if (message.type() === 'error') consoleErrors.push(message.text()); });
  });
  afterAll(async () => { await rig?.close(); });

  it('logs no console error on the sign-in page, and a deliberate sign-out says nothing about an ended session', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await expect.poll(() => page.getByRole('button', { name: 'Sign in' }).isVisible(), { timeout: 20_000 }).toBe(true);
    expect(consoleErrors).toEqual([]);
    await signIn(rig, 'designer@example.test', 'tallyvolt-designer');
    await page.goto(`${rig.baseUrl}/designs`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).first().isVisible(), { timeout: 20_000 }).toBe(true);
    await signOut(page);
    await page.waitForTimeout(500);
    expect(await page.locator('body').innerText()).not.toMatch(/session has ended/i);
    expect(consoleErrors).toEqual([]);
  });

  it('shows the caution in one line on the designs list and in full in the revision editor', async () => {
    const { page } = rig;
    await signIn(rig, 'designer@example.test', 'tallyvolt-designer');
    await page.goto(`${rig.baseUrl}/designs`);
    const line = page.locator('details.caution-line');
    await expect.poll(() => line.isVisible(), { timeout: 20_000 }).toBe(true);
    expect((await line.locator('summary').boundingBox())!.height).toBeLessThan(40); // one line of text (in this test)
    expect(await page.getByText('Follow your local electrical codes').isVisible()).toBe(false);
    await line.locator('summary').click();
    expect(await page.getByText('Follow your local electrical codes').isVisible()).toBe(true);

    const revision = await rig.app.dataSource.getRepository(Revision).findOneOrFail({ where: {}, order: { id: 'ASC' } });
    await page.goto(`${rig.baseUrl}/revisions/${revision.id}`);
    const full = page.getByRole('note').filter({ hasText: 'High voltage: for qualified people only' });
    await expect.poll(() => full.isVisible()).toBe(true);
    expect(await full.getByText('Follow your local electrical codes').isVisible()).toBe(true);
    expect(await page.locator('details.caution-line').count()).toBe(0);
  }, 60_000);

  it('never covers "Cancel the study" with a notice', async () => {
    const { page } = rig;
    const revision = await rig.app.dataSource.getRepository(Revision).findOneOrFail({ where: {}, order: { id: 'ASC' } });
    await page.goto(`${rig.baseUrl}/revisions/${revision.id}/study`);
    await page.getByLabel('Number of trials').fill('2000000');
    await page.getByRole('textbox', { name: 'Seed' }).fill('77');
    await page.getByRole('textbox', { name: 'Seed' }).press('Tab');
    await page.getByRole('button', { name: 'Start the study' }).click();
    const cancel = page.getByRole('button', { name: 'Cancel the study' });
    const notice = page.getByRole('region', { name: 'Notices' }).getByText('Study started');
    await expect.poll(() => cancel.isVisible(), { timeout: 20_000 }).toBe(true);
    await expect.poll(() => notice.isVisible()).toBe(true);
    await cancel.scrollIntoViewIfNeeded();
    const box = (await cancel.boundingBox())!;
    const hit = await page.evaluate(({ x, y }) => {
      const el = document.elementFromPoint(x, y);
      return el?.closest('button')?.textContent?.trim() ?? el?.tagName ?? null;
    }, { x: box.x + box.width / 2, y: box.y + box.height / 2 });
    expect(hit).toBe('Cancel the study');
    expect(await notice.isVisible()).toBe(true);
    await rig.screenshot('ui-notice-beside-cancel');
    await cancel.click();
  }, 90_000);

  it('draws the study histogram on round ticks (screenshot check)', async () => {
    const { page } = rig;
    await page.getByLabel('Number of trials').fill('5000');
    await page.getByLabel('Evaluation voltages').fill('5');
    await page.getByRole('textbox', { name: 'Seed' }).fill('1234');
    await page.getByRole('textbox', { name: 'Seed' }).press('Tab');
    await page.getByRole('button', { name: 'Start the study' }).click();
    await expect.poll(() => page.getByRole('heading', { name: /^Results of study/ }).isVisible(), { timeout: 60_000 }).toBe(true);
    const histogram = page.getByRole('img', { name: /^Histogram of the reading error/ }).first();
    await histogram.scrollIntoViewIfNeeded();
    await histogram.screenshot({ path: await rig.screenshot('ui-study-page').then((f) => f.replace('ui-study-page', 'ui-study-histogram')) });
    await signOut(page);
  }, 90_000);

  it('keeps the residual plot markers inside the plot (screenshot check)', async () => {
    const { page } = rig;
    await signIn(rig, 'tester@example.test', 'tallyvolt-tester');
    const session = await rig.app.dataSource.getRepository(CalibrationSession).findOneOrFail({ where: {}, order: { id: 'ASC' } });
    await page.goto(`${rig.baseUrl}/calibrations/${session.id}`);
    const residuals = page.getByRole('img', { name: /^Residual plot/ });
    await expect.poll(() => residuals.isVisible(), { timeout: 20_000 }).toBe(true);
    await residuals.scrollIntoViewIfNeeded();
    await residuals.screenshot({ path: (await rig.screenshot('ui-calibration-page')).replace('ui-calibration-page', 'ui-residuals') });
    await signOut(page);
  }, 60_000);

  it('shows an outbox message as one page, its text first and the formatted version beneath', async () => {
    const { page } = rig;
    await signIn(rig, 'admin@example.test', 'tallyvolt-admin');
    await page.goto(`${rig.baseUrl}/people`);
    await page.getByRole('button', { name: 'Invite a person' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('E-mail').fill('bench.helper@example.test');
    await dialog.getByRole('button', { name: 'Send invitation' }).click();
    const pending = page.getByRole('table', { name: 'Invitations not yet accepted' });
    await expect.poll(() => pending.getByText('bench.helper@example.test').isVisible(), { timeout: 20_000 }).toBe(true);
    expect(await pending.getByRole('button', { name: 'Send the invitation to bench.helper@example.test again' }).isVisible()).toBe(true);
    await rig.screenshot('ui-people-pending');

    await page.goto(`${rig.baseUrl}/outbox`);
    await page.getByRole('table', { name: 'Sent mail' }).getByRole('button', { name: 'Your Tallyvolt invitation' }).first().click();
    const message = page.getByRole('article');
    const headings = await message.getByRole('heading', { level: 3 }).allInnerTexts();
    expect(headings.map((h) => h.toLowerCase())).toEqual(['text', 'formatted']);
    expect(await message.getByTitle(/^Formatted message/).isVisible()).toBe(true);
    expect(await page.getByRole('radiogroup').count()).toBe(0);
    await rig.screenshot('ui-outbox');
  }, 60_000);
});
