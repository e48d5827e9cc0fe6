import { createHash } from 'node:crypto';
import type { DataSource, ObjectLiteral, QueryBuilder } from 'typeorm';

type Params = Record<string, string | number | null>;

/**
 * A query built once by TypeORM for the driver in use (so it stays portable), then run with
 * fresh parameter values. Building and rendering a query builder costs more than running the
 * query on SQLite, so the hottest paths (session, flight access, comment writes) reuse the SQL.
 * On PostgreSQL the text also runs as a named prepared statement (see `runSql`).
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
    return runSql<R>(
      ds,
      cached.sql,
      cached.order.map((k) => params[k]),
    );
  };
}

interface PgPool {
  query(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: unknown[] }>;
}

/** Statement names by SQL text: the same text always gets the same name on every connection. */
const statementNames = new Map<string, string>();

function statementName(sql: string): string {
  let name = statementNames.get(sql);
  if (!name) {
    name = `hp_${createHash('sha256').update(sql).digest('hex').slice(0, 24)}`;
    statementNames.set(sql, name);
  }
  return name;
}

/**
 * Runs SQL that never changes between calls and answers its rows. On PostgreSQL it goes
 * straight to the pool as a named prepared statement: each connection parses it once and may
 * keep one plan for it, instead of parsing and planning on every call (postgresql.org/docs/15/
 * sql-prepare.html, Notes). With the one-statement comment insert (server/comments/
 * comment-insert.ts) this halved PostgreSQL's CPU time per comment write in
 * `npm run bench -- api --engine postgres`. Only for explicit column lists: a prepared
 * `SELECT *` fails once a migration changes the table under a running server. On SQLite it is
 * a plain query.
 */
export async function runSql<R>(ds: DataSource, sql: string, values: unknown[]): Promise<R[]> {
  if (ds.options.type !== 'postgres') return (await ds.query(sql, values)) as R[];
  const pool = (ds.driver as unknown as { master: PgPool }).master;
  const { rows } = await pool.query({ name: statementName(sql), text: sql, values });
  return rows as R[];
}

/** `INSERT INTO table (cols…) VALUES (…)` with the driver's own quoting and placeholders. */
export function insertSql(ds: DataSource, table: string, columns: string[]): string {
  const d = ds.driver;
  const cols = columns.map((c) => d.escape(c)).join(', ');
  const marks = columns.map((c, i) => d.createParameter(c, i)).join(', ');
  return `INSERT INTO ${d.escape(table)} (${cols}) VALUES (${marks})`;
}
