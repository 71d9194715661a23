import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { putPoints } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { readCsv } from '../../server/common/csv.js';
import { CalibrationPoint } from '../../server/entities/CalibrationPoint.js';
import { MAX_POINTS_PER_SESSION } from '../../shared/schemas/calibration.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

const SESSION = {
  channelKey: 'pack', performedOn: '2026-11-22', ambientC: 23,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
  fit: { degree: 1, intercept: true, weighted: false },
};
const MAPPING = { appliedV: 'applied_v', frequencyHz: 'measured_hz' };
/** n invented bench pairs along 10 Hz/V, starting at startV. */
const pairs = (n: number, startV = 0) => Array.from({ length: n }, (_, i) => ({ appliedV: startV + i * 0.5, frequencyHz: 1000 + 10 * (startV + i * 0.5) + (i % 3) * 0.1 }));
const csvOf = (n: number, startV = 0) => ['applied_v,measured_hz', ...pairs(n, startV).map((p) => `${p.appliedV},${p.frequencyHz}`)].join('\n');

describe('points per calibration session', () => {
  let t: TestApp;
  let tester: Agent;
  let boardId: number;

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designs = (await tester.get('/api/designs')).body.items;
    const design = (await tester.get(`/api/designs/${designs[0].id}`)).body.design;
    const board = await tester.post('/api/boards').send({ serialNumber: 'LIM-001', revisionId: design.revisions[0].id, buildDate: '2026-11-18' });
    expect(board.status).toBe(201);
    boardId = board.body.board.id;
  });
  afterAll(async () => { await t.close(); });

  async function newSession(): Promise<number> {
    const res = await tester.post(`/api/boards/${boardId}/sessions`).send(SESSION);
    expect(res.status).toBe(201);
    return res.body.session.id;
  }
  const stored = (sessionId: number) => t.dataSource.getRepository(CalibrationPoint).countBy({ sessionId });
  const upload = (id: number, csv: string, mode: string, mapping: object | null = MAPPING) => {
    const req = tester.post(`/api/calibrations/${id}/points/import?mode=${mode}`).attach('file', Buffer.from(csv), 'points.csv');
    return mapping ? req.field('mapping', JSON.stringify(mapping)) : req;
  };

  it('is 500, one constant for every path', () => {
    expect(MAX_POINTS_PER_SESSION).toBe(500); // product decision: a bench calibration uses tens of points (common practice)
  });

  it('saves a table of exactly the limit and refuses one more, naming both counts and storing nothing', async () => {
    const id = await newSession();
    const atLimit = await putPoints(tester, id, { points: pairs(500) });
    expect(atLimit.status, JSON.stringify(atLimit.body).slice(0, 300)).toBe(200);
    expect(atLimit.body.session.points).toHaveLength(500); // the limit itself (in this test)
    const version = atLimit.body.session.pointsVersion;
    const over = await putPoints(tester, id, { points: pairs(501) });
    expect(over.status).toBe(400);
    expect(over.body.fields['points']).toBe('a session holds at most 500 points; this would make 501'); // limit and count (in this test)
    expect(await stored(id)).toBe(500);
    expect((await tester.get(`/api/calibrations/${id}`)).body.session.pointsVersion).toBe(version);
  });

  it('refuses the 54,585-row file at preview and at import without storing a point', async () => {
    const id = await newSession();
    const big = csvOf(54_585);
    expect(Buffer.byteLength(big)).toBeLessThan(1024 * 1024); // under the upload cap, so the points limit is what refuses it (in this test)
    for (const [mode, mapping] of [['preview', null], ['preview', MAPPING], ['all', MAPPING], ['valid-only', MAPPING]] as const) {
      const res = await upload(id, big, mode, mapping);
      expect(res.status, `${mode} ${JSON.stringify(res.body)}`).toBe(400);
      expect(res.body.error).toBe('the file has more than 500 data rows (54586 lines); a session holds at most 500 points'); // 54,585 rows + header (in this test)
      expect(res.body.fields.file).toBe('more than 500 data rows');
    }
    expect(await stored(id)).toBe(0);
  });

  it('stops reading a long file one row past the limit', () => {
    const table = readCsv(Buffer.from(`${csvOf(54_585)}\n\n`), { maxRows: MAX_POINTS_PER_SESSION });
    expect(table.rows).toHaveLength(501); // limit + 1 rows parsed, not 54,585 (in this test)
    expect(table.truncated).toBe(true);
    const blanks = readCsv(Buffer.from(['a,b', '', '1,2', '', '', '3,4', ''].join('\n')), { maxRows: 2 });
    expect(blanks.rows.map((r) => r.line)).toEqual([2, 3]); // blank lines skipped, not counted towards the limit (in this test)
    expect(blanks.truncated).toBeUndefined();
  });

  it('counts the points already stored: an import that would pass the limit is refused, one that reaches it is taken', async () => {
    const id = await newSession();
    expect((await putPoints(tester, id, { points: pairs(400) })).status).toBe(200);
    const over = await upload(id, csvOf(101, 300), 'all');
    expect(over.status).toBe(400);
    expect(over.body.error).toBe('a session holds at most 500 points; this would make 501 (400 stored and 101 rows in the file)'); // 400 + 101 (in this test)
    const preview = await upload(id, csvOf(101, 300), 'preview');
    expect(preview.status).toBe(400);
    expect(await stored(id)).toBe(400);
    const fits = await upload(id, csvOf(100, 300), 'all');
    expect(fits.status, JSON.stringify(fits.body).slice(0, 300)).toBe(201);
    expect(fits.body.imported).toBe(100);
    expect(await stored(id)).toBe(500);
    const oneMore = await upload(id, csvOf(1, 900), 'valid-only');
    expect(oneMore.status).toBe(400);
    expect(await stored(id)).toBe(500);
  });

  it('answers a GET of a session at the limit with at most the limit\'s points', async () => {
    const id = await newSession();
    expect((await putPoints(tester, id, { points: pairs(500) })).status).toBe(200);
    const res = await tester.get(`/api/calibrations/${id}`);
    expect(res.status).toBe(200);
    expect(res.body.session.points).toHaveLength(500);
    expect(res.body.session.analysis.fit.points).toHaveLength(500);
    expect(res.text.length).toBeLessThan(1024 * 1024); // a full session stays well under 1 MiB (in this test; 54,585 points made 13 MB)
  });

  it('does not fit a session stored over the limit before it existed, and will not complete it', async () => {
    const id = await newSession();
    const repo = t.dataSource.getRepository(CalibrationPoint);
    await repo.insert(pairs(600).map((p, position) => ({ ...p, sessionId: id, position }))); // as an import before the limit left it
    const res = await tester.get(`/api/calibrations/${id}`);
    expect(res.status).toBe(200);
    expect(res.body.session.analysis.fit).toBeNull();
    expect(res.body.session.analysis.reason).toBe('holds 600 points, more than the 500 a session may hold; remove points before fitting'); // 600 inserted (in this test)
    expect((await tester.post(`/api/calibrations/${id}/complete`)).status).toBe(409);
    const cut = await putPoints(tester, id, { points: pairs(20) });
    expect(cut.status).toBe(200);
    expect(cut.body.session.analysis.fit.pointsUsed).toBe(20); // back under the limit, fitted again (in this test)
  });
});
