import { existsSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseConfig } from '../../../server/config';
import { createS3Client, S3RawStore, SWEEP_MIN_AGE_MS } from '../../../server/flights/s3-raw-store';
import { freshStores, engine, type Stores } from '../helpers/engine';
import { csvLog, sha256 } from '../helpers/fixtures';

/** The bucket store on s3rver; only in the PostgreSQL leg, where the S3 service runs. */
describe.runIf(engine === 'postgres' && Boolean(process.env.S3_BUCKET))('S3 raw store', () => {
  let stores: Stores;
  let store: S3RawStore;
  const csv = csvLog('bucket');
  const key = `${sha256(csv)}.csv`;
  const stage = async () => {
    await mkdir(store.stagingDir, { recursive: true });
    const path = join(store.stagingDir, `${Math.random()}.part`);
    await writeFile(path, csv);
    return path;
  };
  beforeAll(async () => {
    stores = await freshStores();
    const s3 = parseConfig(stores.env).s3!;
    store = new S3RawStore(createS3Client(s3), s3.bucket);
  });
  afterAll(() => stores.cleanup());

  it('stores a staged log once, keeps the first copy, and leaves nothing staged', async () => {
    const first = await stage();
    expect(await store.put(first, key)).toEqual({ stored: true });
    expect(existsSync(first)).toBe(false);
    const second = await stage();
    expect(await store.put(second, key)).toEqual({ stored: false });
    expect(existsSync(second)).toBe(false);
    const { stream, size } = await store.open(key);
    const chunks: Buffer[] = [];
    for await (const c of stream as AsyncIterable<Buffer>) chunks.push(c);
    expect(size).toBe(csv.length);
    expect(Buffer.concat(chunks).toString()).toBe(csv);
  });

  it('offers a key to the orphan sweep only once it is old enough that no upload is mid-way', async () => {
    const listed = async (now: number) => {
      const keys: string[] = [];
      for await (const k of store.keys(now)) keys.push(k);
      return keys;
    };
    expect(await listed(Date.now())).toEqual([]);
    expect(await listed(Date.now() + SWEEP_MIN_AGE_MS + 60_000)).toEqual([key]);
  });

  it('removes a log and refuses a key that could leave its namespace', async () => {
    await store.remove(key);
    expect(await store.exists(key)).toBe(false);
    await expect(store.exists('../etc/passwd')).rejects.toThrow(/bad raw key/);
  });
});
