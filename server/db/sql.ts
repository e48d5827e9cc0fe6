import type { DataSource, ObjectLiteral, QueryBuilder } from 'typeorm';

type Params = Record<string, string | number | null>;

/**
 * A query built once by TypeORM for the driver in use (so it stays portable), then run with
 * fresh parameter values. Building and rendering a query builder costs more than running the
 * query on SQLite, so the hottest paths (session, flight access, comment writes) reuse the SQL.
 * Parameters must be scalars; the builder must use every parameter it is given.
 */
export function cachedQuery<P extends Params, R>(
  ds: DataSource,
  build: (params: P) => QueryBuilder<ObjectLiteral>,
): (params: P) => Promise<R[]> {
  let cached: { sql: string; order: (keyof P)[] } | undefined;
  return async (params) => {
    if (!cached) {
      const sentinel = Object.fromEntries(Object.keys(params).map((k) => [k, `\u0000${k}`])) as P;
      const [sql, values] = build(sentinel).getQueryAndParameters();
      const order = values.map((v) => {
        if (typeof v !== 'string' || !v.startsWith('\u0000'))
          throw new Error(`cachedQuery: unexpected parameter ${String(v)}`);
        return v.slice(1) as keyof P;
      });
      cached = { sql, order };
    }
    return (await ds.query(
      cached.sql,
      cached.order.map((k) => params[k]),
    )) as R[];
  };
}

/** `INSERT INTO table (cols…) VALUES (…)` with the driver's own quoting and placeholders. */
export function insertSql(ds: DataSource, table: string, columns: string[]): string {
  const d = ds.driver;
  const cols = columns.map((c) => d.escape(c)).join(', ');
  const marks = columns.map((c, i) => d.createParameter(c, i)).join(', ');
  return `INSERT INTO ${d.escape(table)} (${cols}) VALUES (${marks})`;
}
