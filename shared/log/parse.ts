import { LogFormatError, ParseCancelledError } from './errors';
import { gunzip, isGzip, iterateBytes, type ByteStream } from './gzip';
import { LogReader, type ReadOptions } from './reader';
import type { ParsedLog } from './types';

export type { ReadOptions } from './reader';

export interface StreamOptions extends ReadOptions {
  /** Called after every chunk: input bytes read (compressed bytes for .gz) and rows so far. */
  onProgress?: (p: { bytes: number; rows: number }) => void;
  /** Checked between chunks; when aborted the parse stops with ParseCancelledError. */
  signal?: { readonly aborted: boolean };
}

const gzipNeedsStream = () =>
  new LogFormatError(
    'gzip-needs-stream',
    'Line 1: this file is gzip-compressed (.csv.gz); it is read through the streaming import, not this one.',
    { line: 1 },
  );

/** Parses a whole log held in memory (one buffer or a sequence of chunks). Plain CSV only. */
export function parseLog(
  input: Uint8Array | Iterable<Uint8Array>,
  options: ReadOptions = {},
): ParsedLog {
  const reader = new LogReader(options);
  if (input instanceof Uint8Array) {
    if (isGzip(input)) throw gzipNeedsStream();
    reader.push(input);
    return reader.finish();
  }
  let first = true;
  let head: Uint8Array | null = null;
  for (const chunk of input) {
    if (first) {
      // Hold a 1-byte first chunk until the magic number can be seen.
      const joined: Uint8Array = head ? concat(head, chunk) : chunk;
      if (joined.length < 2) {
        head = joined;
        continue;
      }
      if (isGzip(joined)) throw gzipNeedsStream();
      first = false;
      head = null;
      reader.push(joined);
      continue;
    }
    reader.push(chunk);
  }
  if (head) reader.push(head);
  return reader.finish();
}

/**
 * Parses a log from a stream (a File's `stream()`, a Node file stream), plain or gzip
 * (detected by its magic bytes), without holding the whole file. No chunk is kept once the
 * next one is asked for, so a source may read every chunk into the same buffer.
 */
export async function parseLogStream(
  stream: ByteStream | AsyncIterable<Uint8Array>,
  options: StreamOptions = {},
): Promise<ParsedLog> {
  const { onProgress, signal, ...readOptions } = options;
  let inputBytes = 0;
  const raw = iterateBytes(stream);
  const counted = (async function* () {
    for await (const chunk of raw) {
      inputBytes += chunk.length;
      yield chunk;
    }
  })();

  let head: Uint8Array = new Uint8Array(0);
  while (head.length < 2) {
    const next = await counted.next();
    if (next.done) break;
    // Copied: the caller may reuse its read buffer for the next chunk.
    head = head.length === 0 ? next.value.slice() : concat(head, next.value);
  }
  const gz = isGzip(head);
  if (gz) delete readOptions.expectedBytes; // the file size says little about the CSV inside
  const reader = new LogReader(readOptions);
  const source: AsyncIterator<Uint8Array> = gz ? gunzip(head, counted) : counted;
  if (!gz && head.length > 0) {
    reader.push(head);
    onProgress?.({ bytes: inputBytes, rows: reader.rowsRead });
  }
  try {
    for (;;) {
      if (signal?.aborted) throw new ParseCancelledError();
      let next: IteratorResult<Uint8Array>;
      try {
        next = await source.next();
      } catch (err) {
        if (!gz) throw err;
        throw new LogFormatError(
          'bad-gzip',
          `The compressed (.gz) file is damaged or cut short near line ${reader.currentLine}: ${err instanceof Error ? err.message : String(err)}. Try the uncompressed CSV.`,
          { line: reader.currentLine },
        );
      }
      if (next.done) break;
      reader.push(next.value);
      onProgress?.({ bytes: inputBytes, rows: reader.rowsRead });
    }
  } catch (err) {
    await source.return?.();
    throw err;
  }
  if (signal?.aborted) throw new ParseCancelledError();
  return reader.finish();
}

function concat(a: Uint8Array, b: Uint8Array): Uint8Array {
  const out = new Uint8Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}
