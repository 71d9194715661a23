import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { ResistorSeries } from '../../server/entities/ResistorSeries.js';
import { findDividers } from '../../shared/finder/index.js';
import type { ResistorSeries as SeriesView } from '../../shared/schemas/series-views.js';
import { eSeriesFixture } from '../helpers/stored-series.js';

const STANDARD = ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192'] as const;

describe('stored series', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });
  const stored = () => t.dataSource.getRepository(ResistorSeries).count();
  const designer = () => t.signIn('designer@example.test', 'tallyvolt-designer');

  it('serves the IEC 60063 series E3…E192 exactly as the standard tabulates them, read-only', async () => {
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const list = await tester.get('/api/series');
    expect(list.status).toBe(200);
    const byName = new Map((list.body.items as SeriesView[]).map((s) => [s.name, s]));
    for (const name of STANDARD) {
      expect(byName.get(name)?.values).toEqual(eSeriesFixture[name]); // IEC 60063:2015 tables (tests/fixtures/e-series.json, source in its _source)
      expect(byName.get(name)?.valuesPerDecade).toBe(Number(name.slice(1))); // IEC 60063: En has n values per decade
      expect(byName.get(name)?.standard).toBe(true);
    }
    expect((list.body.items as SeriesView[]).slice(0, 7).map((s) => s.name)).toEqual(STANDARD);
    const e24 = byName.get('E24')!.values;
    for (const value of [2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]) expect(e24).toContain(value); // IEC 60063 E24, where round(10^(i/24)) differs
    expect(byName.get('E192')!.values).toContain(9.2); // IEC 60063 E192 (the formula rounds to 9.19)
    const one = await tester.get('/api/series/e96');
    expect(one.body.series.values).toEqual(eSeriesFixture.E96); // IEC 60063 E96 (tests/fixtures/e-series.json)
  });

  it('refuses to change or delete an IEC 60063 series, saying why', async () => {
    const agent = await designer();
    const del = await agent.delete('/api/series/E24');
    expect(del.status).toBe(409);
    expect(del.body.error).toContain('E24 is an IEC 60063 series and cannot be deleted');
    expect(del.body.fields).toEqual({ name: 'is a read-only IEC 60063 series' });
    const put = await agent.put('/api/series/E24').send({ values: [1, 2] });
    expect(put.status).toBe(409);
    expect(put.body.error).toContain('cannot be changed');
    expect((await agent.get('/api/series/E24')).body.series.values).toEqual(eSeriesFixture.E24); // IEC 60063 E24, unchanged
  });

  it('adds, changes and deletes a team series by form', async () => {
    const agent = await designer();
    const created = await agent.post('/api/series').send({ name: 'Shelf decades', values: [4.7, 1, 2.2] });
    expect(created.status).toBe(201);
    expect(created.body.series).toEqual({ name: 'Shelf decades', valuesPerDecade: 3, values: [1, 2.2, 4.7], standard: false });
    const again = await agent.post('/api/series').send({ name: 'Shelf decades', values: [1] });
    expect(again.status).toBe(409);
    expect(again.body.fields).toEqual({ name: 'is taken by a stored series' });
    const changed = await agent.put('/api/series/Shelf%20decades').send({ values: [1, 3.3] });
    expect(changed.body.series).toMatchObject({ valuesPerDecade: 2, values: [1, 3.3] });
    expect((await agent.delete('/api/series/Shelf%20decades')).status).toBe(204);
    expect((await agent.get('/api/series/Shelf%20decades')).status).toBe(404);
  });

  it.each([
    ['an empty name', { name: '', values: [1] }, 'name', 'name is required'],
    ['a name shaped like E7', { name: 'E7', values: [1] }, 'name', 'must not look like an IEC 60063 series'],
    ['a 41-character name', { name: 'x'.repeat(41), values: [1] }, 'name', 'at most 40 characters'],
    ['no values', { name: 'Ours', values: [] }, 'values', 'at least one value'],
    ['10 in a decade', { name: 'Ours', values: [1, 10] }, 'values.1', 'value must be ≥ 1 and < 10'],
    ['0.47 in a decade', { name: 'Ours', values: [0.47] }, 'values.0', 'value must be ≥ 1 and < 10'],
    ['a repeated value', { name: 'Ours', values: [1, 1] }, 'values', 'must not repeat a value'],
    ['193 values', { name: 'Ours', values: Array.from({ length: 193 }, (_, i) => 1 + i / 193) }, 'values', 'at most 192 values per decade'],
    ['a value given as text', { name: 'Ours', values: ['2.2'] }, 'values.0', 'value must be a number'],
    ['a standard flag', { name: 'Ours', values: [1], standard: true }, 'standard', 'not an allowed field'],
  ] as const)('refuses %s, naming the field, and stores nothing', async (_label, body, field, message) => {
    const agent = await designer();
    const before = await stored();
    const res = await agent.post('/api/series').send(body);
    expect(res.status).toBe(400);
    expect(res.body.fields[field]).toContain(message);
    expect(await stored()).toBe(before);
  });

  it('previews a series CSV with its problems per row, imports all or only the valid rows in one go', async () => {
    const agent = await designer();
    const before = await stored();
    const csv = ['value', '1.0', '1.5', 'abc', '15', '2.2', '1.5', '3.3'].join('\n');
    const preview = await agent.post('/api/series/import?mode=preview&name=Assembler%20reels').attach('file', Buffer.from(csv), 'reels.csv');
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ name: 'Assembler reels', validCount: 4, invalidCount: 3 });
    expect(preview.body.problems).toEqual([
      { row: 4, column: 'value', problem: '"abc" is not a decimal number' },
      { row: 5, column: 'value', problem: expect.stringContaining('value must be ≥ 1 and < 10') },
      { row: 7, column: 'value', problem: 'repeats the value of row 3' },
    ]);
    expect(await stored()).toBe(before);
    const all = await agent.post('/api/series/import?mode=all&name=Assembler%20reels').attach('file', Buffer.from(csv), 'reels.csv');
    expect(all.status).toBe(400);
    expect(all.body.error).toContain('3 rows have problems; nothing was imported');
    expect(await stored()).toBe(before);
    const valid = await agent.post('/api/series/import?mode=valid-only&name=Assembler%20reels').attach('file', Buffer.from(csv), 'reels.csv');
    expect(valid.status).toBe(201);
    expect(valid.body).toMatchObject({ imported: 4, skipped: 3, series: { name: 'Assembler reels', values: [1, 1.5, 2.2, 3.3], standard: false } });
    expect(await stored()).toBe(before + 1);
  });

  it('refuses a series CSV with a bad name, a missing column or too many rows, naming the field', async () => {
    const agent = await designer();
    const before = await stored();
    const noName = await agent.post('/api/series/import?mode=all').attach('file', Buffer.from('value\n1\n'), 'a.csv');
    expect(noName.status).toBe(400);
    expect(Object.keys(noName.body.fields)).toContain('name');
    const standardName = await agent.post('/api/series/import?mode=all&name=E12').attach('file', Buffer.from('value\n1\n'), 'a.csv');
    expect(standardName.body.fields.name).toContain('must not look like an IEC 60063 series');
    const wrongColumn = await agent.post('/api/series/import?mode=all&name=Ours').attach('file', Buffer.from('ohms\n1\n'), 'a.csv');
    expect(wrongColumn.status).toBe(400);
    expect(wrongColumn.body.fields).toEqual({ file: 'missing value' });
    const long = ['value', ...Array.from({ length: 193 }, (_, i) => String(1 + i / 193))].join('\n');
    const tooMany = await agent.post('/api/series/import?mode=all&name=Ours').attach('file', Buffer.from(long), 'a.csv');
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.fields).toEqual({ file: 'more than 192 rows' });
    expect(await stored()).toBe(before);
  });

  it('lets only designers and admins add a series', async () => {
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const before = await stored();
    expect((await tester.post('/api/series').send({ name: 'Ours', values: [1] })).status).toBe(403);
    expect(await stored()).toBe(before);
  });

  it('feeds a team series, as served, to the divider finder', async () => {
    const agent = await designer();
    await agent.post('/api/series').send({ name: 'Only twos', values: [2] });
    const served = (await agent.get('/api/series/Only%20twos')).body.series as SeriesView;
    const { candidates } = findDividers({ maxInputVolts: 100, targetRatio: 0.1, series: served, minTopCount: 1, maxTopCount: 1, limits: { minOhms: 1, maxOhms: 1e6 }, maxCandidates: 50 });
    const used = new Set(candidates.flatMap((c) => [...c.topOhms, c.bottomOhms]));
    for (const ohms of used) expect(String(ohms)).toMatch(/^20*$|^0\.0*2$/); // only 2·10^k Ω from a series of the single value 2, by hand
    expect(candidates[0].topOhms).toEqual([200000]); // 20 kΩ / (200 kΩ + 20 kΩ) = 1/11 is nearest 0.1 among 2·10^k pairs, by hand
  });
});
