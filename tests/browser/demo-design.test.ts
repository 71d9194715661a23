import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

describe('the demo design in the browser', () => {
  let rig: BrowserRig;
  beforeAll(async () => { rig = await openBrowserRig(); });
  afterAll(async () => { await rig?.close(); });

  it('starts a revision from the one in review, and an RKM bottom resistor changes ratio and resolution live', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('tallyvolt-designer');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.goto(`${rig.baseUrl}/designs`);
    await page.getByRole('link', { name: 'PM-2 pack monitor' }).click();
    await page.waitForURL(/\/designs\/\d+$/);
    // Newest first: B (in review) heads the list, so this starts C from B.
    await page.getByRole('button', { name: 'Start revision C from this' }).first().click();
    await page.waitForURL(/\/revisions\/\d+$/); // straight into the new draft's editor

    const panel = page.getByRole('tabpanel', { name: 'Pack side' });
    const ratio = panel.locator('#readout-ratio');
    const perCountAtTop = panel.getByRole('table', { name: 'Readings across the range' }).locator('tbody tr').last().locator('td').last();
    await expect.poll(() => ratio.innerText()).toMatch(/0\.00\d+/);
    const ratioBefore = await ratio.innerText();
    const resolutionBefore = await perCountAtTop.innerText();

    const bottom = panel.getByLabel('Bottom resistor resistance');
    await bottom.fill('4K7');
    await bottom.press('Tab');
    await expect.poll(() => bottom.inputValue()).toBe('4.7k');
    // 4.7 kΩ ‖ 10 MΩ under 4 MΩ: r = 4.698k/4.004698M ≈ 0.001173 (handbook voltage divider).
    await expect.poll(() => ratio.innerText()).toContain('0.001173');
    expect(await ratio.innerText()).not.toBe(ratioBefore);
    await expect.poll(() => perCountAtTop.innerText()).not.toBe(resolutionBefore);
    await rig.screenshot('designer-demo-rkm');
  }, 90_000);
});
