import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { cHeader, type ExportContext } from '../../server/api/calibration/firmware-export.js';
import type { FixedPointForm } from '../../shared/fit/fixed-point.js';
import { fixedPointReading } from '../../shared/fit/fixed-point-reading.js';
import type { FitView } from '../../shared/schemas/calibration-views.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

const SESSION = {
  channelKey: 'pack', performedOn: '2026-11-20', ambientC: 23,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
};
/** Warnings a careful firmware build turns on; the sanitizer stops at any signed overflow or bad shift. */
const CC_FLAGS = ['-std=c99', '-Wall', '-Wextra', '-Werror', '-pedantic', '-fsanitize=undefined', '-fno-sanitize-recover=all'];

/** Invented converter shapes f/FS against x = V/1000 V, monotonic over 0…1000 V: a line, a bow, an S. */
const SHAPES: Record<1 | 2 | 3, number[]> = { 1: [0.02, 0.98], 2: [0.02, 0.97, 0.01], 3: [0.02, 0.975, 0.015, -0.01] };
/** Full scales from a slow converter to the 1 GHz a calibration point may hold. */
const FULL_SCALES_HZ = [1e4, 1e5, 2e6, 4e6, 1e9];
const INPUTS_PER_CASE = 1001;

const horner = (c: readonly number[], x: number) => c.reduceRight((sum, ck) => sum * x + ck, 0);

/** The exact inverse of the forward fit f = Σ b_k V^k: bisection until the interval stops shrinking (in this test). */
function bisectForward(b: readonly number[], f: number, lowV: number, highV: number): number {
  const rising = horner(b, highV) > horner(b, lowV);
  let low = lowV;
  let high = highV;
  for (;;) {
    const mid = 0.5 * (low + high);
    if (mid <= low || mid >= high) return mid;
    if ((horner(b, mid) < f) === rising) low = mid;
    else high = mid;
  }
}

interface Case { prefix: string; fit: FitView; fixed: FixedPointForm; header: string; inputs: number[] }

