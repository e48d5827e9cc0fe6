import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream, mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { createGunzip } from 'node:zlib';
import type { Request } from 'express';
import multer, { type StorageEngine } from 'multer';

export interface StagedFile {
  path: string;
  size: number;
  sha256: string;
  gzip: boolean;
  originalName: string;
}

/**
 * Multer storage that streams the part to a staging file while hashing it, so a 200 MB log is
 * never held in memory. The first two bytes tell gzip (kept as gzip) from plain text.
 */
class StagingStorage implements StorageEngine {
  constructor(private readonly dir: string) {
    mkdirSync(dir, { recursive: true });
  }

  _handleFile(
    _req: Request,
    file: Express.Multer.File,
    cb: (error?: unknown, info?: Partial<Express.Multer.File>) => void,
  ) {
    const path = join(this.dir, `${randomUUID()}.part`);
    const hash = createHash('sha256');
    let size = 0;
    let head: Buffer | null = null;
    file.stream.on('data', (chunk: Buffer) => {
      hash.update(chunk);
      size += chunk.length;
      head ??= chunk.subarray(0, 2);
    });
    // Over the size limit multer aborts the request; drop what was written.
    file.stream.on('limit', () => void rm(path, { force: true }));
    pipeline(file.stream, createWriteStream(path)).then(
      () => {
        const staged: StagedFile = {
          path,
          size,
          sha256: hash.digest('hex'),
          gzip: head !== null && head[0] === 0x1f && head[1] === 0x8b,
          originalName: file.originalname,
        };
        cb(null, { path, size, staged } as Partial<Express.Multer.File>);
      },
      (err: unknown) => {
        void rm(path, { force: true });
        cb(err);
      },
    );
  }

  _removeFile(_req: Request, file: Express.Multer.File, cb: (error: Error | null) => void) {
    rm(file.path, { force: true }).then(
      () => cb(null),
      (err: Error) => cb(err),
    );
  }
}

/** Accepts exactly one part named `file`, up to `maxBytes`. */
export function rawUpload(stagingDir: string, maxBytes: number) {
  return multer({
    storage: new StagingStorage(stagingDir),
    limits: { fileSize: maxBytes, files: 1, fields: 5, parts: 6 },
  }).single('file');
}

const SAMPLE = 64 * 1024;

/** First bytes of the log as text (inflated when gzip). */
async function sample(file: StagedFile): Promise<Buffer> {
  const chunks: Buffer[] = [];
  let got = 0;
  const source = createReadStream(file.path);
  const stream = file.gzip ? source.pipe(createGunzip()) : source;
  try {
    for await (const chunk of stream as AsyncIterable<Buffer>) {
      chunks.push(chunk);
      got += chunk.length;
      if (got >= SAMPLE) break;
    }
  } catch {
    if (got === 0) return Buffer.alloc(0);
  } finally {
    source.destroy();
  }
  return Buffer.concat(chunks).subarray(0, SAMPLE);
}

/**
 * Why the staged file is not a CSV log, or null when it looks like one: text without NUL bytes,
 * valid UTF-8, and a first non-comment line split by comma, semicolon or tab into 2+ fields.
 */
export async function notCsvReason(file: StagedFile): Promise<string | null> {
  if (file.size === 0) return 'The file is empty.';
  const head = await sample(file);
  if (head.length === 0)
    return file.gzip ? 'The file is gzip but does not inflate.' : 'The file is empty.';
  if (head.includes(0)) return 'The file is binary, not a CSV text log.';
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(head, { stream: true });
  } catch {
    return 'The file is not UTF-8 text.';
  }
  const lines = text.split(/\r?\n/);
  const header = lines.find((l) => l.trim() !== '' && !l.startsWith('#'));
  if (header === undefined) return 'The file has no header line.';
  const fields = Math.max(
    header.split(',').length,
    header.split(';').length,
    header.split('\t').length,
  );
  if (fields < 2) return 'The header line has no comma, semicolon or tab between columns.';
  return null;
}
