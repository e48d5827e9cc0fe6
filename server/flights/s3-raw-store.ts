import { createReadStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  S3Client,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import type { S3Config } from '../config';
import type { RawStore } from './raw-store';

/** The SDK client for the configured bucket. */
export function createS3Client(s3: S3Config): S3Client {
  return new S3Client({
    region: s3.region,
    endpoint: s3.endpoint,
    forcePathStyle: s3.forcePathStyle,
    credentials: s3.credentials,
    // Since v3.729 the SDK adds CRC checksums to every upload and asks for them on every
    // download (aws/aws-sdk-js-v3#6806); stores other than AWS often reject or lack them.
    // Only for a custom endpoint: on AWS itself the default protection stays on.
    ...(s3.endpoint !== undefined && {
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    }),
  });
}

/**
 * How old an object must be before a sweep may take it for an orphan. Another process may have
 * just stored it and not yet written the flight row that refers to it; no upload takes an hour
 * between the two, so a sweep run by every process at start is harmless.
 */
export const SWEEP_MIN_AGE_MS = 3_600_000;

const notFound = (err: unknown) =>
  (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404;

/**
 * Raw logs as objects in an S3-compatible bucket, one per content hash. Uploads are staged in
 * the OS temp folder while they are hashed (the key is the hash, known only at the end), then
 * streamed to the bucket in parts; nothing is kept under DATA_DIR, so any server process can
 * serve any log and a process may die without losing one.
 */
export class S3RawStore implements RawStore {
  readonly stagingDir: string;

  constructor(
    private readonly client: S3Client,
    private readonly bucket: string,
    // One folder per process: clearing it at start never touches another live process's uploads.
    stagingDir = join(tmpdir(), 'hoverprint-staging', String(process.pid)),
  ) {
    this.stagingDir = stagingDir;
  }

  /** Keys come from our own hashes; refuse anything that could reach outside the namespace. */
  private check(key: string): string {
    if (!/^[\w.-]+(\/[\w.-]+)*$/.test(key) || key.includes('..'))
      throw new Error(`bad raw key ${key}`);
    return key;
  }

  async put(stagedPath: string, key: string): Promise<{ stored: boolean }> {
    this.check(key);
    try {
      // Same key, same bytes: a second copy (or a race with another process) changes nothing.
      if (await this.exists(key)) return { stored: false };
      await new Upload({
        client: this.client,
        params: {
          Bucket: this.bucket,
          Key: key,
          Body: createReadStream(stagedPath),
          ContentType: key.endsWith('.gz') ? 'application/gzip' : 'text/csv; charset=utf-8',
        },
      }).done();
      return { stored: true };
    } finally {
      await rm(stagedPath, { force: true });
    }
  }

  async open(key: string): Promise<{ stream: Readable; size: number }> {
    const res = await this.client.send(
      new GetObjectCommand({ Bucket: this.bucket, Key: this.check(key) }),
    );
    if (!(res.Body instanceof Readable) || res.ContentLength === undefined)
      throw new Error(`raw log ${key}: the store sent no body`);
    return { stream: res.Body, size: res.ContentLength };
  }

  async remove(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.check(key) }));
  }

  /** Stored keys old enough to sweep (see SWEEP_MIN_AGE_MS), page by page. */
  async *keys(now = Date.now()): AsyncIterable<string> {
    let token: string | undefined;
    do {
      const page = await this.client.send(
        new ListObjectsV2Command({ Bucket: this.bucket, ContinuationToken: token }),
      );
      for (const o of page.Contents ?? []) {
        const age = now - (o.LastModified?.getTime() ?? now);
        if (o.Key && age >= SWEEP_MIN_AGE_MS) yield o.Key;
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }

  /** Drops this process's staged uploads (the bucket itself has no staging area). */
  async clearStaging(): Promise<void> {
    await rm(this.stagingDir, { recursive: true, force: true });
    await mkdir(this.stagingDir, { recursive: true });
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: this.check(key) }));
      return true;
    } catch (err) {
      if (notFound(err)) return false;
      throw err;
    }
  }
}
