import { createReadStream } from 'node:fs';
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import type { Readable } from 'node:stream';

/**
 * Where raw logs live, keyed by content hash so the same file is kept once. The disk store is
 * the embedded default; an S3-compatible store implements the same four calls.
 */
export interface RawStore {
  /** Folder where uploads are staged before `put` (on the same disk, so `put` can rename). */
  readonly stagingDir: string;
  /** Takes ownership of a staged file; keeps the existing copy when the key is already stored. */
  put(stagedPath: string, key: string): Promise<{ stored: boolean }>;
  open(key: string): Promise<{ stream: Readable; size: number }>;
  remove(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
}

/** Storage key of a raw log: its SHA-256 plus the format it was sent in. */
export function rawKey(sha256: string, gzip: boolean): string {
  return `${sha256}${gzip ? '.csv.gz' : '.csv'}`;
}

export class DiskRawStore implements RawStore {
  readonly stagingDir: string;

  constructor(private readonly root: string) {
    this.stagingDir = join(root, 'staging');
  }

  private pathOf(key: string): string {
    if (!/^[0-9a-f]{64}\.csv(\.gz)?$/.test(key)) throw new Error(`bad raw key ${key}`);
    return join(this.root, key.slice(0, 2), key);
  }

  async put(stagedPath: string, key: string): Promise<{ stored: boolean }> {
    const target = this.pathOf(key);
    if (await this.exists(key)) {
      await rm(stagedPath, { force: true });
      return { stored: false };
    }
    await mkdir(join(this.root, key.slice(0, 2)), { recursive: true });
    await rename(stagedPath, target);
    return { stored: true };
  }

  async open(key: string) {
    const path = this.pathOf(key);
    const { size } = await stat(path);
    return { stream: createReadStream(path), size };
  }

  async remove(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async exists(key: string): Promise<boolean> {
    return stat(this.pathOf(key)).then(
      () => true,
      () => false,
    );
  }
}
