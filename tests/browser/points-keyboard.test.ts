import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

describe('editing calibration points at the keyboard', () => {
  let rig: BrowserRig;
  let sessionId = 0;
  beforeAll(async () => {
    rig = await openBrowserRig();
    const tester = await rig.app.signIn('tester@example.test', 'tallyvolt-tester');
    const boardId = (await tester.get('/api/boards')).body.items[0].id;
    const created = await tester.post(`/api/boards/${boardId}/sessions`).send({
      channelKey: 'pack', performedOn: '2026-11-20', ambientC: 23, reference: { description: 'bench meter', percentOfReading: 0.05, plusVolts: 0.1 },
    });
    expect(created.status).toBe(201);
    sessionId = created.body.session.id;
    const csv = 'applied_v,frequency_hz\n100,8553.1\n200,16593.6\n400,32674.2\n600,48755.0\n';
    const imported = await tester.post(`/api/calibrations/${sessionId}/points/import?mode=all`).attach('file', Buffer.from(csv), 'points.csv')
      .field('mapping', JSON.stringify({ appliedV: 'applied_v', frequencyHz: 'frequency_hz' }));
    expect(imported.status).toBe(201);
  });
  afterAll(async () => { await rig?.close(); });

  it('edits only the focused cell on Enter, with its text selected, and Escape leaves a cell as it was', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('tester@example.test');
    await page.getByLabel('Password').fill('tallyvolt-tester');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.goto(`${rig.baseUrl}/calibrations/${sessionId}`);
    const points = page.getByRole('table', { name: 'Calibration points' });
    const row = (n: number) => points.locator('tbody tr').nth(n - 1);
    const appliedCell = (n: number) => row(n).getByRole('cell').nth(1);
    await expect.poll(() => row(4).innerText()).toMatch(/^4\s+600\s+48755/);

    // Focus the second point's applied voltage (200 V) without a mouse click, then Enter: its own editor opens.
    await appliedCell(2).focus();
    await page.keyboard.press('Enter');
    const editor2 = points.getByLabel('Applied voltage, point 2');
    await expect.poll(() => editor2.isVisible()).toBe(true);
    await expect.poll(() => editor2.evaluate((el: HTMLInputElement) => el.value.slice(el.selectionStart ?? 0, el.selectionEnd ?? 0))).toBe('200');
    expect(await points.getByLabel('Applied voltage, point 3').count()).toBe(0);
    await page.keyboard.type('250');
    await page.keyboard.press('Enter');
    await expect.poll(() => editor2.count()).toBe(0);
    expect(await row(2).innerText()).toMatch(/^2\s+250\s+16593\.6/);
    expect(await row(3).innerText()).toMatch(/^3\s+400\s+32674\.2/);

    // Enter stepped down to point 3 without opening it: typing now changes nothing.
    await expect.poll(() => appliedCell(3).evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.type('9');
    expect(await points.getByRole('textbox').count()).toBe(0);
    expect(await row(3).innerText()).toMatch(/^3\s+400\s/);

    // F2 opens it with "400" selected; Escape throws the typing away and keeps the cell focused.
    await page.keyboard.press('F2');
    const editor3 = points.getByLabel('Applied voltage, point 3');
    await expect.poll(() => editor3.evaluate((el: HTMLInputElement) => el.value.slice(el.selectionStart ?? 0, el.selectionEnd ?? 0))).toBe('400');
    await page.keyboard.type('77');
    await page.keyboard.press('Escape');
    await expect.poll(() => editor3.count()).toBe(0);
    expect(await row(3).innerText()).toMatch(/^3\s+400\s+32674\.2/);
    expect(await appliedCell(3).evaluate((el) => el === document.activeElement)).toBe(true);
    await rig.screenshot('points-keyboard');

    await page.getByRole('button', { name: 'Save points' }).click();
    await expect.poll(() => page.getByText('All points saved.').isVisible()).toBe(true);
    const saved = await page.evaluate(async (id) => (await (await fetch(`/api/calibrations/${id}`)).json()).session.points, sessionId);
    expect(saved.map((p: { appliedV: number; frequencyHz: number }) => [p.appliedV, p.frequencyHz])).toEqual([
      [100, 8553.1], [250, 16593.6], [400, 32674.2], [600, 48755], // exactly one value changed: the one typed (in this test)
    ]);
  }, 90_000);
});
