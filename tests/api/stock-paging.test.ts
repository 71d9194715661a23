import { Writable } from 'node:stream';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { StockPart } from '../../server/entities/StockPart.js';
import { STOCK_PART_LIMIT } from '../../shared/schemas/stock.js';
import { streamCsv } from '../../server/common/csv-write.js';

const csvOf = (rows: string[]) => ['value,tolerance_pct,quantity', ...rows].join('\n');

describe('a full stock', () => {
  let t: TestApp;
  const count = () => t.dataSource.getRepository(StockPart).count();
  beforeAll(async () => {
    t = await createTestApp();
    const repo = t.dataSource.getRepository(StockPart);
    const parts = Array.from({ length: STOCK_PART_LIMIT - 2 }, (_, i) => repo.create({ ohms: 10 + i, tolerancePct: 1, quantity: i % 7 }));
    for (let i = 0; i < parts.length; i += 500) await repo.insert(parts.slice(i, i + 500));
  });
  afterAll(async () => { await t.close(); });

  it('states its limit of 10 000 parts', () => {
    expect(STOCK_PART_LIMIT).toBe(10_000); // product decision, stated in the README and on the stock page
  });

  it('lists one page at a time with the total', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const page = await designer.get('/api/stock?page=3&pageSize=100&sort=ohms&order=asc');
    expect(page.status).toBe(200);
    expect(page.body.total).toBe(STOCK_PART_LIMIT - 2);
    expect(page.body.items).toHaveLength(100);
    expect(page.body.items[0].ohms).toBe(10 + 200); // third page of 100 in ascending order, from the seeding above
    const tooBig = await designer.get('/api/stock?pageSize=5000');
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.fields.pageSize).toMatch(/200/);
  });

  it('refuses an import that would pass the limit, says how much room is left, and stores nothing', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const three = csvOf(['1M,1,1', '2M,1,1', '3M,1,1']);
    const preview = await designer.post('/api/stock/import?mode=preview').attach('file', Buffer.from(three), 'three.csv');
    expect(preview.status).toBe(200);
    expect(preview.body.room).toBe(2);
    const refused = await designer.post('/api/stock/import?mode=all').attach('file', Buffer.from(three), 'three.csv');
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/at most 10000 parts.*room for 2.*nothing was imported/);
    expect(refused.body.fields.file).toMatch(/room for 2/);
    expect(await count()).toBe(STOCK_PART_LIMIT - 2);
    const two = await designer.post('/api/stock/import?mode=all').attach('file', Buffer.from(csvOf(['1M,1,1', '2M,1,1'])), 'two.csv');
    expect(two.status).toBe(201);
    expect(await count()).toBe(STOCK_PART_LIMIT);
  });

  it('refuses one more part by hand when full, and takes it again after a delete', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const full = await designer.post('/api/stock').send({ ohms: 4700, tolerancePct: 1 });
    expect(full.status).toBe(409);
    expect(full.body.error).toMatch(/at most 10000 parts/);
    expect(await count()).toBe(STOCK_PART_LIMIT);
    const first = (await designer.get('/api/stock?pageSize=1')).body.items[0];
    expect((await designer.delete(`/api/stock/${first.id}`)).status).toBe(204);
    expect((await designer.post('/api/stock').send({ ohms: 4700, tolerancePct: 1 })).status).toBe(201);
  });

  it('streams the whole stock as CSV in value order', async () => {
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const res = await lead.get('/api/stock/export.csv');
    expect(res.status).toBe(200);
    expect(res.headers['transfer-encoding']).toBe('chunked');
    const rows = Papa.parse<string[]>(res.text, { skipEmptyLines: true }).data;
    expect(rows).toHaveLength(STOCK_PART_LIMIT + 1);
    const quantities = rows.slice(1).map((r) => Number(r[7]));
    expect(quantities.every(Number.isInteger)).toBe(true);
    const stored = await t.dataSource.getRepository(StockPart).find({ order: { ohms: 'ASC', id: 'ASC' }, select: { quantity: true } });
    expect(quantities).toEqual(stored.map((p) => p.quantity));
  });

  it('answers a signed-in check while four full downloads are under way', async () => {
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const finished: string[] = [];
    const downloads = [1, 2, 3, 4].map((n) => lead.get('/api/stock/export.csv').then((res) => { finished.push(`download ${n}`); return res; }));
    const me = lead.get('/api/auth/me').then((res) => { finished.push('me'); return res; });
    const [answers, who] = await Promise.all([Promise.all(downloads), me]);
    expect(who.status).toBe(200);
    for (const res of answers) expect(res.text.trimEnd().split('\r\n')).toHaveLength(STOCK_PART_LIMIT + 1);
    expect(finished.indexOf('me')).toBeLessThan(4); // order of completion only: the downloads yield between pages
  });
});

describe('streaming a CSV', () => {
  async function* batches(n: number, onPull: () => void) {
    for (let b = 0; b < n; b++) {
      onPull();
      yield Array.from({ length: 50 }, (_, i) => [b * 50 + i, `part ${b}-${i}`]);
    }
  }

  it('waits for a slow reader to drain and lets the event loop turn between batches', async () => {
    const received: string[] = [];
    const out = new Writable({
      highWaterMark: 256,
      write(chunk: Buffer, _enc, done) {
        received.push(chunk.toString());
        setTimeout(done, 1); // a slow reader
      },
    });
    let turns = 0;
    let ticking = true;
    const tick = () => { turns++; if (ticking) setImmediate(tick); };
    setImmediate(tick);
    const seen: { turns: number; buffered: number }[] = [];
    await streamCsv(out, ['id', 'name'], batches(6, () => seen.push({ turns, buffered: out.writableLength })));
    ticking = false;
    for (const pull of seen) expect(pull.buffered).toBeLessThan(out.writableHighWaterMark); // backpressure: Node stream contract
    for (let i = 1; i < seen.length; i++) expect(seen[i].turns).toBeGreaterThan(seen[i - 1].turns); // the loop ran between batches
    const text = received.join('');
    expect(text.split('\r\n')[0]).toBe('id,name');
    expect(text.trimEnd().split('\r\n')).toHaveLength(1 + 6 * 50);
  });

  it('stops reading when the reader goes away', async () => {
    const out = new Writable({ highWaterMark: 64, write(_c, _e, done) { setTimeout(done, 1); } });
    let pulls = 0;
    const streaming = streamCsv(out, ['id', 'name'], batches(1000, () => { pulls++; if (pulls === 3) out.destroy(); }));
    await streaming;
    expect(pulls).toBeLessThanOrEqual(4);
  });
});