describe('firmware export', () => {
  let t: TestApp;
  let tester: Agent;
  let boardId: number;
  let designId: number;
  const cases: Case[] = [];

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designs = (await tester.get('/api/designs')).body.items;
    designId = designs[0].id;
    const design = (await tester.get(`/api/designs/${designId}`)).body.design;
    const board = await tester.post('/api/boards').send({ serialNumber: 'FX-001', revisionId: design.revisions[0].id, buildDate: '2026-11-18' });
    expect(board.status).toBe(201);
    boardId = board.body.board.id;
  });
  afterAll(async () => { await t.close(); });

  async function calibrated(degree: 1 | 2 | 3, fullScaleHz: number): Promise<number> {
    const created = await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, fit: { degree, intercept: true, weighted: false } });
    expect(created.status).toBe(201);
    const { id } = created.body.session;
    const { pointsVersion } = (await tester.get(`/api/calibrations/${id}`)).body.session;
    // 21 bench points on the shape, with a 0 to −2 ppm scatter so the fit has residuals and 1 GHz is not passed
    const points = Array.from({ length: 21 }, (_, i) => ({
      appliedV: 50 * i, frequencyHz: fullScaleHz * horner(SHAPES[degree], (50 * i) / 1000) * (1 - (i % 3) * 1e-6),
    }));
    const saved = await tester.put(`/api/calibrations/${id}/points`).send({ points, ...(pointsVersion === undefined ? {} : { baseVersion: pointsVersion }) });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    return id;
  }

  it('reads back within the stated departures in C, for degrees 1 to 3 and full scales up to 1 GHz', async () => {
    for (const degree of [1, 2, 3] as const) {
      for (const fullScaleHz of FULL_SCALES_HZ) {
        const id = await calibrated(degree, fullScaleHz);
        const fit: FitView = (await tester.get(`/api/calibrations/${id}`)).body.session.analysis.fit;
        const json = (await tester.get(`/api/calibrations/${id}/export.json`)).body;
        const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
        const fixed: FixedPointForm = json.reading.fixedPoint;
        expect(json.version).toBe(2);
        const first = Math.ceil(fit.rangeHz.min * 2 ** fixed.frequencyFracBits);
        const last = Math.floor(fit.rangeHz.max * 2 ** fixed.frequencyFracBits);
        const inputs = Array.from({ length: INPUTS_PER_CASE }, (_, i) => first + Math.round(((last - first) * i) / (INPUTS_PER_CASE - 1)));
        // each case under its own prefix and include guard, so that all of them go into one program
        const prefix = `c${cases.length}`;
        const renamed = header.replaceAll('TV_PACK', `TV_${prefix.toUpperCase()}`).replaceAll('tv_pack', `tv_${prefix}`).replaceAll('_PACK_H', `_${prefix.toUpperCase()}_H`);
        cases.push({ prefix, fit, fixed, header: renamed, inputs: [...inputs, 0, Math.max(0, first - 1), last + 1, 2 ** 32 - 1] });
      }
    }
    const dir = fs.mkdtempSync(path.join(t.dir, 'fixed-'));
    cases.forEach((c) => fs.writeFileSync(path.join(dir, `${c.prefix}.h`), c.header));
    const program = [
      '#include <inttypes.h>', '#include <stdio.h>', ...cases.map((c) => `#include "${c.prefix}.h"`),
      ...cases.map((c) => `static const uint32_t ${c.prefix}_inputs[] = { ${c.inputs.map((f) => `${f}u`).join(', ')} };`),
      'int main(void) {', '  size_t i;',
      ...cases.map((c) => [
        `  for (i = 0; i < sizeof ${c.prefix}_inputs / sizeof ${c.prefix}_inputs[0]; i++) {`,
        `    const float f_hz = (float)((double)${c.prefix}_inputs[i] / (double)((uint64_t)1 << TV_${c.prefix.toUpperCase()}_FREQ_FRAC_BITS));`,
        `    printf("%" PRId32 " %.9g\\n", tv_${c.prefix}_volts_fixed(${c.prefix}_inputs[i]), (double)tv_${c.prefix}_volts_float(f_hz));`,
        '  }',
      ].join('\n')),
      '  return 0;', '}',
    ].join('\n');
    fs.writeFileSync(path.join(dir, 'main.c'), program);
    execFileSync('cc', [...CC_FLAGS, '-o', path.join(dir, 'main'), path.join(dir, 'main.c')]);
    const lines = execFileSync(path.join(dir, 'main'), { encoding: 'utf8', maxBuffer: 1 << 24 }).trim().split('\n');
    expect(lines).toHaveLength(cases.reduce((n, c) => n + c.inputs.length, 0));

    let line = 0;
    for (const c of cases) {
      const n = c.fit.inverse.coefficients.length - 1;
      const unitV = 2 ** -c.fixed.voltsFracBits;
      for (const [i, input] of c.inputs.entries()) {
        const [fixedText, floatText] = lines[line++].split(' ');
        const fixed = Number(fixedText);
        // C and the server's emulation of it agree to the last bit, clamped inputs included (C99 6.5.5 semantics in BigInt)
        expect(fixed).toBe(fixedPointReading(c.fixed, input));
        if (i >= INPUTS_PER_CASE) continue;
        const fHz = input * 2 ** -c.fixed.frequencyFracBits;
        const exactV = bisectForward(c.fit.coefficients, fHz, c.fit.rangeV.min, c.fit.rangeV.max); // bisection of the forward fit, in this test
        // within the stated fixed-point departure plus the stated inverse departure (the header's two figures)
        expect(Math.abs(fixed * unitV - exactV)).toBeLessThanOrEqual(c.fixed.maxDepartureV + c.fit.inverse.maxInverseErrorV);
        // against the float form in double precision (rounding ≈ 1e-13 V here, in this test) the fixed form keeps its own bound
        expect(Math.abs(fixed * unitV - horner(c.fit.inverse.coefficients, fHz))).toBeLessThanOrEqual(c.fixed.maxDepartureV);
        // single-precision Horner: |error| ≤ γ_2n·Σ|c_k|f^k (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., eq. 5.3),
        // plus the rounding of the coefficients and of f to binary32 (unit roundoff 2^−24, IEEE 754)
        const f32 = Math.fround(fHz);
        const absSum = c.fit.inverse.coefficients.reduce((sum, ck, k) => sum + Math.abs(ck) * f32 ** k, 0);
        const slope = Math.abs(c.fit.inverse.coefficients.reduce((sum, ck, k) => sum + k * ck * f32 ** (k - 1), 0));
        const floatBound = 2 ** -24 * ((2 * n + 2) * absSum + slope * fHz) * 1.01;
        expect(Math.abs(Number(floatText) - exactV)).toBeLessThanOrEqual(c.fit.inverse.maxInverseErrorV + floatBound);
      }
      // the stated bound is honest and small: ≥ the largest found, and ≤ 10⁻⁷ of a 1000 V reading (common practice: far below a calibration's own resolution)
      expect(c.fixed.largestFoundV).toBeLessThanOrEqual(c.fixed.maxDepartureV);
      expect(c.fixed.maxDepartureV).toBeLessThan(1e-7 * 1000);
      // every coefficient keeps 30 significant bits: 2^29 < |q| ≤ 2^30 (by construction, checked here)
      for (const s of c.fixed.scaled) expect(Math.abs(s.q)).toBeGreaterThan(2 ** 29);
    }
  });

  it('states the fixed-point form and its departure in the header and the JSON alike', async () => {
    const id = await calibrated(3, 4e6);
    const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
    const fixed: FixedPointForm = (await tester.get(`/api/calibrations/${id}/export.json`)).body.reading.fixedPoint;
    expect(header).toContain(`#define TV_PACK_VOLTS_FRAC_BITS ${fixed.voltsFracBits}\n`);
    expect(header).toContain(`#define TV_PACK_MID_FX INT64_C(${fixed.midFx})\n`);
    expect(header).toContain(`static const int32_t tv_pack_u_q[4] = { ${fixed.scaled.map((s) => s.q).join(', ')} };`);
    expect(header).toContain(`static const uint8_t tv_pack_u_shift[4] = { ${fixed.scaled.map((s) => `${s.shift}u`).join(', ')} };`);
    expect(header).toMatch(/largest fixed-point departure from the float form .*\n \* calibrated range: at most \d\.\de-\d+ V/i);
  });

  it('compiles cleanly with hostile names, and keeps them byte for byte in the string constants', async () => {
    const id = await calibrated(2, 2e6);
    const fit: FitView = (await tester.get(`/api/calibrations/${id}`)).body.session.analysis.fit;
    const hostile = [
      '/*', '*/', '/*/', '*//*', '\\', 'end\\', 'a\\\nb', 'line\nbreak\r\n', '??/', 'x ??/\n', '??=??(??)', '???/',
      'Grüße 測試 🔋 é', '\u0000\u0007\u001b\u2028\u2029', '\ud800 lone', '"quoted" \'single\'', '%s %n', 'x'.repeat(5000),
    ];
    const base: ExportContext = {
      serialNumber: 'FX-001', designName: 'Pack monitor', revisionLetter: 'A', channelKey: 'pack', channelName: 'Pack side',
      sessionId: id, performedOn: '2026-11-20', ambientC: 23, state: 'draft', testerName: 'Bench tester',
    };
    const contexts: ExportContext[] = hostile.map((name, i) => ({
      ...base, serialNumber: name, designName: name, revisionLetter: name, channelName: name, performedOn: name, state: name, testerName: name,
      channelKey: `h${i}`,
    }));
    contexts.push({ ...base, channelKey: '/* ??/ é */' }); // even a key that is no C name gives a valid one
    const dir = fs.mkdtempSync(path.join(t.dir, 'hostile-'));
    const headers = contexts.map((ctx, i) => { const file = `h${i}.h`; fs.writeFileSync(path.join(dir, file), cHeader(ctx, fit)); return file; });
    const serials = hostile.map((_, i) => `TV_H${i}_BOARD_SERIAL`);
    fs.writeFileSync(path.join(dir, 'main.c'), [
      '#include <stdio.h>', ...headers.map((h) => `#include "${h}"`), ...headers.map((h) => `#include "${h}"`), // the guards make a second include harmless
      'int main(void) {', '  size_t j;',
      ...serials.map((s) => `  for (j = 0; j < sizeof ${s} - 1; j++) printf("%02x", (unsigned)(unsigned char)${s}[j]);\n  putchar('\\n');`),
      '  printf("%ld\\n", (long)tv_x_volts_fixed(0u));',
      '  return 0;', '}',
    ].join('\n'));
    execFileSync('cc', [...CC_FLAGS, '-o', path.join(dir, 'main'), path.join(dir, 'main.c')]);
    const printed = execFileSync(path.join(dir, 'main'), { encoding: 'utf8' }).split('\n');
    // each string constant holds the name's UTF-8 bytes (up to 250 characters), NULs and all (C99 6.4.4.4 octal escapes)
    hostile.forEach((name, i) => expect(printed[i]).toBe(Buffer.from([...name].slice(0, 250).join(''), 'utf8').toString('hex')));
  });

  it('exports a header that compiles when the design name is hostile', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const renamed = await designer.patch(`/api/designs/${designId}`).send({ name: 'Pack /* monitor */ ??/\nrev\\ Grüße' });
    expect(renamed.status).toBe(200);
    const id = await calibrated(1, 1e5);
    const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
    expect(header).toContain('design "Pack / * monitor * / ? ?/?rev? Gru?e"');
    const dir = fs.mkdtempSync(path.join(t.dir, 'renamed-'));
    fs.writeFileSync(path.join(dir, 'cal.h'), header);
    fs.writeFileSync(path.join(dir, 'main.c'), '#include "cal.h"\nint main(void) { return tv_pack_volts_fixed(0u) == 0 ? 1 : 0; }\n');
    execFileSync('cc', ['-std=c99', '-Wall', '-Wextra', '-Werror', '-o', path.join(dir, 'main'), path.join(dir, 'main.c')]);
  });
});
