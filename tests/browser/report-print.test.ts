import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';
import { openBrowserRig, type BrowserRig } from '../helpers/browser.js';
import { ARTIFACTS_DIR } from '../helpers/built-client.js';

/** The text of each page of a PDF. */
async function pageTexts(data: Buffer): Promise<string[]> {
  const pdf = await pdfjs.getDocument({ data: new Uint8Array(data), verbosity: 0 }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' ').replace(/\s+/g, ' '));
  }
  await pdf.destroy();
  return pages;
}

describe('printing the review report from the browser', () => {
  let rig: BrowserRig;
  let revisionId = 0;
  beforeAll(async () => {
    rig = await openBrowserRig();
    const lead = await rig.app.signIn('lead@example.test', 'tallyvolt-lead');
    revisionId = (await lead.get('/api/reviews?state=in_review')).body.items[0].revision.id;
  });
  afterAll(async () => { await rig?.close(); });

  it('fills the first page instead of breaking before every section, and prints the budget with its units', async () => {
    const { page } = rig;
    await page.goto(`${rig.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('lead@example.test');
    await page.getByLabel('Password').fill('tallyvolt-lead');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.goto(`${rig.baseUrl}/revisions/${revisionId}/report`);
    await page.getByRole('heading', { name: 'Margin study', level: 2 }).waitFor();
    const pdf = await page.pdf({ format: 'A4', printBackground: false });
    fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
    fs.writeFileSync(path.join(ARTIFACTS_DIR, 'report-print.pdf'), pdf); // for a look with pdftoppm: layout is a screenshot check
    const pages = await pageTexts(pdf);
    // page 1 carries the title, the caution and the start of the first section, not the title alone
    expect(pages[0]).toContain('High voltage');
    expect(pages[0]).toMatch(/Revision comparison|Measurement chains/);
    expect(pages[0].length).toBeGreaterThan(1200); // an A4 page of 11 pt text holds several thousand characters (common practice)
    const all = pages.join(' ');
    expect(all).toContain('V·K/Hz'); // converter offset drift: V ÷ (Hz/K), JCGM 100:2008 5.1.3
    expect(all).not.toMatch(/divider\.(top\[|bottom)/);
  });
});
