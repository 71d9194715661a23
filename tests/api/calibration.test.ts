import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { patchPoint, putPoints } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { loadDataset, matchingDigits } from '../shared/fit/nist-strd-fixture.js';
import { CalibrationPoint } from '../../server/entities/CalibrationPoint.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

const SESSION = {
  channelKey: 'pack', performedOn: '2026-11-20', ambientC: 23,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
};

/** Moves a decimal string's point four places left (exact, no binary rounding): "150000" → "15.0000". */
const tenThousandths = (s: string) => {
  const [int, frac = ''] = s.split('.');
  const padded = int.padStart(5, '0');
  return `${padded.slice(0, -4)}.${padded.slice(-4)}${frac}`.replace(/^0+(?=\d)/, '');
};

describe('bench calibration', () => {
  let t: TestApp;
  let tester: Agent;
  let boardId: number;
  const points = () => t.dataSource.getRepository(CalibrationPoint).count();

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designs = (await tester.get('/api/designs')).body.items;
    const design = (await tester.get(`/api/designs/${designs[0].id}`)).body.design;
    const board = await tester.post('/api/boards').send({ serialNumber: 'TEST-001', revisionId: design.revisions[0].id, buildDate: '2026-11-18' });
    expect(board.status).toBe(201);
    boardId = board.body.board.id;
  });
  afterAll(async () => { await t.close(); });

  async function newSession(fit?: object): Promise<number> {
    const res = await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, ...(fit ? { fit } : {}) });
    expect(res.status).toBe(201);
    return res.body.session.id;
  }

  async function upload(id: number, csv: string | Buffer, mapping?: object, mode = 'all') {
    const req = tester.post(`/api/calibrations/${id}/points/import?mode=${mode}`).attach('file', Buffer.from(csv), 'points.csv');
    return mapping ? req.field('mapping', JSON.stringify(mapping)) : req;
  }

  it('reproduces the NIST StRD Norris certified values through a CSV upload', async () => {
    const norris = loadDataset('Norris');
    const csv = ['reference_v,measured_hz', ...norris.x.map((x, i) => `${x},${norris.y[i]}`)].join('\n');
    const id = await newSession({ degree: 1, intercept: true, weighted: false });
    const mapStep = await upload(id, csv, undefined, 'preview');
    expect(mapStep.body.headers).toEqual(['reference_v', 'measured_hz']);
    expect(mapStep.body.suggestedMapping).toEqual({ appliedV: 'reference_v', frequencyHz: 'measured_hz' });
    const res = await upload(id, csv, { appliedV: 'reference_v', frequencyHz: 'measured_hz' });
    expect(res.status).toBe(201);
    expect(res.body.imported).toBe(36);
    const fit = res.body.session.analysis.fit;
    for (let k = 0; k < 2; k++) {
      expect(matchingDigits(fit.coefficients[k], norris.estimates[k])).toBeGreaterThanOrEqual(12); // NIST StRD Norris, certified values
      expect(matchingDigits(fit.standardErrors[k], norris.standardDeviations[k])).toBeGreaterThanOrEqual(12); // NIST StRD Norris, certified values
    }
    expect(matchingDigits(fit.residualStandardDeviationHz, norris.residualSd)).toBeGreaterThanOrEqual(12); // NIST StRD Norris, certified values
    expect(matchingDigits(fit.rSquared, norris.rSquared)).toBeGreaterThanOrEqual(12); // NIST StRD Norris, certified values
  });

  it('reproduces NIST StRD Pontius at degree 2 (load in units of 10⁴)', async () => {
    const raw = JSON.parse(fs.readFileSync(path.resolve(import.meta.dirname, '../fixtures/nist-strd/certified.json'), 'utf8')).Pontius;
    const pontius = loadDataset('Pontius');
    const yAt = raw.columns.indexOf('y');
    const xAt = raw.columns.indexOf('x');
    const csv = ['load_1e4;deflection', ...raw.data.map((r: string[]) => `${tenThousandths(r[xAt]).replace(".", ",")};${r[yAt].replace('.', ',')}`)].join('\n');
    const id = await newSession({ degree: 2, intercept: true, weighted: false });
    // Semicolons with decimal commas are read as such once the mapping says so.
    const res = await upload(id, csv, { appliedV: 'load_1e4', frequencyHz: 'deflection', decimalSeparator: ',' });
    expect(res.body.error).toBeUndefined();
    expect(res.status).toBe(201);
    const fit = res.body.session.analysis.fit;
    const scale = [1, 1e4, 1e8]; // x in units of 10⁴: b_k scales by 10⁴ᵏ
    for (let k = 0; k < 3; k++) {
      expect(matchingDigits(fit.coefficients[k], pontius.estimates[k] * scale[k])).toBeGreaterThanOrEqual(9); // NIST StRD Pontius, certified values
      expect(matchingDigits(fit.standardErrors[k], pontius.standardDeviations[k] * scale[k])).toBeGreaterThanOrEqual(9); // NIST StRD Pontius, certified values
    }
    expect(matchingDigits(fit.residualStandardDeviationHz, pontius.residualSd)).toBeGreaterThanOrEqual(9); // NIST StRD Pontius, certified values
  });

  it.each([
    ['a missing column', 'reference_v\n100\n200', { appliedV: 'reference_v', frequencyHz: 'measured_hz' }, /no column "measured_hz"/],
    ['an empty file', '', { appliedV: 'v', frequencyHz: 'f' }, /file is empty/],
    ['a duplicated header', 'v,v,f\n1,1,2', { appliedV: 'v', frequencyHz: 'f' }, /column "v" twice/],
    ['semicolons with decimal commas read as points', 'v;f\n100,5;1000,25\n200,5;2000,5', { appliedV: 'v', frequencyHz: 'f', decimalSeparator: '.' }, /row.*not a number|problems/],
  ])('refuses %s with 4xx and stores nothing', async (_name, csv, mapping, message) => {
    const id = await newSession();
    const before = await points();
    const res = await upload(id, csv, mapping);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(res.body.error).toMatch(message);
    expect(await points()).toBe(before);
  });

  it('names the row and column of text in a number, and stores nothing from that file', async () => {
    const id = await newSession();
    const before = await points();
    const csv = 'v,f\n100,1000\n200,abc\n300,3000\nx,4000';
    const preview = await upload(id, csv, { appliedV: 'v', frequencyHz: 'f' }, 'preview');
    expect(preview.body.problems).toEqual([
      { row: 3, column: 'f', problem: '"abc" is not a number' },
      { row: 5, column: 'v', problem: '"x" is not a number' },
    ]);
    const refused = await upload(id, csv, { appliedV: 'v', frequencyHz: 'f' });
    expect(refused.status).toBe(400);
    expect(refused.body.error).toMatch(/2 rows have problems; nothing was imported/);
    expect(await points()).toBe(before);
  });

  it('reads semicolon files with decimal commas by default, and converts raw counts', async () => {
    const id = await newSession();
    const semi = await upload(id, 'v;f\n100,5;1000,25\n200,5;2000,5', { appliedV: 'v', frequencyHz: 'f' }, 'preview');
    expect(semi.body.decimalSeparator).toBe(',');
    expect(semi.body.rows.map((r: { point: { appliedV: number } }) => r.point.appliedV)).toEqual([100.5, 200.5]);
    // Period capture of the demo chain: 16 periods at 80 MHz; 32 000 counts → 40 kHz.
    const counts = await upload(id, 'v,ticks\n500,32000', { appliedV: 'v', counts: 'ticks' }, 'preview');
    expect(counts.body.rows[0].point).toMatchObject({ counts: 32000, frequencyHz: 40_000 }); // f = N·f_clk/counts, common practice
  });

  it('refuses oversize and non-UTF-8 uploads', async () => {
    const id = await newSession();
    const big = await upload(id, Buffer.alloc(1024 * 1024 + 1, '1'), { appliedV: 'v', frequencyHz: 'f' });
    expect(big.status).toBe(413);
    const latin = await upload(id, Buffer.from('v,f,note\n1,2,caf\xe9\n', 'latin1'), { appliedV: 'v', frequencyHz: 'f' });
    expect(latin.status).toBe(400);
    expect(latin.body.error).toMatch(/not UTF-8/);
  });

  it('flags a planted outlier as suspect, excludes it with a reason and keeps it stored', async () => {
    const id = await newSession();
    const rows = Array.from({ length: 10 }, (_, i) => {
      const v = 50 * (i + 1);
      const f = 500 + 80.35 * v + (i === 6 ? 60 : [0.4, -0.3, 0.1, -0.2, 0.3, -0.1, 0, 0.2, -0.4, 0.1][i]);
      return { appliedV: v, frequencyHz: f };
    });
    const put = await putPoints(tester, id, { points: rows });
    expect(put.status).toBe(200);
    const suspect = put.body.session.analysis.fit.points.filter((p: { suspect: boolean }) => p.suspect);
    expect(suspect).toHaveLength(1);
    const pointId = suspect[0].id;
    const noReason = await patchPoint(tester, id, pointId, { excluded: true });
    expect(noReason.status).toBe(400);
    expect(noReason.body.fields.reason).toBe('give a reason for excluding a point');
    const excluded = await patchPoint(tester, id, pointId, { excluded: true, reason: 'probe slipped' });
    expect(excluded.status).toBe(200);
    expect(excluded.body.session.points).toHaveLength(10);
    expect(excluded.body.session.analysis.fit.pointsUsed).toBe(9);
    expect(excluded.body.session.points.find((p: { id: number }) => p.id === pointId)).toMatchObject({ excluded: true, excludedReason: 'probe slipped' });
  });

  it('lets a designer read but not write, and a tester complete with an e-mail to the design owner', async () => {
    const id = await newSession();
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    expect((await designer.get(`/api/calibrations/${id}`)).status).toBe(200);
    expect((await putPoints(designer, id, { points: [] })).status).toBe(403);
    expect((await designer.post(`/api/boards/${boardId}/sessions`).send(SESSION)).status).toBe(403);
    expect((await designer.post(`/api/calibrations/${id}/complete`)).status).toBe(403);
    expect((await designer.patch(`/api/calibrations/${id}`).send({ ambientC: 24 })).status).toBe(403);
    const edited = await tester.patch(`/api/calibrations/${id}`).send({ ambientC: 24.5, fit: { degree: 2, intercept: true, weighted: false } });
    expect(edited.status).toBe(200);
    expect(edited.body.session).toMatchObject({ ambientC: 24.5, fit: { degree: 2 } });
    const badEdit = await tester.patch(`/api/calibrations/${id}`).send({ ambientC: 300 });
    expect(badEdit.status).toBe(400);
    expect(badEdit.body.fields.ambientC).toBe('ambient temperature must be −40…85 °C');
    await tester.patch(`/api/calibrations/${id}`).send({ fit: { degree: 1, intercept: true, weighted: true } });
    const early = await tester.post(`/api/calibrations/${id}/complete`);
    expect(early.status).toBe(409);
    expect(early.body.error).toMatch(/needs at least 3 points/);
    const rows = [100, 200, 300, 400, 500].map((v) => ({ appliedV: v, frequencyHz: 500 + 80.35 * v + (v % 200 ? 0.3 : -0.3) }));
    await putPoints(tester, id, { points: rows });
    const done = await tester.post(`/api/calibrations/${id}/complete`);
    expect(done.status).toBe(200);
    expect(done.body.session.state).toBe('complete');
    const mail = (await t.outbox()).find((m) => m.text.includes(`/calibrations/${id}`));
    expect(mail?.to).toContain('designer@example.test');
    expect(mail?.subject).toMatch(/Calibration of TEST-001 Pack side/);
    expect((await putPoints(tester, id, { points: rows })).status).toBe(409);
  });

  it('states the uncertainty of a read-back voltage with the reference instrument in it, and exports it', async () => {
    const id = await newSession({ degree: 1, intercept: true, weighted: false });
    const rows = [0, 125, 250, 375, 500].map((v, i) => ({ appliedV: v, frequencyHz: 512.5 + 80.41 * v + [0.2, -0.1, 0.3, -0.2, 0.1][i] }));
    const fit = (await putPoints(tester, id, { points: rows })).body.session.analysis.fit;
    const { percentOfReading, plusVolts } = SESSION.reference;
    expect(fit.readingUncertainty.map((u: { appliedV: number }) => u.appliedV)).toEqual([0, 125, 250, 375, 500]);
    const top = fit.readingUncertainty[4];
    // the reference's limit ±(% of reading + volts) read as rectangular: u = a/√3 (JCGM 100 4.3.7)
    expect(top.referenceV).toBeCloseTo(((percentOfReading / 100) * 500 + plusVolts) / Math.sqrt(3), 12);
    expect(top.combinedV).toBeCloseTo(Math.hypot(top.fitV, top.referenceV), 12);
    expect(top.expandedV).toBeCloseTo(top.coverageFactor * top.combinedV, 12);
    const json = (await tester.get(`/api/calibrations/${id}/export.json`)).body;
    expect(json.readingUncertainty.points[4].expandedV).toBeCloseTo(top.expandedV, 12);
    const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
    expect(header).toContain(`+-${top.expandedV.toPrecision(2)} V at 500.0 V`);
  });

  it('gives the board\'s gain and offset errors an uncertainty with the reference in it, and says when it blurs the verdict', async () => {
    const res = await tester.post(`/api/boards/${boardId}/sessions`).send({
      ...SESSION, reference: { description: 'a coarse handheld meter', percentOfReading: 1, plusVolts: 1 }, fit: { degree: 1, intercept: true, weighted: false },
    });
    const id = res.body.session.id;
    const rows = [0, 125, 250, 375, 500].map((v, i) => ({ appliedV: v, frequencyHz: 512.5 + 80.41 * v + [0.2, -0.1, 0.3, -0.2, 0.1][i] }));
    const { comparison } = (await putPoints(tester, id, { points: rows })).body.session.analysis;
    // A 1 % + 1 V limit read as rectangular (JCGM 100 4.3.7) swamps the fit's own standard errors: U ≈ 2·a/√3.
    expect(comparison.board.coverageFactor).toBe(2);
    expect(comparison.board.gainErrorExpanded).toBeCloseTo((2 * 0.01) / Math.sqrt(3), 4);
    expect(comparison.board.offsetErrorExpandedV).toBeCloseTo(2 / Math.sqrt(3), 2);
    expect(comparison.board.offsetErrorExpandedV).toBeGreaterThan(2 / Math.sqrt(3));
    // ±1.15 V around the board's offset is wider than the design's whole offset interval, so no verdict is safe.
    expect(comparison.population.offsetErrorV.high - comparison.population.offsetErrorV.low).toBeLessThan(2 * comparison.board.offsetErrorExpandedV);
    expect(comparison.undecided).toBe(true);
  });

  it('exports a C header that compiles with cc and prints the fitted coefficients', async () => {
    const id = await newSession();
    const rows = [0, 125, 250, 375, 500].map((v, i) => ({ appliedV: v, frequencyHz: 512.5 + 80.41 * v + [0.2, -0.1, 0.3, -0.2, 0.1][i] }));
    const session = (await putPoints(tester, id, { points: rows })).body.session;
    const header = await tester.get(`/api/calibrations/${id}/export.h`);
    expect(header.status).toBe(200);
    expect(header.headers['content-disposition']).toMatch(/tallyvolt_test_001_pack\.h/);
    const json = await tester.get(`/api/calibrations/${id}/export.json`);
    expect(json.body.reading.coefficients).toEqual(session.analysis.fit.inverse.coefficients);
    const dir = fs.mkdtempSync(path.join(t.dir, 'cc-'));
    fs.writeFileSync(path.join(dir, 'cal.h'), header.text);
    fs.writeFileSync(path.join(dir, 'main.c'), [
      '#include <stdio.h>', '#include "cal.h"', '#include "cal.h"', // the include guard makes a second include harmless
      'int main(void) {',
      '  for (int k = 0; k < TV_PACK_COEFF_COUNT; k++) printf("%.9g %.9g\\n", (double)tv_pack_coeff[k], (double)tv_pack_volts_fixed((uint32_t)(20000u << TV_PACK_FREQ_FRAC_BITS)) / (double)(1ULL << TV_PACK_VOLTS_FRAC_BITS));',
      '  printf("%s %s %g %g\\n", TV_PACK_BOARD_SERIAL, TV_PACK_REVISION, (double)tv_pack_min_v, (double)tv_pack_max_v);',
      '  return 0;', '}',
    ].join('\n'));
    execFileSync('cc', ['-std=c99', '-Wall', '-Wextra', '-Werror', '-o', path.join(dir, 'main'), path.join(dir, 'main.c')]);
    const lines = execFileSync(path.join(dir, 'main'), { encoding: 'utf8' }).trim().split('\n');
    const [c0, c1] = session.analysis.fit.inverse.coefficients;
    const printed = lines.slice(0, 2).map((l) => l.split(' ').map(Number));
    expect(printed[0][0]).toBeCloseTo(c0, 5); // float keeps ~7 significant digits
    expect(Math.abs(printed[1][0] / c1 - 1)).toBeLessThan(1e-6);
    expect(printed[0][1]).toBeCloseTo(c0 + c1 * 20000, 5); // the fixed-point reading at 20 kHz keeps ~1 µV: V = c0 + c1·f (common practice)
    expect(lines[2]).toBe('TEST-001 A 0 500');
    // The inverse recovers the applied voltage from the fitted frequency: V = c0 + c1·f (common practice).
    expect(c0 + c1 * (512.5 + 80.41 * 250)).toBeCloseTo(250, 0);
  });
});

