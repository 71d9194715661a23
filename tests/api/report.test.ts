import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

/** Reads a PDF back and returns the text of every page, joined. */
async function pdfText(data: Buffer): Promise<{ pages: number; text: string }> {
  const pdf = await pdfjs.getDocument({ data: new Uint8Array(data), verbosity: 0 }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await pdf.destroy();
  return { pages: pdf.numPages, text: pages.join('\n').replace(/\s+/g, ' ') };
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- superagent's parser hands over its own response stream
const binary = (res: any, callback: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

describe('review report of the demo design', () => {
  let t: TestApp;
  let tester: Agent;
  let revisionIds: { A: number; B: number };
  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const design = (await lead.get('/api/designs')).body.items[0];
    const revisions = (await lead.get(`/api/designs/${design.id}`)).body.design.revisions;
    revisionIds = { A: revisions[0].id, B: revisions[1].id };
  });
  afterAll(async () => { await t.close(); });

  it('seeds A approved and B in review, both with current finished studies', async () => {
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const reviews = await lead.get('/api/reviews');
    expect(reviews.body.items.map((i: { revision: { letter: string } }) => i.revision.letter)).toEqual(['B']);
    expect(reviews.body.items[0].margin).toMatchObject({ verdict: 'fail', failed: 1 }); // B adds a fault case the window misses
    for (const [letter, id] of Object.entries(revisionIds)) {
      for (const path of ['studies', 'margin-studies']) {
        const runs = (await lead.get(`/api/revisions/${id}/${path}`)).body.items;
        expect(runs[0], `${letter} ${path}`).toMatchObject({ state: 'done', current: true });
      }
    }
    const approved = (await lead.get('/api/reviews?state=approved')).body.items;
    expect(approved.map((i: { revision: { letter: string } }) => i.revision.letter)).toEqual(['A']);
    expect(approved[0].margin.verdict).toBe('pass');
  });

  it('returns everything the report shows, to anyone signed in', async () => {
    const res = await tester.get(`/api/revisions/${revisionIds.B}/report`);
    expect(res.status).toBe(200);
    const r = res.body.report;
    expect(r.title).toBe('PM-2 pack monitor, revision B');
    expect(r.revision).toMatchObject({ letter: 'B', state: 'in_review', stateLabel: 'In review' });
    expect(r.channels.map((c: { key: string }) => c.key)).toEqual(['pack', 'link']);
    const divider = r.channels[1].stages.find((s: { stage: string }) => s.stage === 'Divider');
    expect(divider.rows.find((row: { label: string }) => row.label === 'bottom resistance')).toMatchObject({ value: 33200, unit: 'Ω', text: '33.2 kΩ' });
    expect(r.uncertainty).toMatchObject({ current: true, channels: [{ key: 'pack' }, { key: 'link' }] });
    expect(r.uncertainty.channels[0].budget.rows.length).toBeGreaterThan(3);
    const shares = r.uncertainty.channels[0].budget.rows.reduce((s: number, row: { sharePct: number }) => s + row.sharePct, 0);
    expect(shares).toBeCloseTo(100, 6); // GUM 5.1.2: the squared contributions add up to u_c²
    expect(r.margin).toMatchObject({ current: true, result: { verdict: 'fail' } });
    expect(r.margin.result.summary.length).toBeGreaterThan(4);
    expect(r.margin.result.faults.map((f: { verdict: string }) => f.verdict)).toEqual(['too-slow', 'too-fast', 'too-slow', 'not-detected']);
    expect(r.signOff.map((e: { label: string }) => e.label)).toEqual(['Submitted for review']);
    expect(r.caution.paragraphs.join(' ')).toMatch(/certifies nothing/);
    const a = (await tester.get(`/api/revisions/${revisionIds.A}/report`)).body.report;
    expect(a.signOff.map((e: { label: string; actor: { displayName: string } }) => `${e.label} by ${e.actor.displayName}`))
      .toEqual(['Submitted for review by Tamsin Fenwright', 'Approved by Maren Holtcroft']);
    expect(a.signOff[1].comment).toBe('Margins hold for the first build.');
    expect((await t.agent().get(`/api/revisions/${revisionIds.B}/report`)).status).toBe(401);
    expect((await tester.get('/api/revisions/9999/report')).status).toBe(404);
  });

  it('downloads a valid PDF holding the revision name and the caution', async () => {
    const res = await tester.get(`/api/revisions/${revisionIds.B}/report.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe('attachment; filename="pm-2-pack-monitor-revision-b-report.pdf"');
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const { pages, text } = await pdfText(body);
    expect(pages).toBeGreaterThan(1);
    expect(text).toContain('PM-2 pack monitor, revision B');
    expect(text).toContain('High voltage: for qualified people only');
    expect(text).toContain('Tallyvolt checks arithmetic and certifies nothing');
    expect(text).toContain('local electrical codes, the rules of the vehicle or competition');
    expect(text).toContain('Margin summary');
    expect(text).toContain('NOT DETECTED');
    expect(text).toContain('33.2 k'); // the Ω comes from the Symbol font
    expect(text).toContain('Sign-off history');
    expect((await tester.get('/api/revisions/abc/report.pdf')).status).toBe(400);
  });
});
