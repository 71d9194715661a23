import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { StockPart } from '../../server/entities/StockPart.js';

const HEADER = 'value,tolerance_pct,package,quantity';
const SHELF = [HEADER, '4K7,1,0805,40', '1M,0.5,1206,120'].join('\n');
// "4.7k" is the same value as "4K7" (IEC 60062 RKM code, from memory); "1M" at 1 % is another part than 1M at 0.5 %.
const AGAIN = [HEADER, '4.7k,1,0805,10', '1M,1,1206,5', '1M0,0.5,1206,30', '10k,1,0805,7'].join('\n');

describe('stock duplicates', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });
  const shelf = () => t.dataSource.getRepository(StockPart).find({ order: { ohms: 'ASC', tolerancePct: 'ASC' } });
  const upload = (agent: Awaited<ReturnType<TestApp['signIn']>>, query: string, csv: string) =>
    agent.post(`/api/stock/import?${query}`).attach('file', Buffer.from(csv), 'stock.csv');

  it('flags rows already on the shelf (same value, tolerance and package) in the preview', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    expect((await upload(designer, 'mode=all', SHELF)).status).toBe(201);
    const [small, large] = await shelf();
    const preview = await upload(designer, 'mode=preview', AGAIN);
    expect(preview.status).toBe(200);
    expect(preview.body.duplicates).toEqual([
      { row: 2, partId: small.id, quantityOnShelf: 40 }, // file line 2 repeats 4K7 ±1 % 0805 (in this test)
      { row: 4, partId: large.id, quantityOnShelf: 120 }, // file line 4 repeats 1M ±0.5 % 1206 (in this test)
    ]);
    expect(await shelf()).toHaveLength(2);
  });

  it('adds the quantity to the existing line when asked, and stores the other rows as new lines', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const res = await upload(designer, 'mode=all&duplicates=add-quantity', AGAIN);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ imported: 2, addedTo: 2 }); // 4 rows: 2 repeats, 2 new (in this test)
    const rows = (await shelf()).map((p) => [p.ohms, p.tolerancePct, p.package, p.quantity]);
    expect(rows).toEqual([
      [4700, 1, '0805', 50], // 40 + 10 (in this test)
      [10000, 1, '0805', 7],
      [1e6, 0.5, '1206', 150], // 120 + 30 (in this test)
      [1e6, 1, '1206', 5],
    ]);
  });

  it('keeps a repeat as a second line when that is chosen (the default)', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const res = await upload(designer, 'mode=all', [HEADER, '10k,1,0805,3'].join('\n'));
    expect(res.body).toMatchObject({ imported: 1, addedTo: 0 });
    expect((await shelf()).filter((p) => p.ohms === 10000)).toHaveLength(2);
  });

  it('stores nothing when a file with repeats has a bad row and all rows were asked for', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const before = (await shelf()).map((p) => p.quantity);
    const res = await upload(designer, 'mode=all&duplicates=add-quantity', [HEADER, '4K7,1,0805,10', '4K7K,1,0805,1'].join('\n'));
    expect(res.status).toBe(400);
    expect((await shelf()).map((p) => p.quantity)).toEqual(before);
  });

  it('names the field when the duplicate choice is not one it knows', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const res = await upload(designer, 'mode=all&duplicates=merge', SHELF);
    expect(res.status).toBe(400);
    expect(res.body.fields.duplicates).toMatch(/new-line or add-quantity/);
  });
});
