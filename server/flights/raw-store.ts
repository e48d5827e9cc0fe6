import { createReadStream } from 'node:fs';
import { mkdir, readdir, rename, rm, stat } from 'node:fs/promises';
import { join, relative, sep } from 'node:path';
import type { Readable } from 'node:stream';

/**
 * Where raw logs live, keyed by team and content hash so the same file is kept once per team
 * (never shared across teams: whether a key is already stored must say nothing about another
 * team). The disk store is the embedded default; an S3-compatible store implements the same
 * calls.
 */
export interface RawStore {
  /** Folder where uploads are staged before `put` (on the same disk, so `put` can rename). */
  readonly stagingDir: string;
  /** Takes ownership of a staged file; keeps the existing copy when the key is already stored. */
  put(stagedPath: string, key: string): Promise<{ stored: boolean }>;
  open(key: string): Promise<{ stream: Readable; size: number }>;
  remove(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
  /** Every stored key, for the startup sweep of files no flight refers to. */
  keys(): AsyncIterable<string>;
  /** Removes staged uploads a crash left behind. */
  clearStaging(): Promise<void>;
}

/** Storage key of a raw log: its team, its SHA-256 and the format it was sent in. */
export function rawKey(teamId: string, sha256: string, gzip: boolean): string {
  return `${teamId}/${sha256}${gzip ? '.csv.gz' : '.csv'}`;
}

/**
 * A team key, or a key from before keys named the team (a bare file name; still read and
 * released, never written).
 */
const keyPattern = /^(?:([0-9a-f-]{36})\/)?([0-9a-f]{64}\.csv(?:\.gz)?)$/;

export class DiskRawStore implements RawStore {
  readonly stagingDir: string;

  constructor(private readonly root: string) {
    this.stagingDir = join(root, 'staging');
  }

  private pathOf(key: string): string {
    const m = keyPattern.exec(key);
    if (!m) throw new Error(`bad raw key ${key}`);
    const file = m[2]!;
    return m[1]
      ? join(this.root, m[1], file.slice(0, 2), file)
      : join(this.root, file.slice(0, 2), file);
  }

  async put(stagedPath: string, key: string): Promise<{ stored: boolean }> {
    const target = this.pathOf(key);
    if (await this.exists(key)) {
      await rm(stagedPath, { force: true });
      return { stored: false };
    }
    await mkdir(join(target, '..'), { recursive: true });
    await rename(stagedPath, target);
    return { stored: true };
  }

  async *keys(): AsyncIterable<string> {
    const entries = await readdir(this.root, { recursive: true, withFileTypes: true }).catch(
      () => [],
    );
    for (const e of entries) {
      if (!e.isFile()) continue;
      const rel = relative(this.root, join(e.parentPath, e.name)).split(sep);
      if (rel[0] === 'staging') continue;
      // <team>/<ab>/<file> or, from before, <ab>/<file>.
      const key = rel.length === 3 ? `${rel[0]}/${rel[2]}` : rel.length === 2 ? rel[1]! : '';
      if (keyPattern.test(key)) yield key;
    }
  }

  async clearStaging(): Promise<void> {
    await rm(this.stagingDir, { recursive: true, force: true });
    await mkdir(this.stagingDir, { recursive: true });
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
