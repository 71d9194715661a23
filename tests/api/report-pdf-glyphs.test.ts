import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { pdfFontFiles } from '../../server/api/reports/pdf-fonts.js';
import { budgetRowTexts } from '../../shared/units/index.js';

const require = createRequire(import.meta.url);
/** pdfkit's own font reader, to ask the embedded font which code points it draws. */
const fontkit = require('fontkit') as { create(bytes: Buffer): { hasGlyphForCodePoint(code: number): boolean } };

/** Every sign outside ASCII the product prints in a report: units, prefixes, operators, arrows. */
const PRINTED_SIGNS = 'Ωµμ±²³·→×≤≥‰−–—°⁻¹⁰⁴⁵⁶⁷⁸⁹≈∞√τσΔ§’';

async function pdfText(data: Buffer): Promise<string> {
  const pdf = await pdfjs.getDocument({ data: new Uint8Array(data), verbosity: 0 }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await pdf.destroy();
  return pages.join('\n').replace(/\s+/g, ' ');
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- superagent's parser hands over its own response stream
const binary = (res: any, callback: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

describe('report PDF glyphs and budget', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({}, 'full'); });
  afterAll(async () => { await t.close(); });

  it('embeds fonts that draw every sign the product prints, regular and bold', () => {
    for (const [name, bytes] of Object.entries(pdfFontFiles())) {
      const font = fontkit.create(bytes);
      const missing = [...PRINTED_SIGNS].filter((ch) => !font.hasGlyphForCodePoint(ch.codePointAt(0)!));
      expect(missing, name).toEqual([]);
    }
  });

  it('prints the budget as the report page shows it: units on every number, no internal paths', async () => {
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const design = (await lead.get('/api/designs')).body.items[0];
    const revisionId = (await lead.get(`/api/designs/${design.id}`)).body.design.revisions[1].id;
    const report = (await lead.get(`/api/revisions/${revisionId}/report`)).body.report;
    const res = await lead.get(`/api/revisions/${revisionId}/report.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    // the font draws U+00B5 and U+03BC with one glyph, and a PDF maps a glyph back to one code point: read both as the micro sign
    const text = (await pdfText(res.body as Buffer)).replace(/\u03bc/g, '\u00b5');
    expect(text).not.toMatch(/divider\.(top\[|bottom)/);
    expect(text).not.toMatch(/\d(\.\d+)?e[-+]?\d| 1\/V\b| 1\/K\b/); // no raw SI: exponent notation, '1/V' or '1/K' units
    for (const channel of report.uncertainty.channels) {
      for (const row of channel.budget.rows) {
        const cells = budgetRowTexts(row);
        // the same text as the report page, signs included (µ read back as the micro sign it was written as)
        for (const cell of [cells.bound, cells.standardUncertainty, cells.sensitivity]) expect(text).toContain(cell);
      }
    }
    expect(text).toMatch(/\d µV/); // e.g. "63 µV": the micro sign survives the round trip
    expect(text).toContain('V·K/Hz'); // converter offset drift: V ÷ (Hz/K), JCGM 100:2008 5.1.3
  });
});
