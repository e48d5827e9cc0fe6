import { join } from 'node:path';
import Database from 'better-sqlite3';
import type { DataSource, EntityMetadata, QueryRunner } from 'typeorm';
import { HeadObjectCommand, type S3Client } from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { DiskRawStore } from '../flights/raw-store';

export interface CopyReport {
  tables: { table: string; source: number; copied: number; target: number }[];
  raw: { source: number; copied: number; missing: string[] } | undefined;
  /** True when every table holds as many rows as the source and every raw log is there. */
  ok: boolean;
}

/** Parents before children, so every foreign key finds its row. */
function tablesInOrder(target: DataSource): EntityMetadata[] {
  const done = new Set<string>();
  const order: EntityMetadata[] = [];
  const visit = (m: EntityMetadata) => {
    if (done.has(m.tableName)) return;
    done.add(m.tableName);
    for (const fk of m.foreignKeys)
      if (fk.referencedEntityMetadata !== m) visit(fk.referencedEntityMetadata);
    order.push(m);
  };
  target.entityMetadatas.forEach(visit);
  return order;
}

/** Rows per INSERT: big enough to be quick, small enough for megabyte report payloads. */
const BATCH_BYTES = 4 * 1024 * 1024;
const MAX_PARAMS = 60_000;

async function insertBatch(
  target: QueryRunner,
  table: string,
  columns: string[],
  rows: unknown[][],
): Promise<number> {
  if (rows.length === 0) return 0;
  const d = target.connection.driver;
  let n = 0;
  const values = rows.map(
    (row) => `(${row.map((_, i) => d.createParameter(`p${n}_${i}`, n++)).join(', ')})`,
  );
  // ON CONFLICT DO NOTHING: a row already copied (a second run) is left as it is.
  const result = await target.query(
    `INSERT INTO ${d.escape(table)} (${columns.map((c) => d.escape(c)).join(', ')}) VALUES ${values.join(', ')} ON CONFLICT DO NOTHING`,
    rows.flat(),
    true,
  );
  return result.affected ?? 0;
}

/**
 * Copies every table of the SQLite file at `sqlitePath` into `target` (a migrated PostgreSQL
 * database), and the raw logs the flights refer to from `rawDir` into the bucket when one is
 * given. Rows and objects already there are kept, so running it again copies nothing twice.
 * Prints one progress line per table; the report carries the count check.
 */
export async function copyStore(options: {
  sqlitePath: string;
  rawDir: string;
  target: DataSource;
  bucket?: { client: S3Client; name: string };
  log: (line: string) => void;
}): Promise<CopyReport> {
  const { target, log } = options;
  const source = new Database(options.sqlitePath, { readonly: true, fileMustExist: true });
  const report: CopyReport = { tables: [], raw: undefined, ok: true };
  const qr = target.createQueryRunner();
  let copiedAny = false;
  try {
    for (const m of tablesInOrder(target)) {
      const table = m.tableName;
      const columns = m.columns.map((c) => c.databaseName);
      // A reply row needs its parent first (threads are one level deep).
      const selfRef = m.foreignKeys.find((fk) => fk.referencedEntityMetadata === m);
      const order = selfRef ? ` ORDER BY "${selfRef.columnNames[0]}" IS NOT NULL` : '';
      const select = source.prepare(
        `SELECT ${columns.map((c) => `"${c}"`).join(', ')} FROM "${table}"${order}`,
      );
      let seen = 0;
      let copied = 0;
      let batch: unknown[][] = [];
      let bytes = 0;
      for (const row of select.raw().iterate() as Iterable<unknown[]>) {
        seen++;
        batch.push(row);
        for (const v of row) bytes += typeof v === 'string' ? v.length : 8;
        if (bytes >= BATCH_BYTES || (batch.length + 1) * columns.length > MAX_PARAMS) {
          copied += await insertBatch(qr, table, columns, batch);
          batch = [];
          bytes = 0;
        }
      }
      copied += await insertBatch(qr, table, columns, batch);
      const [{ n }] = (await target.query(`SELECT COUNT(*) AS n FROM "${table}"`)) as [
        { n: number },
      ];
      const targetCount = Number(n);
      report.tables.push({ table, source: seen, copied, target: targetCount });
      if (targetCount < seen) report.ok = false;
      log(
        `${table}: ${seen} rows, ${copied} copied, ${seen - copied} already there; ${targetCount} in PostgreSQL`,
      );
      copiedAny ||= copied > 0;
    }
    // The planner's statistics still describe the empty tables until autovacuum's next round;
    // until then a team's flight list can be planned as a full scan and sort. PostgreSQL's
    // advice after a bulk load: run ANALYZE (postgresql.org/docs/15/populate.html §14.4.9).
    if (copiedAny) {
      await target.query('ANALYZE');
      log('statistics updated (ANALYZE)');
    }

    if (options.bucket) {
      const { client, name } = options.bucket;
      const disk = new DiskRawStore(options.rawDir);
      const keys = (
        source
          .prepare('SELECT DISTINCT "rawKey" FROM "flights" WHERE "rawKey" IS NOT NULL')
          .pluck()
          .all() as string[]
      ).sort();
      const inBucket = (key: string) =>
        client.send(new HeadObjectCommand({ Bucket: name, Key: key })).then(
          () => true,
          (err: { $metadata?: { httpStatusCode?: number } }) => {
            if (err.$metadata?.httpStatusCode === 404) return false;
            throw err;
          },
        );
      let copied = 0;
      const missing: string[] = [];
      for (const key of keys) {
        if (await inBucket(key)) continue;
        if (!(await disk.exists(key))) {
          missing.push(key);
          continue;
        }
        const { stream } = await disk.open(key);
        await new Upload({ client, params: { Bucket: name, Key: key, Body: stream } }).done();
        copied++;
      }
      // The check: every log a flight refers to is in the bucket now.
      for (const key of keys)
        if (!missing.includes(key) && !(await inBucket(key))) missing.push(key);
      report.raw = { source: keys.length, copied, missing };
      if (missing.length > 0) report.ok = false;
      log(
        `raw logs: ${keys.length} referenced, ${copied} copied to s3://${name}, ${keys.length - copied - missing.length} already there` +
          (missing.length > 0 ? `; ${missing.length} missing: ${missing.join(', ')}` : ''),
      );
    } else {
      log(`raw logs: S3_BUCKET is not set; they stay in ${join(options.rawDir)}`);
    }
  } finally {
    await qr.release();
    source.close();
  }
  return report;
}
