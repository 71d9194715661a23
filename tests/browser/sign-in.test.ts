import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

describe('signing in and out in the browser', () => {
  let rig: BrowserRig;
  beforeAll(async () => { rig = await openBrowserRig(); });
  afterAll(async () => { await rig?.close(); });

  it('shows the demo designer their role and the caution, then signs out', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('tallyvolt-designer');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await expect.poll(() => page.getByText('Tamsin Fenwright').first().isVisible()).toBe(true);
    const body = await page.locator('body').innerText();
    expect(body).toMatch(/designer/i);
    expect(body).toContain('certifies nothing');
    await rig.screenshot('home-designer');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await expect.poll(() => page.getByRole('button', { name: 'Sign in' }).isVisible()).toBe(true);
    const me = await page.evaluate(async () => (await fetch('/api/auth/me')).status);
    expect(me).toBe(401);
  });
});
