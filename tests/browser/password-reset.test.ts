import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

describe('setting a new password from an e-mailed link', () => {
  let rig: BrowserRig;
  beforeAll(async () => { rig = await openBrowserRig(); });
  afterAll(async () => { await rig?.close(); });

  it('asks for a link from sign-in, refuses a common password beside its field, and signs in with the new one', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('tester@example.test');
    await page.getByRole('link', { name: 'Forgotten your password?' }).click();
    await page.waitForURL(/\/reset-password/);
    expect(await page.getByLabel('E-mail').inputValue()).toBe('tester@example.test');
    await page.getByRole('button', { name: 'Send me a link' }).click();
    await expect.poll(() => page.getByText(/a link to set a new password is on its way/i).isVisible()).toBe(true);

    let link = '';
    await expect.poll(async () => {
      const mail = (await rig.app.outbox()).find((m) => m.to.includes('tester@example.test') && /new Tallyvolt password/.test(m.subject));
      link = /https?:\/\/\S+\/reset-password\/[A-Za-z0-9_-]+/.exec(mail?.text ?? '')?.[0] ?? '';
      return link !== '';
    }).toBe(true);
    await page.goto(`${rig.baseUrl}${new URL(link).pathname}`);
    await expect.poll(() => page.getByText('tester@example.test').isVisible()).toBe(true);
    await page.getByLabel('New password', { exact: true }).fill('Password2026!');
    await page.getByLabel('Repeat it', { exact: true }).fill('Password2026!');
    await page.getByRole('button', { name: 'Set the new password' }).click();
    await expect.poll(() => page.getByText(/is a common password/i).isVisible()).toBe(true);
    await rig.screenshot('password-reset-common');

    await page.getByLabel('New password', { exact: true }).fill('quartz meadow tin lantern');
    await page.getByLabel('Repeat it', { exact: true }).fill('quartz meadow tin lantern');
    await page.getByRole('button', { name: 'Set the new password' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill('tester@example.test');
    await page.getByLabel('Password', { exact: true }).fill('quartz meadow tin lantern');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await expect.poll(() => page.getByText('Ivo Kestrand').first().isVisible()).toBe(true);
  });
});
