import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { StockPart } from '../../server/entities/StockPart.js';

const GOOD_CSV = [
  'value,tolerance_pct,tcr_ppm_per_k,voltage_coefficient_ppm_per_v,rated_voltage_v,rated_power_w,package,quantity,note',
  '1M,0.5,50,1,200,0.25,1206,120,top string',
  '4K7,1,100,,150,0.125,0805,40,',
  '32.4k,0.1,25,0,75,0.1,0603,15,bottom',
  '2.49 kΩ,0.1,25,0,75,0.1,0603,8,',
].join('\n');

describe('stock', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });
  const count = () => t.dataSource.getRepository(StockPart).count();

  it('previews a good CSV without storing anything, then imports it in one go', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const preview = await designer.post('/api/stock/import?mode=preview').attach('file', Buffer.from(GOOD_CSV), 'stock.csv');
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ validCount: 4, invalidCount: 0, problems: [] });
    expect(preview.body.rows[1].part.ohms).toBe(4700); // RKM 4K7, IEC 60062
    expect(await count()).toBe(0);
    const imported = await designer.post('/api/stock/import?mode=all').attach('file', Buffer.from(GOOD_CSV), 'stock.csv');
    expect(imported.status).toBe(201);
    expect(imported.body.imported).toBe(4);
    expect(await count()).toBe(4);
    const list = await designer.get('/api/stock?sort=ohms&order=desc');
    expect(list.body.items.map((p: { ohms: number }) => p.ohms)).toEqual([1e6, 32400, 4700, 2490]);
    const found = await designer.get('/api/stock?search=4.7k');
    expect(found.body.items).toHaveLength(1);
  });

  it('round-trips the stock through its CSV download', async () => {
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const csv = await lead.get('/api/stock/export.csv');
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text.split(/\r?\n/)[0]).toBe('value,tolerance_pct,tcr_ppm_per_k,voltage_coefficient_ppm_per_v,rated_voltage_v,rated_power_w,package,quantity,note');
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const preview = await designer.post('/api/stock/import?mode=preview').attach('file', Buffer.from(csv.text), 'again.csv');
    expect(preview.body.invalidCount).toBe(0);
    expect(preview.body.rows.map((r: { part: { ohms: number } }) => r.part.ohms).sort((a: number, b: number) => a - b)).toEqual([2490, 4700, 32400, 1e6]);
  });

  it('lists every bad row with its row number and column, and stores nothing', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const before = await count();
    const bad = ['value,tolerance_pct,quantity', '1M,0.5,10', '4K7K,1,5', '10k,abc,5', '10k,1,-3', '22k,-1,4'].join('\n');
    const preview = await designer.post('/api/stock/import?mode=preview').attach('file', Buffer.from(bad), 'bad.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.invalidCount).toBe(4);
    expect(preview.body.problems).toEqual([
      { row: 3, column: 'value', problem: expect.stringContaining('4K7K') },
      { row: 4, column: 'tolerance_pct', problem: '"abc" is not a decimal number' },
      { row: 5, column: 'quantity', problem: 'quantity must be ≥ 0' },
      { row: 6, column: 'tolerance_pct', problem: 'tolerancePct must be in (0, 50] %' },
    ]);
    const refused = await designer.post('/api/stock/import?mode=all').attach('file', Buffer.from(bad), 'bad.csv');
    expect(refused.status).toBe(400);
    expect(refused.body.error).toMatch(/4 rows have problems; nothing was imported/);
    expect(await count()).toBe(before);
    const partial = await designer.post('/api/stock/import?mode=valid-only').attach('file', Buffer.from(bad), 'bad.csv');
    expect(partial.status).toBe(201);
    expect(partial.body).toMatchObject({ imported: 1, skipped: 4 });
    expect(await count()).toBe(before + 1);
  });

  it.each([
    ['a missing column', 'value,quantity\n1M,3', /missing column: tolerance_pct/],
    ['an empty file', '', /file is empty/],
    ['a duplicated header', 'value,value,tolerance_pct\n1M,1M,1', /column "value" twice/],
    ['an unknown column', 'value,tolerance_pct,colour\n1M,1,red', /unknown column: colour/],
    ['a header only', 'value,tolerance_pct\n', /no data rows/],
  ])('refuses %s with 400 and stores nothing', async (_name, csv, message) => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const before = await count();
    const res = await designer.post('/api/stock/import?mode=all').attach('file', Buffer.from(csv), 'x.csv');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(message);
    expect(await count()).toBe(before);
  });

  it('refuses a file that is not UTF-8, and an oversize file with 413', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const latin1 = Buffer.from('value,tolerance_pct,note\n1M,1,r\xe9sistance\n', 'latin1');
    const notUtf8 = await designer.post('/api/stock/import?mode=all').attach('file', latin1, 'latin1.csv');
    expect(notUtf8.status).toBe(400);
    expect(notUtf8.body.error).toMatch(/not UTF-8/);
    const huge = Buffer.alloc(1024 * 1024 + 10, 'a');
    const tooBig = await designer.post('/api/stock/import?mode=all').attach('file', huge, 'huge.csv');
    expect(tooBig.status).toBe(413);
    const none = await designer.post('/api/stock/import?mode=all').field('x', '1');
    expect(none.status).toBe(400);
    expect(none.body.fields.file).toBe('is required');
  });

  it('answers a cut-off or malformed upload with 400 and a message, and stores nothing', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const before = await count();
    const cutOff = '--cut\r\nContent-Disposition: form-data; name="file"; filename="s.csv"\r\nContent-Type: text/csv\r\n\r\nvalue,tolerance_pct\r\n1M,1';
    const res = await designer.post('/api/stock/import?mode=all').set('Content-Type', 'multipart/form-data; boundary=cut').send(cutOff);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/upload .*(incomplete|cut off)/);
    expect(res.body.fields.file).toBeTruthy();
    const noBoundary = await designer.post('/api/stock/import?mode=all').set('Content-Type', 'multipart/form-data').send('value\r\n1M');
    expect(noBoundary.status).toBe(400);
    expect(noBoundary.body.fields.file).toBeTruthy();
    expect(await count()).toBe(before);
  });

  it.each(['0x10', '0b11', '0o17', '1_000', 'Infinity', '١٢'])('reads only decimal numbers: quantity "%s" is refused', async (text) => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const preview = await designer.post('/api/stock/import?mode=preview').attach('file', Buffer.from(`value,tolerance_pct,quantity,rated_voltage_v\n1M,1,${text},200\n2M,${text},3,1e2`), 'hex.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.validCount).toBe(0);
    expect(preview.body.problems).toEqual([
      { row: 2, column: 'quantity', problem: `"${text}" is not a decimal number` },
      { row: 3, column: 'tolerance_pct', problem: `"${text}" is not a decimal number` },
    ]);
  });

  it('reads decimal quantities and values as written, with exponents', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const preview = await designer.post('/api/stock/import?mode=preview').attach('file', Buffer.from('value,tolerance_pct,quantity,rated_voltage_v\n10,0.5,010,2e2\n'), 'dec.csv');
    expect(preview.body.rows[0].part).toMatchObject({ ohms: 10, tolerancePct: 0.5, quantity: 10, ratedVoltageV: 200 }); // decimal reading, leading zero is not octal
  });

  it('lets testers and leads read but not write the stock', async () => {
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    expect((await tester.get('/api/stock')).status).toBe(200);
    expect((await tester.post('/api/stock').send({ ohms: 1000, tolerancePct: 1 })).status).toBe(403);
    expect((await tester.post('/api/stock/import').attach('file', Buffer.from(GOOD_CSV), 's.csv')).status).toBe(403);
  });

  it('creates, edits and deletes one part, naming bad fields', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const created = await designer.post('/api/stock').send({ ohms: 10e3, tolerancePct: 1, quantity: 7 });
    expect(created.status).toBe(201);
    const id = created.body.part.id;
    expect((await designer.patch(`/api/stock/${id}`).send({ quantity: 6 })).body.part.quantity).toBe(6);
    const bad = await designer.post('/api/stock').send({ ohms: -5, tolerancePct: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.fields).toMatchObject({ ohms: 'ohms must be > 0', tolerancePct: 'tolerancePct must be a number' });
    expect((await designer.delete(`/api/stock/${id}`)).status).toBe(204);
    expect((await designer.delete(`/api/stock/${id}`)).status).toBe(404);
  });
});

describe('resistor series', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('serves the seeded IEC 60063 tables', async () => {
    const agent = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const list = await agent.get('/api/series');
    expect(list.body.items.map((s: { name: string }) => s.name)).toEqual(['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192']);
    const e24 = await agent.get('/api/series/e24');
    expect(e24.body.series.values).toContain(4.7); // IEC 60063 E24 (not the rounded formula's 4.6)
    expect((await agent.get('/api/series/E192')).body.series.values).toContain(9.2); // IEC 60063 E192 9.20 (formula: 9.19)
    expect((await agent.get('/api/series/E7')).status).toBe(404);
  });
});
