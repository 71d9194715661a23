import 'reflect-metadata';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/bootstrap.js';

describe('migrations', () => {
  it('migrate a fresh database to exactly the entities, with integrity_check ok', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-migrate-'));
    const ds = await openDatabase(path.join(dir, 'fresh.sqlite'));
    try {
      expect(await ds.showMigrations()).toBe(false); // nothing pending
      const pending = await ds.driver.createSchemaBuilder().log();
      expect(pending.upQueries.map((q) => q.query)).toEqual([]); // the schema equals the entities
      expect(await ds.query('PRAGMA integrity_check')).toEqual([{ integrity_check: 'ok' }]);
      expect(await ds.query('PRAGMA foreign_keys')).toEqual([{ foreign_keys: 1 }]);
      expect(await ds.query('PRAGMA journal_mode')).toEqual([{ journal_mode: 'wal' }]);
    } finally {
      await ds.destroy();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('are undone and redone cleanly', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-migrate-'));
    const ds = await openDatabase(path.join(dir, 'cycle.sqlite'));
    try {
      for (let i = 0; i < ds.migrations.length; i++) await ds.undoLastMigration();
      expect(await ds.showMigrations()).toBe(true);
      await ds.runMigrations();
      expect(await ds.showMigrations()).toBe(false);
    } finally {
      await ds.destroy();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
