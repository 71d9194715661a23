import jStat from 'jstat';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

const SESSION = {
  channelKey: 'pack', performedOn: '2026-11-20', ambientC: 23,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
};

/** Invented bench pairs whose scatter grows with frequency, u ≈ 0.02 Hz + 2·10⁻⁵·f. */
const VOLTS = [0, 50, 100, 150, 200, 250, 300, 350, 400, 450, 500];
const HERTZ = [512.31, 4532.86, 8553.02, 12572.35, 16593.6, 20613.1, 24631.9, 28654.4, 32671.2, 36695.8, 40712.1];
const U_HZ = HERTZ.map((f) => Number((0.02 + 2e-5 * f).toFixed(4)));

describe('calibration fit settings, read-back and guarded acceptance', () => {
  let t: TestApp;
  let tester: Agent;
  let boardId: number;

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designs = (await tester.get('/api/designs')).body.items;
    const design = (await tester.get(`/api/designs/${designs[0].id}`)).body.design;
    const board = await tester.post('/api/boards').send({ serialNumber: 'ACC-001', revisionId: design.revisions[0].id, buildDate: '2026-11-18' });
    boardId = board.body.board.id;
  });
  afterAll(async () => { await t.close(); });

  async function sessionWith(rows: string[], mapping: object, body: object = {}) {
    const created = await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, ...body });
    expect(created.status).toBe(201);
    const id = created.body.session.id as number;
    const imported = await tester.post(`/api/calibrations/${id}/points/import?mode=all`)
      .attach('file', Buffer.from(rows.join('\n')), 'points.csv').field('mapping', JSON.stringify(mapping));
    expect(imported.status).toBe(201);
    return { id, session: imported.body.session };
  }

  it('reads per-point u as relative by default, shows the Birge ratio, and as known when asked', async () => {
    const rows = ['applied_v,frequency_hz,u_hz', ...VOLTS.map((v, i) => `${v},${HERTZ[i]},${U_HZ[i]}`)];
    const { id, session } = await sessionWith(rows, { appliedV: 'applied_v', frequencyHz: 'frequency_hz', uncertaintyHz: 'u_hz' });
    const relative = session.analysis.fit;
    expect(relative.weighting).toBe('relative');
    const chiSquared = relative.points.reduce((s: number, p: { residualHz: number }, i: number) => s + (p.residualHz / U_HZ[i]) ** 2, 0);
    expect(relative.birgeRatio).toBeCloseTo(Math.sqrt(chiSquared / (VOLTS.length - 2)), 10); // Birge ratio √(χ²/ν) (common practice)
    // The top reading's own u(f): linear between the two highest bench frequencies, held beyond the highest (in this test).
    const top = relative.readingUncertainty[4];
    const fTop = relative.band[relative.band.length - 1].fittedHz;
    const expectedU = fTop >= HERTZ[10] ? U_HZ[10] : U_HZ[9] + ((U_HZ[10] - U_HZ[9]) * (fTop - HERTZ[9])) / (HERTZ[10] - HERTZ[9]);
    expect(top.newReadingHz).toBeCloseTo(expectedU, 12); // linear interpolation (common practice)

    const patched = await tester.patch(`/api/calibrations/${id}`).send({ fit: { degree: 1, intercept: true, weighted: true, weighting: 'absolute' } });
    expect(patched.status).toBe(200);
    const absolute = patched.body.session.analysis.fit;
    expect(patched.body.session.fit.weighting).toBe('absolute');
    expect(absolute.weighting).toBe('absolute');
    for (let k = 0; k < 2; k++) {
      // relative weights scale the covariance by s² = χ²/ν, known u do not (Bevington & Robinson §6.4; NIST/SEMATECH e-Handbook §4.4.3.2)
      expect(absolute.standardErrors[k]).toBeCloseTo(relative.standardErrors[k] / relative.birgeRatio, 12);
    }
    expect(absolute.readingUncertainty[4].degreesOfFreedom).toBeNull(); // ν = ∞ for known u, sent as null (JSON has no infinity)
    expect(absolute.readingUncertainty[4].coverageFactor).toBeCloseTo(1.959963984540054, 12); // normal 97.5 % point, ν = ∞ (JCGM 100 Table G.2)
    const json = (await tester.get(`/api/calibrations/${id}/export.json`)).body;
    expect(json.forwardFit).toMatchObject({ weighting: 'absolute', birgeRatio: absolute.birgeRatio });
    expect(json.readingUncertainty.points[4].newReadingHz).toBeCloseTo(absolute.readingUncertainty[4].newReadingHz, 12);
  });

  it('refuses an unknown weighting convention and names the field', async () => {
    const created = await tester.post(`/api/boards/${boardId}/sessions`).send(SESSION);
    const bad = await tester.patch(`/api/calibrations/${created.body.session.id}`).send({ fit: { degree: 1, intercept: true, weighted: true, weighting: 'known' } });
    expect(bad.status).toBe(400);
    expect(bad.body.fields['fit.weighting']).toBe('weighting must be relative or absolute');
    expect((await tester.get(`/api/calibrations/${created.body.session.id}`)).body.session.fit.weighting).toBeUndefined(); // nothing half-written
  });

  it('puts the inverse polynomial\'s largest departure into the read-back uncertainty and says so in the exports', async () => {
    const rows = ['v,f', ...VOLTS.map((v, i) => `${v},${(512.5 + 80.41 * v + 0.004 * v * v + [0.2, -0.1, 0.3, -0.2, 0.1, 0, -0.3, 0.2, 0.1, -0.1, 0.2][i]).toFixed(2)}`)];
    const { id, session } = await sessionWith(rows, { appliedV: 'v', frequencyHz: 'f' }, { fit: { degree: 2, intercept: true, weighted: false } });
    const fit = session.analysis.fit;
    expect(fit.inverse.exact).toBe(false);
    expect(fit.inverse.maxInverseErrorV).toBeGreaterThan(0);
    for (const row of fit.readingUncertainty) {
      expect(row.inverseV).toBeCloseTo(fit.inverse.maxInverseErrorV / Math.sqrt(3), 14); // rectangular bound d: u = d/√3 (JCGM 100 4.3.7)
      expect(row.combinedV).toBeCloseTo(Math.sqrt(row.fitV ** 2 + row.referenceV ** 2 + row.inverseV ** 2), 12); // quadrature (JCGM 100 5.1.2)
    }
    const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
    expect(header).toMatch(/Expanded uncertainty \(95 %\) of one reading, before drift: .*inverse polynomial's largest departure \(as a rectangular bound\)/);
    const json = (await tester.get(`/api/calibrations/${id}/export.json`)).body;
    expect(json.readingUncertainty.points[2].inverseV).toBeCloseTo(fit.readingUncertainty[2].inverseV, 14);
  });

  it('decides a coarse reference by guarded acceptance and shows the probability of conformance', async () => {
    const rows = ['v,f', ...[0, 125, 250, 375, 500].map((v, i) => `${v},${512.5 + 80.41 * v + [0.2, -0.1, 0.3, -0.2, 0.1][i]}`)];
    const coarse = { reference: { description: 'a coarse handheld meter', percentOfReading: 1, plusVolts: 1 } };
    const { session } = await sessionWith(rows, { appliedV: 'v', frequencyHz: 'f' }, coarse);
    const c = session.analysis.comparison;
    expect(c.acceptance.rule).toMatch(/^Guarded acceptance \(JCGM 106:2012 §8\)/);
    const { offset } = c.acceptance;
    expect(offset.guardBand).toBeCloseTo(c.board.offsetErrorExpandedV, 14); // w = U (JCGM 106:2012 §8.3.2)
    expect(offset.acceptanceLow).toBeGreaterThan(offset.acceptanceHigh); // 2U exceeds the design's interval: nothing can be accepted (in this test)
    const inside = c.board.offsetErrorV >= c.population.offsetErrorV.low && c.board.offsetErrorV <= c.population.offsetErrorV.high;
    expect(offset.decision).toBe(inside ? 'undecided' : 'reject');
    const u = c.board.offsetErrorExpandedV / 2;
    const pc = jStat.normal.cdf(c.population.offsetErrorV.high, c.board.offsetErrorV, u) - jStat.normal.cdf(c.population.offsetErrorV.low, c.board.offsetErrorV, u);
    expect(offset.conformanceProbability).toBeCloseTo(pc, 12); // p_c with a normal PDF about the measured value (JCGM 106:2012 §7.2)
    expect(c.acceptance.nonConformanceAtMost).toBeCloseTo(Math.min(1, 2 - c.acceptance.gain.conformanceProbability - offset.conformanceProbability), 12); // Bonferroni (common practice)
    // One reference error moves gain and offset: its share is the whole % of reading and the whole volts, each over √3 (JCGM 100 4.3.7).
    expect(c.referenceShare.gainFraction).toBeCloseTo(0.01 / Math.sqrt(3), 12);
    expect(c.referenceShare.offsetV).toBeCloseTo(1 / Math.sqrt(3), 10);
  });

  it('accepts the demo board and rejects a board with a wrong resistor, and the overview says which', async () => {
    const boards = (await tester.get('/api/boards')).body.items;
    const demo = boards.find((b: { serialNumber: string }) => b.serialNumber === 'PM-2-001');
    const overview = (await tester.get(`/api/calibrations/overview?revisionId=${demo.revisionId}&channelKey=pack`)).body;
    expect(overview.rule).toMatch(/Guarded acceptance/);
    expect(overview.boards.find((b: { serialNumber: string }) => b.serialNumber === 'PM-2-001').decision).toBe('accept');
    const rows = ['v,f', ...[100, 200, 300, 400, 500].map((v) => `${v},${500 + 80.35 * 1.11 * v}`)]; // 10 % high gain, as a wrong bottom resistor would give
    const { session } = await sessionWith(rows, { appliedV: 'v', frequencyHz: 'f' });
    expect(session.analysis.comparison.acceptance.decision).toBe('reject');
    expect(session.analysis.comparison.acceptance.gain.conformanceProbability).toBeLessThan(1e-6);
  });
});
