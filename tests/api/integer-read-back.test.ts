import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { cHeader, jsonExport, type ExportContext } from '../../server/api/calibration/firmware-export.js';
import { canonicalJson, sha256Hex } from '../../server/api/calibration/canonical-json.js';
import { CalibrationRecord } from '../../server/entities/CalibrationRecord.js';
import { countReadingMv, type CountReadingForm } from '../../shared/fit/count-reading.js';
import type { FixedPointForm } from '../../shared/fit/fixed-point.js';
import type { CaptureDefinition } from '../../shared/schemas/chain.js';
import type { FitView } from '../../shared/schemas/calibration-views.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

/** Warnings a careful firmware build turns on; the sanitizer stops at any signed overflow or bad shift. */
const CC_FLAGS = ['-std=c99', '-Wall', '-Wextra', '-Werror', '-pedantic', '-fsanitize=undefined', '-fno-sanitize-recover=all'];
const SESSION = {
  channelKey: 'pack', performedOn: '2026-11-20', ambientC: 23,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
};
/** Invented converter shapes f/FS against x = V/1000 V: a line and an S. */
const SHAPES: Record<1 | 3, number[]> = { 1: [0.02, 0.98], 3: [0.02, 0.975, 0.015, -0.01] };
/** Invented capture settings of both kinds, from a short gate to a long averaged period. */
const CAPTURES: CaptureDefinition[] = [
  { method: 'period', clockHz: 72e6, prescaler: 1, periodsAveraged: 16, counterBits: 32, clockTolerancePpm: 20 },
  { method: 'period', clockHz: 1e9, prescaler: 3, periodsAveraged: 255, counterBits: 64, clockTolerancePpm: 0 },
  { method: 'gated', gateS: 0.1, counterBits: 32, clockTolerancePpm: 20 },
  { method: 'gated', gateS: 0.001, counterBits: 16, clockTolerancePpm: 0 },
  { method: 'gated', gateS: 3, counterBits: 64, clockTolerancePpm: 0 },
];
const GRID = 1001;
const UINT64_MAX = (1n << 64n) - 1n;

const horner = (c: readonly number[], x: number) => c.reduceRight((sum, ck) => sum * x + ck, 0);

interface Case { prefix: string; fit: FitView; fixed: FixedPointForm; count: CountReadingForm; capture: CaptureDefinition; header: string; counts: bigint[]; inRange: number }

