import 'reflect-metadata';
import { afterEach, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { openDatabase } from '../../server/bootstrap.js';
import { createTestDatabase, type TestDatabase } from '../helpers/test-app.js';

describe('migrations on PostgreSQL', () => {
  let ds: DataSource | null = null;
  let db: TestDatabase | null = null;
  afterEach(async () => {
    await ds?.destroy();
    await db?.drop();
    ds = null;
    db = null;
  });

  it('migrate a fresh database to exactly the entities', async () => {
    db = await createTestDatabase();
    ds = await openDatabase(db.url);
    expect(ds.options.type).toBe('postgres');
    expect(await ds.showMigrations()).toBe(false); // nothing pending
    const pending = await ds.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]); // the schema equals the entities
  });

  it('are undone and redone cleanly', async () => {
    db = await createTestDatabase();
    ds = await openDatabase(db.url);
    for (let i = 0; i < ds.migrations.length; i++) await ds.undoLastMigration();
    expect(await ds.showMigrations()).toBe(true);
    await ds.runMigrations();
    expect(await ds.showMigrations()).toBe(false);
    const pending = await ds.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });
});
