import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

describe('a designer in the browser', () => {
  let rig: BrowserRig;
  let editorUrl = '';
  beforeAll(async () => { rig = await openBrowserRig(); });
  afterAll(async () => { await rig?.close(); });

  it('creates a design, edits revision A with live readouts and warnings, and saves it', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('designer@example.test');
    await page.getByLabel('Password').fill('tallyvolt-designer');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Designs' }).click();
    await page.waitForURL(/\/designs$/);
    await expect.poll(() => page.getByRole('link', { name: 'PM-2 pack monitor' }).isVisible()).toBe(true);
    await page.locator('[aria-label="Designs"][aria-busy="false"]').waitFor();
    await rig.screenshot('designer-designs');

    await page.getByRole('button', { name: 'New design' }).click();
    await page.getByLabel('Name').fill('Bench rig monitor');
    await page.getByLabel('Purpose').fill('Link voltage on the test bench.');
    await page.getByRole('button', { name: 'Create design' }).click();
    await page.waitForURL(/\/designs\/\d+$/);
    await page.getByRole('link', { name: 'Edit revision A' }).click();
    await page.waitForURL(/\/revisions\/\d+$/);
    editorUrl = page.url();

    const panel = page.getByRole('tabpanel', { name: 'Pack side' });
    const ratio = panel.locator('#readout-ratio');
    await expect.poll(() => ratio.innerText()).toContain('0.008009');

    const bottom = panel.getByLabel('Bottom resistor resistance');
    await bottom.fill('33K2');
    await bottom.press('Tab');
    await expect.poll(() => bottom.inputValue()).toBe('33.2k');
    await expect.poll(() => ratio.innerText()).toContain('0.008205');

    const divider = panel.getByRole('region', { name: 'Divider' });
    expect(await divider.getByRole('list', { name: 'Warnings' }).count()).toBe(0);
    const rated = panel.getByLabel('Top resistor 1 rated voltage');
    await rated.fill('100 V');
    await rated.press('Tab');
    await expect.poll(() => divider.getByRole('list', { name: 'Warnings' }).innerText()).toMatch(/Top resistor 1 voltage 124 V exceeds its rating 100 V/);

    await bottom.fill('33q2');
    await bottom.press('Tab');
    await expect.poll(() => panel.getByText(/is not a value/).isVisible()).toBe(true);
    await rig.screenshot('designer-editor-parse-error');
    await bottom.fill('33.2 kΩ');
    await bottom.press('Tab');

    await rig.screenshot('designer-editor');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await expect.poll(() => page.getByText('All changes saved').isVisible()).toBe(true);

    await page.reload();
    const reloaded = page.getByRole('tabpanel', { name: 'Pack side' });
    await expect.poll(() => reloaded.getByLabel('Bottom resistor resistance').inputValue()).toBe('33.2k');
    expect(await reloaded.getByLabel('Top resistor 1 rated voltage').inputValue()).toBe('100');
    await expect.poll(() => reloaded.locator('#readout-ratio').innerText()).toContain('0.008205');

    // Per-board calibration removes the tolerance terms at the calibration temperature, so the worst case shrinks.
    const volts = async () => Number((await reloaded.locator('#readout-worst-case').innerText()).match(/±([\d.]+) V/)![1]);
    const nominalWorst = await volts();
    await reloaded.getByRole('region', { name: 'Reading back' }).getByText('Each board calibrated').click();
    await reloaded.getByLabel('Calibration temperature').fill('25');
    await reloaded.getByLabel('Calibration temperature').press('Tab');
    await expect.poll(() => reloaded.locator('#readout-worst-case').innerText()).toContain('calibrated');
    expect(await volts()).toBeLessThan(nominalWorst / 2);
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await expect.poll(() => page.getByText('All changes saved').isVisible()).toBe(true);
    await page.reload();
    await expect.poll(() => page.getByRole('tabpanel', { name: 'Pack side' }).getByLabel('Calibration temperature').inputValue()).toBe('25');
  }, 90_000);

  it('previews a stock CSV and lists the problem in its bad row', async () => {
    const { page } = rig;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Stock' }).click();
    await page.waitForURL(/\/stock$/);
    await expect.poll(() => page.getByRole('cell', { name: '4.99 MΩ', exact: true }).isVisible()).toBe(true);
    await page.locator('[aria-label="Stock"][aria-busy="false"]').waitFor();
    await rig.screenshot('designer-stock');

    const csv = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-csv-')), 'shelf.csv');
    fs.writeFileSync(csv, 'value,tolerance_pct,quantity,package\n4K7,1,50,0603\n12x,1,10,0603\n100k,0.1,20,0805\n');
    await page.getByRole('button', { name: 'Upload CSV' }).click();
    await page.getByLabel('CSV file', { exact: true }).setInputFiles(csv);
    const problems = page.getByRole('table', { name: 'Problems in the file' });
    await expect.poll(() => problems.innerText()).toMatch(/3\s+value\s+"12x" is not a value/i);
    expect(await page.getByRole('button', { name: 'Import all' }).isDisabled()).toBe(true);
    await rig.screenshot('designer-stock-import');
    await page.getByRole('button', { name: 'Import only the 2 valid rows' }).click();
    await expect.poll(() => page.getByText('2 parts imported').first().isVisible()).toBe(true);
  }, 60_000);

  it('fills the divider from stock with the finder and runs a short uncertainty study', async () => {
    const { page } = rig;
    await page.goto(editorUrl);
    const panel = page.getByRole('tabpanel', { name: 'Pack side' });
    await panel.getByRole('button', { name: 'Find values…' }).click();
    const finder = page.getByRole('dialog', { name: 'Divider finder' });
    await finder.getByRole('button', { name: 'Parts in stock' }).click();
    // Revision A's top resistor 1 is now rated 100 V, so the derated default limit (80 V) rules out four 1 MΩ parts.
    await finder.getByRole('button', { name: 'Find dividers' }).click();
    await expect.poll(() => finder.getByText('No divider meets every limit').isVisible()).toBe(true);
    await finder.getByLabel('Voltage per resistor, at most').fill('160');
    await finder.getByRole('button', { name: 'Find dividers' }).click();
    const candidates = finder.getByRole('table');
    await expect.poll(() => candidates.innerText()).toMatch(/4 × 1 MΩ/);
    await rig.screenshot('designer-finder');
    await finder.getByRole('button', { name: 'Use candidate 1', exact: true }).click();
    await expect.poll(() => page.getByText('Unsaved changes').isVisible()).toBe(true);
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await expect.poll(() => page.getByText('All changes saved').isVisible()).toBe(true);

    await page.getByRole('link', { name: /^Uncertainty study of revision A$/ }).click();
    await page.waitForURL(/\/study$/);
    await page.getByLabel('Number of trials').fill('5000');
    await page.getByLabel('Evaluation voltages').fill('5');
    await page.getByLabel('Seed').fill('1234');
    await page.getByLabel('Seed').press('Tab');
    await page.getByRole('button', { name: 'Start the study' }).click();
    await expect.poll(() => page.getByRole('heading', { name: /^Results of study/ }).isVisible(), { timeout: 60_000 }).toBe(true);
    const budget = page.getByRole('table', { name: /^Uncertainty budget at 500 V/ });
    await expect.poll(() => budget.locator('tbody tr').count()).toBeGreaterThan(3);
    expect(await page.getByText('Seed 1234').first().isVisible()).toBe(true);
    // The first test switched the pack side to per-board calibration; the result says how it was read back.
    expect(await page.getByText(/Read back with each board's own two-point calibration \(0 V and 500 V at 25 °C\)/).isVisible()).toBe(true);
    await rig.screenshot('designer-study');
  }, 120_000);
});
