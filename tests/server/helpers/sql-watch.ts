import type { DataSource } from 'typeorm';

interface PgQueryConfig {
  text: string;
  values?: unknown[];
}
type PgQuery = (config: PgQueryConfig | string, values?: unknown[]) => Promise<unknown>;

/**
 * Records the SQL a data source runs, in order, with its parameters: what goes through
 * `dataSource.query` and, on PostgreSQL, the prepared statements `runSql` (server/db/sql.ts)
 * sends straight to the pool. `restore()` stops watching.
 */
export function watchSql(ds: DataSource) {
  const calls: [string, unknown[]][] = [];
  const query = ds.query.bind(ds);
  ds.query = (async (sql: string, params?: unknown[]) => {
    calls.push([sql, params ?? []]);
    return query(sql, params);
  }) as DataSource['query'];
  const pool =
    ds.options.type === 'postgres'
      ? (ds.driver as unknown as { master: { query: PgQuery } }).master
      : null;
  const poolQuery = pool?.query;
  if (pool && poolQuery) {
    pool.query = (config, values) => {
      if (typeof config === 'object') calls.push([config.text, config.values ?? values ?? []]);
      return poolQuery.call(pool, config, values);
    };
  }
  return {
    calls,
    restore() {
      delete (ds as { query?: unknown }).query;
      if (pool) delete (pool as { query?: unknown }).query;
    },
  };
}
