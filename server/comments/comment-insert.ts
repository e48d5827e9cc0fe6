import type { DataSource } from 'typeorm';
import { Flight } from '../flights/flight.entity';
import { cachedQuery, insertSql, runSql } from '../db/sql';
import type { Comment } from './comment.entity';

const columns = [
  'id',
  'flightId',
  'authorId',
  'parentId',
  'tS',
  'channel',
  'body',
  'mentions',
  'createdAt',
] as const;

type NewComment = Pick<Comment, (typeof columns)[number]>;

/**
 * Stores a new comment and adds it to its flight's counters (a root comment also counts as
 * open). A key clash throws the driver's duplicate-key error and changes nothing.
 *
 * PostgreSQL does both in one statement, a data-modifying WITH (postgresql.org/docs/15/
 * queries-with.html §7.8.4): one round trip and one commit instead of two, and the counters
 * can no longer miss a comment. SQLite has no INSERT inside WITH, and a local call costs it
 * little, so there it stays an insert then an update.
 */
export function commentInserter(ds: DataSource): (c: NewComment) => Promise<void> {
  const insert = insertSql(ds, 'comments', [...columns]);
  const values = (c: NewComment) =>
    columns.map((k) => (k === 'mentions' ? JSON.stringify(c.mentions) : c[k]));

  if (ds.options.type === 'postgres') {
    const sql =
      `WITH c AS (${insert} RETURNING "flightId", "parentId") ` +
      `UPDATE "flights" SET "commentCount" = "commentCount" + 1, ` +
      `"openComments" = "openComments" + (CASE WHEN c."parentId" IS NULL THEN 1 ELSE 0 END) ` +
      `FROM c WHERE "flights"."id" = c."flightId"`;
    return async (c) => {
      await runSql(ds, sql, values(c));
    };
  }

  // A root comment also opens a thread; `open` is 1 or 0.
  const bump = cachedQuery<{ fid: string; open: number }, never>(ds, (p) =>
    ds
      .createQueryBuilder()
      .update(Flight)
      .set({
        commentCount: () => '"commentCount" + 1',
        openComments: () => '"openComments" + :open',
      })
      .setParameter('open', p.open)
      .where('id = :fid', { fid: p.fid }),
  );
  return async (c) => {
    await runSql(ds, insert, values(c));
    await bump({ fid: c.flightId, open: c.parentId === null ? 1 : 0 });
  };
}
