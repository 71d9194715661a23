import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

describe('series in the browser', () => {
  let rig: BrowserRig;
  beforeAll(async () => { rig = await openBrowserRig(); });
  afterAll(async () => { await rig?.close(); });

  it('adds a team series by form, refusing a value outside the decade beside its field, and the finder draws only on it', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('tallyvolt-designer');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');

    await page.goto(`${rig.baseUrl}/stock/series`);
    const table = page.getByRole('table', { name: 'Series' });
    await expect.poll(() => table.getByRole('row', { name: /E24/ }).innerText()).toMatch(/IEC 60063, read-only/);
    expect(await table.getByRole('button', { name: 'Delete the series E24' }).count()).toBe(0);

    await page.getByRole('button', { name: 'Add a series' }).click();
    const form = page.getByRole('dialog', { name: 'Add a series of your own' });
    await form.getByLabel('Name').fill('Twos only');
    await form.getByLabel('Values in one decade').fill('2, 20');
    await form.getByRole('button', { name: 'Add series' }).click();
    await expect.poll(() => form.getByText('Value must be ≥ 1 and < 10', { exact: false }).isVisible()).toBe(true);
    await form.getByLabel('Values in one decade').fill('2');
    await form.getByRole('button', { name: 'Add series' }).click();
    await expect.poll(() => table.getByRole('row', { name: /Twos only/ }).isVisible()).toBe(true);
    expect(await table.getByRole('row', { name: /Twos only/ }).innerText()).toMatch(/Team series/);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Designs' }).click();
    await page.waitForURL(/\/designs$/);
    await page.getByRole('button', { name: 'New design' }).click();
    await page.getByLabel('Name').fill('Series check');
    await page.getByLabel('Purpose').fill('A divider from a team series.');
    await page.getByRole('button', { name: 'Create design' }).click();
    await page.waitForURL(/\/designs\/\d+$/);
    await page.getByRole('link', { name: 'Edit revision A' }).click();
    await page.waitForURL(/\/revisions\/\d+$/);

    const panel = page.getByRole('tabpanel', { name: 'Pack side' });
    await panel.getByRole('button', { name: 'Find values…' }).click();
    const finder = page.getByRole('dialog', { name: 'Divider finder' });
    await finder.getByLabel('Series', { exact: true }).click();
    await page.getByRole('option', { name: 'Twos only (team, 1 per decade)' }).click();
    await finder.getByLabel('Target ratio').fill('0.0909');
    await finder.getByLabel('Top string, fewest').fill('1');
    await finder.getByLabel('Top string, most').fill('1');
    await finder.getByLabel('Voltage per resistor, at most').fill('');
    await finder.getByLabel('Power per resistor, at most').fill('');
    await finder.getByRole('button', { name: 'Find dividers' }).click();
    const candidates = finder.getByRole('table', { name: 'Divider candidates, best first' });
    await expect.poll(() => candidates.isVisible(), { timeout: 30_000 }).toBe(true);
    const rows = candidates.locator('tbody tr');
    expect(await rows.count()).toBeGreaterThan(0);
    for (const row of await rows.all()) {
      const top = (await row.locator('td').nth(1).innerText()).trim();
      const bottom = (await row.locator('td').nth(2).innerText()).trim();
      // A series of the single value 2 gives only 2·10^k Ω (by hand); 20 Ω over 200 Ω is 1/11 ≈ 0.0909.
      expect(top).toMatch(/^2(0{0,2})\s?[kMG]?Ω$/);
      expect(bottom).toMatch(/^2(0{0,2})\s?[kMG]?Ω$/);
    }
    await rig.screenshot('finder-team-series');
  }, 120_000);
});
