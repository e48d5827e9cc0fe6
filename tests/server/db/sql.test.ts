import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DataSource } from 'typeorm';
import { runSql } from '../../../server/db/sql';
import { engine, freshStores, type Stores } from '../helpers/engine';

const query = 'SELECT CAST($1 AS integer) + 1 AS n';

describe.runIf(engine === 'sqlite')('runSql on SQLite', () => {
  it('answers the rows of a plain query', async () => {
    const ds = new DataSource({ type: 'better-sqlite3', database: ':memory:' });
    await ds.initialize();
    try {
      expect(await runSql(ds, 'SELECT CAST(? AS integer) + 1 AS n', [41])).toEqual([{ n: 42 }]);
    } finally {
      await ds.destroy();
    }
  });
});

describe.runIf(engine === 'postgres')('runSql on PostgreSQL', () => {
  let stores: Stores;
  let ds: DataSource;
  beforeAll(async () => {
    stores = await freshStores();
    // One connection, so the statements prepared on it can be listed through the same pool.
    ds = new DataSource({ type: 'postgres', url: stores.env.DATABASE_URL, poolSize: 1 });
    await ds.initialize();
  });
  afterAll(async () => {
    if (ds?.isInitialized) await ds.destroy();
    await stores.cleanup();
  });

  it('prepares a statement once per connection and reuses it with new values', async () => {
    expect(await runSql(ds, query, [41])).toEqual([{ n: 42 }]);
    expect(await runSql(ds, query, [1])).toEqual([{ n: 2 }]);
    // pg_prepared_statements lists this session's prepared statements, protocol-level ones
    // included (postgresql.org/docs/15/view-pg-prepared-statements.html).
    const prepared = (await ds.query('SELECT name, statement FROM pg_prepared_statements')) as {
      name: string;
      statement: string;
    }[];
    expect(prepared).toHaveLength(1);
    expect(prepared[0]!.statement).toBe(query);
    expect(prepared[0]!.name).toMatch(/^hp_[0-9a-f]{24}$/);
  });
});
