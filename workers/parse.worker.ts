import { expose } from 'comlink';
import { LogFormatError, ParseCancelledError } from '../shared/log/errors';
import { gunzip, isGzip, iterateBytes } from '../shared/log/gzip';
import { inspectHeader } from '../shared/log/header';
import { parseLogStream, type ReadOptions } from '../shared/log/parse';
import type { ParsedLog } from '../shared/log/types';
import {
  postDelivery,
  type HandoffResult,
  type InspectResult,
  type ParseFailure,
  type ParseProgress,
} from './protocol';

/** How much of a file the column-map screen needs. */
const HEAD_BYTES = 64 * 1024;
/** Progress at most ten times a second: enough for a bar, too few to crowd the page. */
const PROGRESS_INTERVAL_MS = 100;
/** How often the parse lets queued messages (a cancel) run, when chunks arrive back to back. */
const BREAK_INTERVAL_MS = 50;

const cancelled = new Set<string>();

function failure(err: unknown): ParseFailure {
  if (err instanceof LogFormatError) {
    const out: ParseFailure = { code: err.code, message: err.message, line: err.line };
    if (err.column !== undefined) out.column = err.column;
    if (err.header !== undefined) out.header = err.header;
    if (err.headers !== undefined) out.headers = err.headers;
    if (err.proposal !== undefined) out.proposal = err.proposal;
    return out;
  }
  if (err instanceof ParseCancelledError) return { code: 'cancelled', message: err.message };
  const message = err instanceof Error ? err.message : String(err);
  return { code: 'internal', message: `The import stopped on an internal error: ${message}` };
}

type OnProgress = (p: ParseProgress) => void;

async function parseJob(
  jobId: string,
  file: Blob,
  options: ReadOptions,
  onProgress?: OnProgress,
): Promise<ParsedLog> {
  const totalBytes = file.size;
  let lastReport = -Infinity;
  try {
    const log = await parseLogStream(withBreaks(file.stream()), {
      ...options,
      expectedBytes: totalBytes,
      signal: {
        get aborted() {
          return cancelled.has(jobId);
        },
      },
      onProgress: onProgress
        ? ({ bytes, rows }) => {
            const now = performance.now();
            if (now - lastReport < PROGRESS_INTERVAL_MS) return;
            lastReport = now;
            onProgress({ bytes, totalBytes, rows });
          }
        : undefined,
    });
    onProgress?.({ bytes: totalBytes, totalBytes, rows: log.rows });
    return log;
  } finally {
    cancelled.delete(jobId);
  }
}

const api = {
  /**
   * Parses a dropped file (CSV or .csv.gz) into typed columns that go straight to `port` (the
   * analysis worker listens on the other end); the page gets only the summary: a 100 MB log never lands on the main
   * thread, where its buffers would cost a long garbage collection. Exactly one LogDelivery
   * is posted on the port, also when the read fails, so the listener never waits forever;
   * the listener closes the port once it has it.
   */
  async parseInto(
    jobId: string,
    file: Blob,
    options: ReadOptions,
    port: MessagePort,
    onProgress?: OnProgress,
  ): Promise<HandoffResult> {
    try {
      const log = await parseJob(jobId, file, options, onProgress);
      postDelivery(port, { ok: true, log });
      const { columns: _sent, ...summary } = log;
      return { ok: true, summary };
    } catch (err) {
      postDelivery(port, { ok: false });
      return { ok: false, error: failure(err) };
    }
  },

  /** Asks a running read to stop; it ends at the next chunk with code 'cancelled'. */
  cancel(jobId: string): void {
    cancelled.add(jobId);
  },

  /** Reads only the start of a file (decompressing a .gz) for the column-map screen. */
  async inspectHeader(file: Blob): Promise<InspectResult> {
    try {
      const head = await readHead(file, HEAD_BYTES);
      return { ok: true, preview: inspectHeader(head) };
    } catch (err) {
      return { ok: false, error: failure(err) };
    }
  },
};

/**
 * A file's chunks, with a pause for the event loop every few tens of ms: a Blob already in
 * memory can hand over chunk after chunk without ever letting a cancel message in.
 */
async function* withBreaks(stream: ReadableStream<Uint8Array>): AsyncGenerator<Uint8Array> {
  let last = -Infinity; // the first break comes after the first chunk: a prompt cancel stops early
  for await (const chunk of iterateBytes(stream)) {
    yield chunk;
    if (performance.now() - last >= BREAK_INTERVAL_MS) {
      await new Promise((resolve) => setTimeout(resolve, 0));
      last = performance.now();
    }
  }
}

async function readHead(file: Blob, limit: number): Promise<Uint8Array> {
  const magic = new Uint8Array(await file.slice(0, 2).arrayBuffer());
  if (!isGzip(magic)) return new Uint8Array(await file.slice(0, limit).arrayBuffer());
  const out = new Uint8Array(limit);
  let n = 0;
  const raw = iterateBytes(file.stream());
  const first = await raw.next();
  if (first.done) return out.subarray(0, 0);
  try {
    for await (const chunk of gunzip(first.value, raw)) {
      const take = Math.min(chunk.length, limit - n);
      out.set(chunk.subarray(0, take), n);
      n += take;
      if (n >= limit) break;
    }
  } catch (err) {
    if (n === 0) {
      throw new LogFormatError(
        'bad-gzip',
        `The compressed (.gz) file cannot be opened: ${err instanceof Error ? err.message : String(err)}.`,
        { line: 1 },
      );
    }
  }
  return out.subarray(0, n);
}

export type ParseApi = typeof api;
expose(api);
