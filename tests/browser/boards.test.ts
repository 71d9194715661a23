import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

interface Revision { id: number; letter: string; state: string }

describe('boards, their revisions and their reference instruments in the browser', () => {
  let rig: BrowserRig;
  let draft: Revision;
  let overdueSessionId: number;

  beforeAll(async () => {
    rig = await openBrowserRig();
    const designer = await rig.app.signIn('designer@example.test', 'tallyvolt-designer');
    const tester = await rig.app.signIn('tester@example.test', 'tallyvolt-tester');
    const designId = (await designer.get('/api/designs')).body.items[0].id;
    const design = (await designer.get(`/api/designs/${designId}`)).body.design;
    const approved = design.revisions.find((r: Revision) => r.state === 'approved') as Revision;
    draft = (await designer.post(`/api/designs/${designId}/revisions`).send({ fromRevisionId: design.revisions.at(-1).id })).body.revision;
    // A second calibrated board of the approved revision, its bench pairs the demo board's own with a 0.1 % higher gain
    // (invented), measured two days after its reference instrument fell due.
    const demoBoard = (await tester.get('/api/boards')).body.items.find((b: { serialNumber: string }) => b.serialNumber === 'PM-2-001');
    const demoPack = (await tester.get(`/api/calibrations/${demoBoard.latestByChannel.pack.id}`)).body.session;
    const board = (await tester.post('/api/boards').send({ serialNumber: 'PM-2-002', revisionId: approved.id, buildDate: '2026-11-28' })).body.board;
    const session = (await tester.post(`/api/boards/${board.id}/sessions`).send({
      channelKey: 'pack', performedOn: '2026-12-02', ambientC: 23, reference: demoPack.reference, fit: { degree: 1, intercept: true, weighted: false },
      referenceInstrumentId: 'LAB-DMM-09', referenceCertificate: 'CERT-2025-0088', referenceDueOn: '2026-11-30',
    })).body.session;
    overdueSessionId = session.id;
    const points = demoPack.points.map((p: { appliedV: number; frequencyHz: number }) => ({ appliedV: p.appliedV, frequencyHz: p.frequencyHz * 1.001 }));
    const saved = await tester.put(`/api/calibrations/${session.id}/points`).send({ points, baseVersion: 1 });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect((await tester.post(`/api/calibrations/${session.id}/complete`)).status).toBe(200);
  });
  afterAll(async () => { await rig?.close(); });

  async function signIn(email: string, password: string) {
    const { page } = rig;
    await rig.context.clearCookies();
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
  }

  it('labels every board in the spread chart and lists them beside it with their decisions', async () => {
    const { page } = rig;
    await signIn('tester@example.test', 'tallyvolt-tester');
    await page.goto(`${rig.baseUrl}/boards`);
    const table = page.locator('#spread-boards');
    await expect.poll(() => table.locator('tbody tr').count(), { timeout: 20_000 }).toBe(2);
    const rows = await table.locator('tbody tr').allInnerTexts();
    expect(rows[0]).toMatch(/^PM-2-001\t.*%\t.*V\t(Accepted|Undecided \(in a guard band\)|Rejected)$/);
    expect(rows[1]).toMatch(/^PM-2-002\t.*%\t.*V\t(Accepted|Undecided \(in a guard band\)|Rejected)$/);
    expect(await page.getByRole('img', { name: /Gain error of 2 calibrated boards .* each labelled with its serial number/ }).isVisible()).toBe(true);
    // The serials drawn on the canvas cannot be read by a locator: the screenshot shows them.
    await page.locator('#spread-boards').scrollIntoViewIfNeeded();
    await rig.screenshot('boards-spread-labelled');
  });

  it('offers approved and in-review revisions, and builds to a draft only when confirmed, saying so', async () => {
    const { page } = rig;
    await page.getByRole('button', { name: 'New board' }).click();
    const dialog = page.getByRole('dialog', { name: 'New board' });
    await dialog.getByLabel('Serial number').fill('PM-2-003');
    await dialog.getByLabel('Built to design revision').click();
    const options = await page.getByRole('option').allInnerTexts();
    expect(options.some((o) => /\(Approved\)$/.test(o))).toBe(true);
    expect(options.some((o) => /\(In review\)$/.test(o))).toBe(true);
    expect(options.some((o) => /\(Draft\)$/.test(o))).toBe(false);
    await page.keyboard.press('Escape');
    await dialog.getByLabel('Also list draft revisions and those sent back').check();
    await dialog.getByLabel('Built to design revision').click();
    await page.getByRole('option', { name: new RegExp(`revision ${draft.letter} \\(Draft\\)$`) }).click();
    await expect.poll(() => dialog.getByRole('alert').innerText()).toContain(`Revision ${draft.letter} is not approved or in review`);
    await dialog.getByRole('button', { name: 'Add board' }).click();
    await expect.poll(() => dialog.getByText('Confirm that this board is built to a draft revision').isVisible()).toBe(true);
    await dialog.getByLabel('I confirm this board is built to a draft revision').check();
    await rig.screenshot('boards-new-draft-confirmed');
    await dialog.getByRole('button', { name: 'Add board' }).click();
    await page.waitForURL(/\/boards\/\d+$/);
    await expect.poll(() => page.locator('#board-built-to-draft').innerText()).toContain('Built to a draft revision');
    await page.goto(`${rig.baseUrl}/boards`);
    const row = page.getByRole('table', { name: 'Boards' }).getByRole('row').filter({ hasText: 'PM-2-003' });
    await expect.poll(() => row.innerText()).toContain('built to a draft revision');
  });

  it('flags a session performed after its reference instrument fell due', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/calibrations/${overdueSessionId}`);
    await expect.poll(() => page.locator('#reference-overdue').innerText()).toContain('Reference past its calibration due date');
    expect(await page.locator('#reference-traceability').innerText()).toContain('LAB-DMM-09, certificate CERT-2025-0088');
    await rig.screenshot('calibration-reference-overdue');
  });

  it('shows the share of the converter range used at the channel maximum in the editor readouts', async () => {
    const { page } = rig;
    await signIn('designer@example.test', 'tallyvolt-designer');
    await page.goto(`${rig.baseUrl}/revisions/${draft.id}`);
    const share = page.getByRole('tabpanel', { name: 'Pack side' }).locator('#readout-range-use');
    await expect.poll(() => share.innerText()).toMatch(/^\d+(\.\d+)? % of full scale/);
    await rig.screenshot('editor-range-use');
  });
});
