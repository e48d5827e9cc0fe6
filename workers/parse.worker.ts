import { expose, transfer } from 'comlink';
import type { ProposedColumnMap } from '../shared/log/column-map';
import { LogFormatError, ParseCancelledError } from '../shared/log/errors';
import { gunzip, isGzip, iterateBytes } from '../shared/log/gzip';
import { inspectHeader, type HeaderPreview } from '../shared/log/header';
import { parseLogStream, type ReadOptions } from '../shared/log/parse';
import type { ParsedLog } from '../shared/log/types';

/** An import that did not produce a log, as plain data (comlink drops custom error fields). */
export interface ParseFailure {
  /** LogFormatError code, 'cancelled', or 'internal' for a fault of ours. */
  code: string;
  message: string;
  line?: number;
  column?: number;
  header?: string;
  headers?: string[];
  proposal?: ProposedColumnMap;
}

export type ParseResult = { ok: true; log: ParsedLog } | { ok: false; error: ParseFailure };

/** A parsed log without its columns: what the page needs once the columns went elsewhere. */
export type LogSummary = Omit<ParsedLog, 'columns'>;
export type HandoffResult = { ok: true; summary: LogSummary } | { ok: false; error: ParseFailure };

/** The one message `parseInto` posts on its port: the log, or word that none is coming. */
export type LogDelivery = { ok: true; log: ParsedLog } | { ok: false };
export type InspectResult =
  { ok: true; preview: HeaderPreview } | { ok: false; error: ParseFailure };

/** How much of a file the column-map screen needs. */
const HEAD_BYTES = 64 * 1024;
/** Progress at most ten times a second (STYLE.md, Workers). */
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

type OnProgress = (p: { bytes: number; totalBytes: number; rows: number }) => void;

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

/** Every buffer behind the log's columns (a buffer may back more than one column). */
function columnBuffers(log: ParsedLog): ArrayBuffer[] {
  return [...new Set(Object.values(log.columns).map((c) => c.buffer as ArrayBuffer))];
}

const api = {
  /** Parses a dropped file (CSV or .csv.gz) into typed columns, handed back as transferables. */
  async parseFile(
    jobId: string,
    file: Blob,
    options: ReadOptions,
    onProgress?: OnProgress,
  ): Promise<ParseResult> {
    try {
      const log = await parseJob(jobId, file, options, onProgress);
      return transfer({ ok: true as const, log }, columnBuffers(log));
    } catch (err) {
      return { ok: false, error: failure(err) };
    }
  },

  /**
   * Like parseFile, but the columns go straight to `port` (the analysis worker listens on the
   * other end) and the page gets only the summary: a 100 MB log never lands on the main
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
      const delivery: LogDelivery = { ok: true, log };
      port.postMessage(delivery, columnBuffers(log));
      const { columns: _sent, ...summary } = log;
      return { ok: true, summary };
    } catch (err) {
      const none: LogDelivery = { ok: false };
      port.postMessage(none);
      return { ok: false, error: failure(err) };
    }
  },

  /** Asks a running parseFile to stop; it ends at the next chunk with code 'cancelled'. */
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