describe('the demo board', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({}, 'full'); });
  afterAll(async () => { await t.close(); });

  it('has one completed calibration per channel, within the design spread, on the cross-board overview', async () => {
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const boards = (await lead.get('/api/boards')).body.items;
    expect(boards.map((b: { serialNumber: string }) => b.serialNumber)).toEqual(['PM-2-001']);
    expect(Object.keys(boards[0].latestByChannel).sort()).toEqual(['link', 'pack']);
    for (const key of ['pack', 'link']) {
      const summary = boards[0].latestByChannel[key];
      expect(summary.state).toBe('complete');
      const session = (await lead.get(`/api/calibrations/${summary.id}`)).body.session;
      expect(session.analysis.fit.pointsUsed).toBe(11);
      expect(session.analysis.comparison.within).toBe(true);
      expect(session.analysis.comparison.likelyCauses).toEqual([]);
      const overview = await lead.get(`/api/calibrations/overview?revisionId=${boards[0].revisionId}&channelKey=${key}`);
      expect(overview.body.boards[0]).toMatchObject({ serialNumber: 'PM-2-001', within: true });
      expect(overview.body.population.gainError.low).toBeLessThan(overview.body.population.gainError.high);
    }
  });

  it('says a board with a wrong resistor is outside the spread and lists likely causes', async () => {
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const boards = (await tester.get('/api/boards')).body.items;
    const id = (await tester.post(`/api/boards/${boards[0].id}/sessions`).send({ ...SESSION })).body.session.id;
    // 10 % high gain: as if a 36 kΩ bottom resistor were fitted instead of 32.4 kΩ.
    const rows = [100, 200, 300, 400, 500].map((v) => ({ appliedV: v, frequencyHz: 500 + 80.35 * 1.11 * v }));
    const session = (await putPoints(tester, id, { points: rows })).body.session;
    expect(session.analysis.comparison.within).toBe(false);
    expect(session.analysis.comparison.likelyCauses[0]).toMatch(/wrong value/);
  });
});
