import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

describe('the divider finder in the browser', () => {
  let rig: BrowserRig;
  beforeAll(async () => { rig = await openBrowserRig(); });
  afterAll(async () => { await rig?.close(); });

  it('shows the loaded ratio the editor then reads, names what it did not search, and says when stock misses the tolerance', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('tallyvolt-designer');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Designs' }).click();
    await page.waitForURL(/\/designs$/);
    await page.getByRole('button', { name: 'New design' }).click();
    await page.getByLabel('Name').fill('Finder check');
    await page.getByLabel('Purpose').fill('Divider values for a 500 V node.');
    await page.getByRole('button', { name: 'Create design' }).click();
    await page.waitForURL(/\/designs\/\d+$/);
    await page.getByRole('link', { name: 'Edit revision A' }).click();
    await page.waitForURL(/\/revisions\/\d+$/);

    const panel = page.getByRole('tabpanel', { name: 'Pack side' });
    const bias = panel.getByLabel('Input bias current');
    await bias.fill('2n');
    await bias.press('Tab');

    await panel.getByRole('button', { name: 'Find values…' }).click();
    const finder = page.getByRole('dialog', { name: 'Divider finder' });
    await expect.poll(() => finder.getByText(/in parallel with its 10 MΩ input/).isVisible()).toBe(true);
    expect(await finder.getByText(/±2 nA bias current/).isVisible()).toBe(true);
    await finder.getByLabel('Target ratio').fill('0.016');
    await finder.getByLabel('Top string, fewest').fill('3');
    await finder.getByLabel('Top string, most').fill('3');
    // Three resistors share about 492 V: the derated 160 V each cannot carry it, 200 V can.
    await finder.getByLabel('Voltage per resistor, at most').fill('200');
    await finder.getByLabel('Also try top strings of different values').check();
    await finder.getByRole('button', { name: 'Find dividers' }).click();
    const candidates = finder.getByRole('table', { name: 'Divider candidates, best first' });
    await expect.poll(() => candidates.isVisible(), { timeout: 30_000 }).toBe(true);
    expect(await finder.getByRole('note', { name: 'Not searched' }).count()).toBe(0);
    const firstRatio = (await candidates.locator('tbody tr').first().locator('td').nth(3).innerText()).trim();
    expect(Math.abs(Number(firstRatio) / 0.016 - 1)).toBeLessThan(1e-3); // within the 4 digits shown (the asked ratio)
    await rig.screenshot('finder-mixed-loaded');

    await finder.getByRole('button', { name: 'Use candidate 1', exact: true }).click();
    await expect.poll(() => panel.locator('#readout-ratio').innerText()).toMatch(new RegExp(`^${firstRatio.replace('.', '\\.')}\\b`));

    await panel.getByRole('button', { name: 'Find values…' }).click();
    await finder.getByLabel('Top string, most').fill('5');
    await finder.getByLabel('Also try top strings of different values').check();
    await finder.getByRole('button', { name: 'Find dividers' }).click();
    const notSearched = finder.getByRole('note', { name: 'Not searched' });
    // With the tolerance and limits as given, strings of four are searched; five form about 10¹² multisets of E96 values.
    await expect.poll(() => notSearched.innerText(), { timeout: 30_000 }).toMatch(/Mixed top strings of 5 resistors were not searched/);
    expect(await notSearched.innerText()).not.toMatch(/of 4 resistors/);
    await rig.screenshot('finder-not-searched');

    await finder.getByRole('button', { name: 'Parts in stock' }).click();
    await finder.getByLabel('Top string, fewest').fill('1');
    await finder.getByLabel('Tolerance, worst case at the highest input').fill('0.0001');
    await finder.getByRole('button', { name: 'Find dividers' }).click();
    await expect.poll(() => finder.getByText('No combination of parts in stock is within ±0.0001 %.').isVisible(), { timeout: 30_000 }).toBe(true);
    expect(await finder.getByRole('table', { name: 'Closest dividers, outside the tolerance' }).isVisible()).toBe(true);
    expect(await finder.getByRole('table', { name: 'Divider candidates, best first' }).count()).toBe(0);
    await rig.screenshot('finder-stock-outside-tolerance');
  }, 120_000);
});