describe('integer read-back from raw counts', () => {
  let t: TestApp;
  let tester: Agent;
  let boardId: number;
  let revisionCapture: CaptureDefinition;

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designId = (await tester.get('/api/designs')).body.items[0].id;
    const revision = (await tester.get(`/api/designs/${designId}`)).body.design.revisions[0];
    revisionCapture = (await tester.get(`/api/revisions/${revision.id}`)).body.revision.channels.find((c: { key: string }) => c.key === 'pack').definition.capture;
    const board = await tester.post('/api/boards').send({ serialNumber: 'IRB-001', revisionId: revision.id, buildDate: '2026-11-18' });
    expect(board.status).toBe(201);
    boardId = board.body.board.id;
  });
  afterAll(async () => { await t.close(); });

  async function completed(degree: 1 | 3, fullScaleHz: number): Promise<number> {
    const created = await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, fit: { degree, intercept: true, weighted: false } });
    expect(created.status).toBe(201);
    const { id } = created.body.session;
    const { pointsVersion } = (await tester.get(`/api/calibrations/${id}`)).body.session;
    const points = Array.from({ length: 21 }, (_, i) => ({ appliedV: 10 + 20 * i, frequencyHz: fullScaleHz * horner(SHAPES[degree], (10 + 20 * i) / 1000) * (1 - (i % 3) * 1e-6) }));
    const saved = await tester.put(`/api/calibrations/${id}/points`).send({ points, ...(pointsVersion === undefined ? {} : { baseVersion: pointsVersion }) });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect((await tester.post(`/api/calibrations/${id}/complete`)).status).toBe(200);
    return id;
  }

  it('reads millivolts from counts in C within the stated rounding error, bit for bit as the server emulates it', async () => {
    const cases: Case[] = [];
    for (const [degree, fullScaleHz] of [[1, 1e4], [3, 1e5], [1, 4e6]] as const) {
      const id = await completed(degree, fullScaleHz);
      const json = (await tester.get(`/api/calibrations/${id}/export.json`)).body;
      const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
      const fit: FitView = (await tester.get(`/api/calibrations/${id}`)).body.session.analysis.fit;
      const fixed: FixedPointForm = json.reading.fixedPoint;
      // a completed session's export carries the count reading frozen in its record, made from the revision's capture
      expect(json.reading.countReading).toMatchObject({ frozen: true, method: revisionCapture.method });
      expect(header).toContain('_millivolts_from_counts(uint64_t counts)');
      expect(header).toMatch(/Largest rounding error against 1000 x sum .* at most \d\.\d+e[-+]\d+ mV/s);
      const add = (capture: CaptureDefinition, text: string, count: CountReadingForm) => {
        const prefix = `c${cases.length}`;
        const renamed = text.replaceAll('TV_PACK', `TV_${prefix.toUpperCase()}`).replaceAll('tv_pack', `tv_${prefix}`).replaceAll('_PACK_H', `_${prefix.toUpperCase()}_H`);
        const { min, max } = count.countsRange;
        const n = Math.min(GRID, max - min + 1);
        const grid = Array.from({ length: n }, (_, i) => BigInt(n === 1 ? min : min + Math.round(((max - min) * i) / (n - 1))));
        cases.push({ prefix, fit, fixed, count, capture, header: renamed, counts: [...grid, 0n, 1n, BigInt(Math.max(0, min - 1)), BigInt(max) + 1n, UINT64_MAX], inRange: grid.length });
      };
      add(revisionCapture, header, json.reading.countReading);
      // the same fit under other capture settings, through the same header generator (a draft export computes its count reading)
      for (const capture of CAPTURES) {
        const ctx: ExportContext = {
          serialNumber: 'IRB-001', designName: 'Pack monitor', revisionLetter: 'A', channelKey: 'pack', channelName: 'Pack side',
          sessionId: id, performedOn: '2026-11-20', ambientC: 23, state: 'draft', testerName: 'Bench tester', capture,
        };
        const text = cHeader(ctx, fit);
        const count = jsonExport(ctx, fit).reading.countReading as unknown as CountReadingForm & { frozen: boolean };
        expect(count.frozen).toBe(false);
        add(capture, text, count);
      }
    }
    const dir = fs.mkdtempSync(path.join(t.dir, 'counts-'));
    cases.forEach((c) => fs.writeFileSync(path.join(dir, `${c.prefix}.h`), c.header));
    const lit = (x: number) => `${x.toPrecision(17)}`;
    // the exact formula in double precision: f from the counts by the capture's own formula, then sum of c_k f^k
    const formula = (c: Case) => {
      const f = c.capture.method === 'period'
        ? `((double)${c.capture.periodsAveraged} * ${lit(c.capture.clockHz)}) / ((double)${c.capture.prescaler} * (double)n)`
        : `(double)n / ${lit(c.capture.gateS)}`;
      const coeff = c.fit.inverse.coefficients;
      return `{ const double f = ${f}; double v = 0.0; ${coeff.map((_, k) => coeff.length - 1 - k).map((k) => `v = v * f + ${lit(coeff[k])};`).join(' ')} return v * 1000.0; }`;
    };
    const program = [
      '#include <inttypes.h>', '#include <stdio.h>', ...cases.map((c) => `#include "${c.prefix}.h"`),
      ...cases.map((c) => `static const uint64_t ${c.prefix}_counts[] = { ${c.counts.map((n) => `UINT64_C(${n})`).join(', ')} };\nstatic double ${c.prefix}_exact_mv(uint64_t n) ${formula(c)}`),
      'int main(void) {', '  size_t i;',
      ...cases.map((c) => [
        `  for (i = 0; i < sizeof ${c.prefix}_counts / sizeof ${c.prefix}_counts[0]; i++)`,
        `    printf("%" PRId32 " %.17g\\n", tv_${c.prefix}_millivolts_from_counts(${c.prefix}_counts[i]), i < ${c.inRange}u ? ${c.prefix}_exact_mv(${c.prefix}_counts[i]) : 0.0);`,
      ].join('\n')),
      '  return 0;', '}',
    ].join('\n');
    fs.writeFileSync(path.join(dir, 'main.c'), program);
    execFileSync('cc', [...CC_FLAGS, '-o', path.join(dir, 'main'), path.join(dir, 'main.c')]);
    const lines = execFileSync(path.join(dir, 'main'), { encoding: 'utf8', maxBuffer: 1 << 24 }).trim().split('\n');
    expect(lines).toHaveLength(cases.reduce((n, c) => n + c.counts.length, 0));
    let line = 0;
    for (const c of cases) {
      for (const [i, counts] of c.counts.entries()) {
        const [mvText, exactText] = lines[line++].split(' ');
        // C and the server's BigInt emulation agree to the last bit, out-of-range and zero counts included (C99 6.5.5, 6.5.7 in BigInt)
        expect(Number(mvText), `${c.prefix} ${counts}`).toBe(countReadingMv(c.count, c.fixed, counts));
        if (i >= c.inRange) continue;
        const error = Math.abs(Number(mvText) - Number(exactText));
        // within the stated bound; 1e-9 mV covers the double-precision formula here (about 1e-13 relative, in this test)
        expect(error, `${c.prefix} ${counts}`).toBeLessThanOrEqual(c.count.maxErrorMv + 1e-9);
      }
      expect(c.count.largestFoundMv).toBeLessThanOrEqual(c.count.maxErrorMv);
      // the stated bound is honest and small: half a millivolt is the final rounding, the integer path adds under 0.1 mV (in this test)
      expect(c.count.maxErrorMv).toBeGreaterThanOrEqual(0.5);
      expect(c.count.maxErrorMv).toBeLessThan(0.6);
    }
  });

  it('gives a record frozen before count readings existed its constants from the revision, and says so', async () => {
    const id = await completed(1, 1e5);
    const repo = t.dataSource.getRepository(CalibrationRecord);
    const row = await repo.findOneByOrFail({ sessionId: id, sequence: 1 });
    const frozen = (await tester.get(`/api/calibrations/${id}/export.json`)).body.reading.countReading;
    // the record as an older server wrote it: no count reading, its hash made over that text
    const payload = JSON.parse(row.payload);
    delete payload.reading.countReading;
    delete payload.reading.countNotExportable;
    const text = canonicalJson(payload);
    await repo.update({ id: row.id }, { payload: text, sha256: sha256Hex(text) });
    const json = (await tester.get(`/api/calibrations/${id}/export.json`)).body;
    const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
    expect(json.reading.countReading.frozen).toBe(false);
    // the same capture and fit give the same constants and bound as the frozen ones (deterministic, in this test)
    expect({ ...json.reading.countReading, frozen: true }).toEqual(frozen);
    expect(header).toContain('computed at export from the revision\'s capture settings: this record predates them');
    expect(header).toContain('_millivolts_from_counts(uint64_t counts)');
  });
});
