import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

interface DemoPoint { appliedV: number; frequencyHz: number }

describe('a tester in the browser', () => {
  let rig: BrowserRig;
  beforeAll(async () => { rig = await openBrowserRig(); });
  afterAll(async () => { await rig?.close(); });

  it('calibrates the pack channel of PM-2-001 from a CSV, excludes the outlier and downloads the C header', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('tester@example.test');
    await page.getByLabel('Password').fill('tallyvolt-tester');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Boards' }).click();
    await page.waitForURL(/\/boards$/);
    const boards = page.getByRole('table', { name: 'Boards' });
    await expect.poll(() => boards.getByRole('link', { name: 'PM-2-001', exact: true }).isVisible()).toBe(true);
    await expect.poll(() => page.getByRole('img', { name: /Gain error of 1 calibrated boards/ }).isVisible()).toBe(true);
    await rig.screenshot('tester-boards');

    await boards.getByRole('link', { name: 'PM-2-001', exact: true }).click();
    await page.waitForURL(/\/boards\/\d+$/);
    await expect.poll(() => page.getByRole('table', { name: 'Sessions of Pack side' }).isVisible()).toBe(true);
    await rig.screenshot('tester-board');

    // Bench pairs from the demo board's own completed pack session, one of them planted 30 Hz high.
    const boardId = Number(new URL(page.url()).pathname.split('/').pop());
    const demo: DemoPoint[] = await page.evaluate(async (id) => {
      const board = (await (await fetch(`/api/boards/${id}`)).json()).board;
      const pack = board.sessions.find((s: { channelKey: string }) => s.channelKey === 'pack');
      return (await (await fetch(`/api/calibrations/${pack.id}`)).json()).session.points;
    }, boardId);
    const rows = [0, 1, 3, 4, 6, 7, 9, 10].map((i) => demo[i]);
    const csv = ['applied_v,frequency_hz', ...rows.map((p, i) => `${p.appliedV},${i === 4 ? (p.frequencyHz + 30).toFixed(1) : p.frequencyHz}`)].join('\n');
    const csvFile = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-points-')), 'bench-pack.csv');
    fs.writeFileSync(csvFile, `${csv}\n`);

    await page.getByRole('button', { name: 'New calibration session' }).click();
    const dialog = page.getByRole('dialog', { name: 'New calibration session' });
    await expect.poll(() => dialog.getByLabel('Channel').innerText()).toContain('Pack side');
    await dialog.getByLabel('Reference instrument').fill('Bench HV source, 6½-digit meter on its 1000 V range');
    await dialog.getByLabel('Accuracy, % of reading').fill('0.01');
    await dialog.getByLabel('Accuracy, plus volts').fill('50m');
    await dialog.getByLabel('Accuracy, plus volts').press('Tab');
    await rig.screenshot('calibration-new-session');
    await dialog.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/calibrations\/\d+$/);
    await expect.poll(() => page.getByRole('heading', { name: 'Calibration session: PM-2-001, Pack side' }).isVisible()).toBe(true);
    expect(await page.getByText('certifies nothing').isVisible()).toBe(true);

    // The bench was warmer than the default and that is worth a note: both can be corrected while the session is a draft.
    await page.getByRole('button', { name: 'Edit details…' }).click();
    const details = page.getByRole('dialog', { name: 'Session details' });
    await details.getByLabel('Ambient temperature').fill('24.5');
    await details.getByLabel('Note').fill('Lid off, fan running.');
    await rig.screenshot('calibration-edit-details');
    await details.getByRole('button', { name: 'Save details' }).click();
    await expect.poll(() => details.isVisible()).toBe(false);
    await expect.poll(() => page.getByText('24.5 °C').isVisible()).toBe(true);
    expect(await page.getByText('Lid off, fan running.').isVisible()).toBe(true);

    await page.getByRole('button', { name: 'Upload CSV' }).click();
    const upload = page.getByRole('dialog', { name: 'Upload calibration points from a CSV file' });
    await upload.getByLabel('CSV file', { exact: true }).setInputFiles(csvFile);
    await expect.poll(() => upload.getByRole('group', { name: 'Which column holds what' }).isVisible()).toBe(true);
    await expect.poll(() => upload.getByLabel('Applied voltage column (V)').innerText()).toContain('applied_v');
    await expect.poll(() => upload.getByLabel('Frequency column (Hz)').innerText()).toContain('frequency_hz');
    await expect.poll(() => upload.getByText('8 rows read well').isVisible()).toBe(true);
    await rig.screenshot('calibration-import');
    await upload.getByRole('button', { name: 'Import all' }).click();
    await expect.poll(() => page.getByText('8 points imported').first().isVisible()).toBe(true);

    const coefficients = page.getByRole('table', { name: 'Fitted coefficients' });
    await expect.poll(() => coefficients.innerText()).toMatch(/Gain b₁\s+80\.2\d* Hz\/V/);
    expect(await coefficients.innerText()).toMatch(/Offset b₀\s+\d/);
    expect(await page.getByRole('img', { name: /^Residual plot/ }).isVisible()).toBe(true);
    expect(await page.getByRole('img', { name: /^Data plot/ }).isVisible()).toBe(true);
    expect(await page.getByRole('status').filter({ hasText: "Accepted against the design's spread" }).isVisible()).toBe(true);
    expect(await page.getByText(/Decision rule\. Guarded acceptance \(JCGM 106:2012 §8\)/).isVisible()).toBe(true);
    const points = page.getByRole('table', { name: 'Calibration points' });
    await expect.poll(() => points.locator('tbody tr').nth(4).innerText()).toContain('Suspect');
    await rig.screenshot('calibration-session');

    await points.getByRole('button', { name: 'Exclude point 5' }).click();
    const exclude = page.getByRole('dialog', { name: 'Exclude point 5' });
    await exclude.getByLabel('Reason for excluding').fill('Lead slipped off the test point during the reading');
    await exclude.getByRole('button', { name: 'Exclude point' }).click();
    await expect.poll(() => exclude.isVisible()).toBe(false);
    await expect.poll(() => points.locator('tbody tr').nth(4).innerText()).toMatch(/Excluded\s+Lead slipped/);
    expect(await points.locator('tbody').innerText()).not.toContain('Suspect');
    await expect.poll(() => page.getByText('7 (5 degrees of freedom)').isVisible()).toBe(true);
    await rig.screenshot('calibration-session-excluded');

    // A ninth point typed at the keyboard: the new row opens its first cell, Tab moves right, Enter commits.
    await page.getByRole('button', { name: 'Add point' }).click();
    const applied = points.getByLabel('Applied voltage, point 9');
    await expect.poll(() => applied.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.type('250');
    await page.keyboard.press('Tab');
    const frequency = points.getByLabel('Frequency, point 9');
    await expect.poll(() => frequency.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.type(`${(demo[5].frequencyHz / 1000).toFixed(4)}k`);
    await page.keyboard.press('Enter');
    await expect.poll(() => page.getByText('Unsaved changes').isVisible()).toBe(true);
    await page.getByRole('button', { name: 'Save points' }).click();
    await expect.poll(() => page.getByText('All points saved.').isVisible()).toBe(true);
    await expect.poll(() => page.getByText('8 (6 degrees of freedom)').isVisible()).toBe(true);
    expect(await points.locator('tbody tr').nth(8).innerText()).toMatch(new RegExp(`^9\\s+250\\s+${demo[5].frequencyHz}\\s`));

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download C header' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/\.h$/);
    const header = fs.readFileSync(await download.path(), 'utf8');
    expect(header).toContain('#ifndef');
    expect(header).toContain('PM-2-001');

    await page.getByRole('button', { name: 'Complete session…' }).click();
    await page.getByRole('alertdialog', { name: 'Complete this calibration session?' }).getByRole('button', { name: 'Complete session' }).click();
    await expect.poll(() => page.getByText('This session is complete and read-only').isVisible()).toBe(true);
    expect(await page.getByRole('button', { name: 'Add point' }).count()).toBe(0);
    expect(await points.getByRole('button', { name: /^Exclude point/ }).count()).toBe(0);
    await rig.screenshot('calibration-session-complete');
  }, 120_000);

  it('shows the frozen record of a completed session, downloads from it, and keeps it across a reopen and a new record', async () => {
    const { page } = rig;
    await page.context().clearCookies();
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('tester@example.test');
    await page.getByLabel('Password').fill('tallyvolt-tester');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');

    // The demo board's completed link-side session, frozen as record 1 when it was completed.
    const { id, sha256 } = await page.evaluate(async () => {
      const boards = (await (await fetch('/api/boards')).json()).items as { id: number; serialNumber: string }[];
      const board = (await (await fetch(`/api/boards/${boards.find((b) => b.serialNumber === 'PM-2-001')!.id}`)).json()).board;
      const link = board.sessions.find((s: { channelKey: string; state: string }) => s.channelKey === 'link' && s.state === 'complete');
      const session = (await (await fetch(`/api/calibrations/${link.id}`)).json()).session;
      return { id: session.id as number, sha256: session.records[0].sha256 as string };
    });
    const downloadText = async (name: string) => {
      const [file] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name, exact: true }).click()]);
      return fs.readFileSync(await file.path(), 'utf8');
    };

    await page.goto(`${rig.baseUrl}/calibrations/${id}`);
    const records = page.getByRole('region', { name: 'Frozen records' });
    await expect.poll(() => records.isVisible()).toBe(true);
    expect(await records.innerText()).toContain(`record 1 of session ${id}`);
    expect(await records.getByText(sha256).isVisible()).toBe(true);
    await rig.screenshot('calibration-record');
    const frozen = await downloadText('Download C header');
    expect(frozen).toContain(`record 1 of session ${id}, SHA-256 ${sha256}`);

    await page.getByRole('button', { name: 'Reopen session…' }).click();
    await page.getByRole('alertdialog', { name: 'Reopen this calibration session?' }).getByRole('button', { name: 'Reopen session' }).click();
    await expect.poll(() => records.getByText('This session was reopened').isVisible()).toBe(true);
    expect(await page.getByText('at most 500 per session').isVisible()).toBe(true);
    await page.getByRole('button', { name: 'Upload CSV' }).click();
    const upload = page.getByRole('dialog', { name: 'Upload calibration points from a CSV file' });
    expect(await upload.getByText('A session holds at most 500 points').isVisible()).toBe(true);
    await upload.getByRole('button', { name: 'Cancel' }).click();
    expect(await downloadText('C header, record 1')).toBe(frozen);

    await page.getByRole('button', { name: 'Complete session…' }).click();
    await page.getByRole('alertdialog', { name: 'Complete this calibration session?' }).getByRole('button', { name: 'Complete session' }).click();
    await expect.poll(() => records.innerText()).toContain(`record 2 of session ${id}`);
    const second = await downloadText('Download C header');
    expect(second).toMatch(new RegExp(`record 2 of session ${id}, SHA-256 [0-9a-f]{64}`));
    expect(second).not.toContain(sha256);
    expect(await downloadText('C header, record 1')).toBe(frozen);
    await rig.screenshot('calibration-record-second');
  }, 120_000);
});
