import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { parseConfig } from '../../../server/config';
import { openDatabase } from '../../../server/db/data-source';
import { migrations } from '../../../server/db/migrations';
import { postgresMigrations } from '../../../server/db/postgres';
import { engine, freshStores, type Stores } from '../helpers/engine';
import { explainPostgres } from '../helpers/explain';

describe('PostgreSQL migrations', () => {
  it('mirror the SQLite ones one for one, by name and order', () => {
    // A new SQLite migration needs its PostgreSQL twin in server/db/postgres (same name).
    expect(postgresMigrations.map((m) => new m().name)).toEqual(
      migrations.map((m) => new m().name),
    );
  });
});

describe.runIf(engine === 'postgres')('PostgreSQL schema', () => {
  let stores: Stores;
  let ds: DataSource;
  const open = () => openDatabase(parseConfig(stores.env));
  beforeAll(async () => {
    stores = await freshStores();
  });
  afterAll(async () => {
    if (ds?.isInitialized) await ds.destroy();
    await stores.cleanup();
  });

  it('is migrated by one of two servers starting at once; the other waits and finds it done', async () => {
    const [a, b] = await Promise.all([open(), open()]);
    const applied = [a.applied, b.applied].sort((x, y) => y.length - x.length);
    expect(applied).toEqual([migrations.map((m) => new m().name), []]);
    await b.dataSource.destroy();
    ds = a.dataSource;
  });

  it('has every column each entity declares, times as 64-bit integers and reals as doubles', async () => {
    const rows = (await ds.query(
      `SELECT table_name, column_name, data_type FROM information_schema.columns
       WHERE table_schema = 'public'`,
    )) as { table_name: string; column_name: string; data_type: string }[];
    const stored = new Map(rows.map((r) => [`${r.table_name}.${r.column_name}`, r.data_type]));
    for (const m of ds.entityMetadatas) {
      for (const c of m.columns) {
        const key = `${m.tableName}.${c.databaseName}`;
        expect(stored.has(key), key).toBe(true);
        // Unix-ms times overflow PostgreSQL's 32-bit integer in 1970 + 24 days.
        if (/At$/.test(c.databaseName) && c.type === 'integer')
          expect(stored.get(key), key).toBe('bigint');
        if (c.type === 'real') expect(stored.get(key), key).toBe('double precision');
      }
    }
  });

  it('builds each named index with the columns, order and condition its entity declares', async () => {
    const rows = (await ds.query(
      "SELECT indexname, indexdef FROM pg_indexes WHERE schemaname = 'public'",
    )) as { indexname: string; indexdef: string }[];
    const stored = new Map(rows.map((r) => [r.indexname, r.indexdef]));
    const declared = ds.entityMetadatas.flatMap((m) =>
      m.indices.filter((i) => i.givenName).map((i) => ({ table: m.tableName, index: i })),
    );
    expect(declared.length).toBeGreaterThan(5);
    for (const { table, index } of declared) {
      // PostgreSQL prints bare lower-case names unquoted and wraps a condition in parentheses.
      const q = (n: string) => (/^[a-z_][a-z0-9_]*$/.test(n) ? n : `"${n}"`);
      const columns = index.columns.map((c) => q(c.databaseName)).join(', ');
      const def = stored.get(index.name) ?? '';
      expect(def, index.name).toContain(
        `${index.isUnique ? 'UNIQUE ' : ''}INDEX ${index.name} ON public.${table} USING btree (${columns})`,
      );
      if (index.where) expect(def.replace(/[()]/g, ''), index.name).toContain(index.where);
    }
  });

  it('are not applied twice when the database is opened again', async () => {
    const again = await open();
    expect(again.applied).toEqual([]);
    await again.dataSource.destroy();
  });

  it('index the team flight list so a page needs no sort', async () => {
    const steps = await explainPostgres(
      ds,
      'SELECT id FROM flights WHERE "teamId" = $1 ORDER BY "recordedAt" DESC, id DESC LIMIT 50',
      ['x'],
    );
    expect(steps.map((s) => s.index)).toContain('idx_flights_team_recorded');
    expect(steps.map((s) => s.type)).not.toContain('Sort');
  });

  it('roll back cleanly, newest first', async () => {
    for (let i = 0; i < postgresMigrations.length; i++) await ds.undoLastMigration();
    const tables = (await ds.query(
      "SELECT table_name FROM information_schema.tables WHERE table_schema = 'public'",
    )) as { table_name: string }[];
    expect(tables.map((x) => x.table_name)).toEqual(['migrations']);
  });
});
