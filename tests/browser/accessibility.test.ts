import fs from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';

const axeSource = fs.readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

interface AxeViolation { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }

/** Runs axe-core in the page (evaluated through the debugging channel, so the page's CSP stays on). */
async function seriousViolations(page: Page): Promise<string[]> {
  await page.evaluate(axeSource);
  const violations = (await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: unknown[] }> } }).axe;
    return (await axe.run(document, { resultTypes: ['violations'] })).violations;
  })) as AxeViolation[];
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join('; ')}`);
}

/** Every visible form control has an accessible name (a label, aria-label or aria-labelledby). */
async function unlabelledFields(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const fields = [...document.querySelectorAll('input:not([type=hidden]), select, textarea')] as HTMLInputElement[];
    return fields
      .filter((f) => f.offsetParent !== null)
      .filter((f) => !(f.labels && f.labels.length) && !f.getAttribute('aria-label') && !f.getAttribute('aria-labelledby'))
      .map((f) => f.outerHTML.slice(0, 120));
  });
}

describe('accessibility of the main screens', () => {
  let rig: BrowserRig;
  const cspErrors: string[] = [];
  beforeAll(async () => {
    rig = await openBrowserRig();
    rig.page.on('console', (m) => { if (m.type() === 'error' && /Content Security Policy/i.test(m.text())) cspErrors.push(m.text()); });
  });
  afterAll(async () => { await rig?.close(); });

  async function check(path: string, ready: (page: Page) => Promise<unknown>) {
    await rig.page.goto(`${rig.baseUrl}${path}`);
    await ready(rig.page);
    expect(await seriousViolations(rig.page), `axe on ${path}`).toEqual([]);
    expect(await unlabelledFields(rig.page), `labels on ${path}`).toEqual([]);
  }

  it('lets a person sign in with the keyboard alone, on a page without serious violations', async () => {
    const { page } = rig;
    await check('/sign-in', (p) => p.getByLabel('E-mail').waitFor());
    await page.getByLabel('E-mail').focus();
    await page.keyboard.type('designer@example.test');
    await page.keyboard.press('Tab');
    await page.keyboard.type('tallyvolt-designer');
    await page.keyboard.press('Enter');
    await page.waitForURL((url) => url.pathname === '/');
  });

  it('finds no serious violations on the designs list, revision editor and study page', async () => {
    await check('/designs', (p) => p.getByRole('link', { name: 'PM-2 pack monitor' }).waitFor());
    const designs = await rig.page.evaluate(async () => (await (await fetch('/api/designs')).json()).items);
    const revisionId = designs[0].latestRevision.id;
    await check(`/revisions/${revisionId}`, (p) => p.locator('#readout-ratio').first().waitFor());
    await check(`/revisions/${revisionId}/study`, (p) => p.getByLabel('Number of trials').waitFor());
    expect(cspErrors).toEqual([]);
  });

  it('finds no serious violations on the calibration session page', async () => {
    const boards = await rig.page.evaluate(async () => (await (await fetch('/api/boards')).json()).items);
    const sessionId = boards[0].latestByChannel.pack.id;
    await check(`/calibrations/${sessionId}`, (p) => p.getByRole('table', { name: 'Calibration points' }).waitFor());
    expect(cspErrors).toEqual([]);
  });

  it('finds no serious violations on the review page', async () => {
    const reviews = await rig.page.evaluate(async () => (await (await fetch('/api/reviews')).json()).items);
    await check(`/revisions/${reviews[0].revision.id}/review`, (p) => p.getByRole('region', { name: 'Margin summary' }).waitFor());
    expect(cspErrors).toEqual([]);
  });
});
