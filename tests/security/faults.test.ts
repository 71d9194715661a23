import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { StockPart } from '../../server/entities/StockPart.js';

describe('a busy database', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({ busyTimeoutMs: 150 }); });
  afterAll(async () => { await t.close(); });

  it('answers 503 with a clear message while another process holds the write lock, then works again', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const other = new Database(t.config.databasePath);
    other.pragma('busy_timeout = 0');
    other.exec('BEGIN IMMEDIATE');
    try {
      const res = await designer.post('/api/stock').send({ ohms: 4700, tolerancePct: 1 });
      expect(res.status).toBe(503);
      expect(res.body.error).toBe('the database is busy; nothing was changed, try again in a moment');
      expect(res.headers['retry-after']).toBe('1');
    } finally {
      other.exec('ROLLBACK');
      other.close();
    }
    expect(await t.dataSource.getRepository(StockPart).count()).toBe(0);
    expect((await designer.post('/api/stock').send({ ohms: 4700, tolerancePct: 1 })).status).toBe(201);
    expect(await t.dataSource.query('PRAGMA integrity_check')).toEqual([{ integrity_check: 'ok' }]);
  });

  it('never lets a stack trace or SQL reach a response', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const res = await designer.get('/api/stock?sort=ohms;DROP TABLE users');
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).not.toMatch(/SELECT|SQLITE|at .*\.ts:\d+/);
  });

  it('serves no file outside the built client, whatever the path', async () => {
    for (const path of ['/..%2f..%2fpackage.json', '/%2e%2e/%2e%2e/package.json', '/api/../../package.json']) {
      const res = await t.agent().get(path);
      expect(res.text).not.toContain('"name": "tallyvolt"');
    }
  });
});
