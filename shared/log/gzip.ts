/**
 * Gzip input through the platform's DecompressionStream (browsers and Node ≥ 18 have it).
 * shared/ compiles without DOM types, so the few members used are described here
 * structurally instead of declaring globals that would clash with the DOM/WebWorker libs.
 */

export interface ByteStreamReader {
  read(): Promise<{ done: boolean; value?: Uint8Array }>;
  releaseLock(): void;
  cancel(reason?: unknown): Promise<void>;
}

/** The part of a WHATWG ReadableStream<Uint8Array> the engine uses. */
export interface ByteStream {
  getReader(): ByteStreamReader;
}

interface ByteStreamWriter {
  write(chunk: Uint8Array): Promise<void>;
  close(): Promise<void>;
  abort(reason?: unknown): Promise<void>;
}

interface GzipDecoder {
  readable: ByteStream;
  writable: { getWriter(): ByteStreamWriter };
}

type DecoderConstructor = new (format: 'gzip') => GzipDecoder;

/** True when the bytes start with the gzip magic number 1f 8b (RFC 1952 §2.3.1). */
export function isGzip(bytes: Uint8Array): boolean {
  return bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
}

/** Reads a byte stream or async iterable chunk by chunk. */
export async function* iterateBytes(
  source: ByteStream | AsyncIterable<Uint8Array>,
): AsyncGenerator<Uint8Array> {
  if (Symbol.asyncIterator in source) {
    for await (const chunk of source as AsyncIterable<Uint8Array>) yield chunk;
    return;
  }
  const reader = (source as ByteStream).getReader();
  let finished = false;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) {
        finished = true;
        return;
      }
      if (value) yield value;
    }
  } finally {
    if (!finished) await reader.cancel().catch(() => undefined);
    reader.releaseLock();
  }
}

/**
 * Decompresses gzip bytes. `first` is what was already read from `rest`. Errors from a
 * corrupt stream come out of the returned iterator.
 */
export async function* gunzip(
  first: Uint8Array,
  rest: AsyncIterator<Uint8Array>,
): AsyncGenerator<Uint8Array> {
  const Ctor = (globalThis as unknown as { DecompressionStream?: DecoderConstructor })
    .DecompressionStream;
  if (!Ctor) throw new Error('This runtime has no DecompressionStream; cannot read .gz logs here.');
  const decoder = new Ctor('gzip');
  const writer = decoder.writable.getWriter();
  let stop = false;
  const pump = (async () => {
    try {
      await writer.write(first.slice());
      for (;;) {
        if (stop) break;
        const next = await rest.next();
        if (next.done) break;
        await writer.write(next.value.slice()); // the source may reuse its buffer
      }
      if (!stop) await writer.close();
    } catch (err) {
      await writer.abort(err).catch(() => undefined);
    }
  })();
  const reader = decoder.readable.getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      if (value) yield value;
    }
  } finally {
    stop = true;
    await reader.cancel().catch(() => undefined);
    reader.releaseLock();
    await rest.return?.();
    await pump.catch(() => undefined);
  }
}
