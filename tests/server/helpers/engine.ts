/**
 * Which engines the server tests run on. By default (`npm test`) the embedded ones: a SQLite
 * file and raw logs on disk, counters in memory. With DATABASE_URL, S3_* and REDIS_URL set to
 * running services (`npm run services -- up`; `.ci/run` does this for its PostgreSQL leg), every
 * test app gets a database and a bucket of its own on them, and its rate limits count in Redis.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import {
  CreateBucketCommand,
  DeleteBucketCommand,
  DeleteObjectsCommand,
  ListObjectsV2Command,
} from '@aws-sdk/client-s3';
import pg from 'pg';
import { parseConfig, type Config } from '../../../server/config';
import { createS3Client } from '../../../server/flights/s3-raw-store';

export const engine: 'sqlite' | 'postgres' = process.env.DATABASE_URL ? 'postgres' : 'sqlite';

export interface Stores {
  /** Variables that point a server at these stores (empty on the embedded engines). */
  env: Record<string, string>;
  cleanup(): Promise<void>;
}

const SERVICE_VARS = [
  'S3_ENDPOINT',
  'S3_REGION',
  'S3_FORCE_PATH_STYLE',
  'AWS_ACCESS_KEY_ID',
  'AWS_SECRET_ACCESS_KEY',
  'REDIS_URL',
] as const;

/** The variables of the running services, less the database and bucket names. */
function serviceEnv(): Record<string, string> {
  const env: Record<string, string> = {};
  for (const k of SERVICE_VARS) {
    const v = process.env[k];
    if (v) env[k] = v;
  }
  return env;
}

function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

async function admin<T>(run: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    return await run(client);
  } finally {
    await client.end();
  }
}

/** A fresh, empty database and bucket for one test app or cluster; nothing on SQLite. */
export async function freshStores(): Promise<Stores> {
  // Read now, not at import: the API benchmark starts the services after importing this.
  if (!process.env.DATABASE_URL) return { env: {}, cleanup: async () => undefined };
  const name = `hp_test_${randomBytes(6).toString('hex')}`;
  await admin((c) => c.query(`CREATE DATABASE ${name}`));
  const env: Record<string, string> = {
    ...serviceEnv(),
    DATABASE_URL: withDatabase(process.env.DATABASE_URL!, name),
  };
  const hasS3 = Boolean(process.env.S3_BUCKET);
  if (hasS3) env.S3_BUCKET = name.replaceAll('_', '-');
  const s3 = hasS3 ? parseConfig(env).s3 : undefined;
  const client = s3 ? createS3Client(s3) : undefined;
  if (client) await client.send(new CreateBucketCommand({ Bucket: env.S3_BUCKET }));
  return {
    env,
    async cleanup() {
      await admin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
      if (!client) return;
      const listed = await client.send(new ListObjectsV2Command({ Bucket: env.S3_BUCKET }));
      const keys = (listed.Contents ?? []).map((o) => ({ Key: o.Key! }));
      if (keys.length > 0)
        await client.send(
          new DeleteObjectsCommand({ Bucket: env.S3_BUCKET, Delete: { Objects: keys } }),
        );
      await client.send(new DeleteBucketCommand({ Bucket: env.S3_BUCKET }));
      client.destroy();
    },
  };
}

/** Every raw-log object the app keeps: files under DATA_DIR/raw, or the keys in its bucket. */
export async function storedRaw(config: Config): Promise<string[]> {
  if (config.s3) {
    const client = createS3Client(config.s3);
    try {
      const listed = await client.send(new ListObjectsV2Command({ Bucket: config.s3.bucket }));
      return (listed.Contents ?? []).map((o) => o.Key!).sort();
    } finally {
      client.destroy();
    }
  }
  const root = join(config.dataDir, 'raw');
  if (!existsSync(root)) return [];
  return readdirSync(root, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => join(d.parentPath, d.name))
    .sort();
}
