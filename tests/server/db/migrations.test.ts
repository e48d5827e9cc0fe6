import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { parseConfig } from '../../../server/config';
import { openDatabase } from '../../../server/db/data-source';
import { migrations } from '../../../server/db/migrations';
import { tempDir } from '../helpers/temp-dir';

describe('migrations', () => {
  const tmp = tempDir();
  let ds: DataSource;
  let applied: string[];
  beforeAll(async () => {
    ({ dataSource: ds, applied } = await openDatabase(parseConfig({ DATA_DIR: tmp.dir })));
  });
  afterAll(async () => {
    if (ds.isInitialized) await ds.destroy();
    tmp.cleanup();
  });

  it('create the schema the entities describe, leaving nothing for synchronize to do', async () => {
    expect(applied).toEqual([
      'Initial1764633600000',
      'InviteWithdrawal1764720000000',
      'FlightListIndexes1764806400000',
      'Versions1764892800000',
      'DriftSamples1764979200000',
    ]);
    const pending = await ds.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });

  it('build each named index with the columns, order and condition its entity declares', async () => {
    // The schema builder compares index names and column sets only, not order or WHERE.
    const stored = new Map(
      (
        (await ds.query("SELECT name, sql FROM sqlite_master WHERE type = 'index'")) as {
          name: string;
          sql: string | null;
        }[]
      ).map((i) => [i.name, i.sql ?? '']),
    );
    const declared = ds.entityMetadatas.flatMap((m) =>
      m.indices.filter((i) => i.givenName).map((i) => ({ table: m.tableName, index: i })),
    );
    expect(declared.length).toBeGreaterThan(5);
    for (const { table, index } of declared) {
      const columns = index.columns.map((c) => `"${c.databaseName}"`).join(', ');
      const where = index.where ? ` WHERE ${index.where}` : '';
      expect(stored.get(index.name), index.name).toBe(
        `CREATE ${index.isUnique ? 'UNIQUE ' : ''}INDEX "${index.name}" ON "${table}" (${columns})${where}`,
      );
    }
  });

  it('are not applied twice when the database is opened again', async () => {
    await ds.destroy();
    ({ dataSource: ds, applied } = await openDatabase(parseConfig({ DATA_DIR: tmp.dir })));
    expect(applied).toEqual([]);
  });

  it('index the lists people open most', async () => {
    const idx = (await ds.query("SELECT name FROM sqlite_master WHERE type = 'index'")) as {
      name: string;
    }[];
    expect(idx.map((i) => i.name)).toEqual(
      expect.arrayContaining([
        'idx_flights_team_recorded',
        'idx_flights_aircraft_recorded',
        'idx_comments_flight_t',
        'idx_memberships_user',
      ]),
    );
    const plan = (await ds.query(
      'EXPLAIN QUERY PLAN SELECT id FROM flights WHERE teamId = ? ORDER BY recordedAt DESC, id DESC LIMIT 50',
      ['x'],
    )) as { detail: string }[];
    expect(plan.map((p) => p.detail).join(' ')).toContain('idx_flights_team_recorded');
    expect(plan.map((p) => p.detail).join(' ')).not.toContain('TEMP B-TREE');
  });

  it('roll back cleanly, newest first', async () => {
    for (let i = 0; i < migrations.length; i++) await ds.undoLastMigration();
    const tables = (await ds.query(
      "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'",
    )) as { name: string }[];
    expect(tables.map((x) => x.name)).toEqual(['migrations']);
  });
});
