import { gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { ParseCancelledError } from '../../../shared/log/errors';
import { parseLog, parseLogStream } from '../../../shared/log/parse';
import { enc, formatError, formatErrorAsync } from './helpers';

function log(rows: number): string {
  let s = '# aircraft: Osprey\ntime,motor1,motor2,motor3,motor4,motor5,motor6,vbat [mV]\n';
  for (let i = 0; i < rows; i++)
    s += `${(i / 500).toFixed(3)},0.41,0.42,0.43,0.44,0.45,0.46,${25000 - i}\n`;
  return s;
}

async function* chunks(bytes: Uint8Array, size: number) {
  for (let i = 0; i < bytes.length; i += size) yield bytes.subarray(i, i + size);
}

function readable(bytes: Uint8Array, size: number): ReadableStream<Uint8Array> {
  let i = 0;
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      if (i >= bytes.length) controller.close();
      else {
        controller.enqueue(bytes.slice(i, i + size));
        i += size;
      }
    },
  });
}

describe('parseLogStream', () => {
  const text = log(3000);
  const plain = enc(text);
  const expected = parseLog(plain);

  it('reads a ReadableStream like the in-memory parser', async () => {
    const got = await parseLogStream(readable(plain, 4096));
    expect(got.rows).toBe(3000);
    expect(Array.from(got.columns.vbat!)).toEqual(Array.from(expected.columns.vbat!));
    expect(got.metadata).toEqual({ aircraft: 'Osprey' });
  });

  it('reads gzip (detected by its magic bytes) to the same columns', async () => {
    const gz = new Uint8Array(gzipSync(plain));
    expect([gz[0], gz[1]]).toEqual([0x1f, 0x8b]); // RFC 1952 §2.3.1
    for (const size of [1, 7, 1000, gz.length]) {
      const got = await parseLogStream(chunks(gz, size));
      expect(got.rows).toBe(3000);
      expect(Array.from(got.columns.time!)).toEqual(Array.from(expected.columns.time!));
      expect(Array.from(got.columns.motor6!)).toEqual(Array.from(expected.columns.motor6!));
    }
  });

  it('names a damaged gzip file as such', async () => {
    const gz = new Uint8Array(gzipSync(plain));
    const broken = gz.slice(0, gz.length >> 1);
    broken[40] = broken[40]! ^ 0xff;
    const err = await formatErrorAsync(() => parseLogStream(readable(broken, 512)));
    expect(['bad-gzip', 'bad-number', 'ragged-row']).toContain(err.code);
    const cut = await formatErrorAsync(() =>
      parseLogStream(chunks(gz.slice(0, gz.length - 20), 512)),
    );
    expect(cut.code).toBe('bad-gzip');
    expect(cut.message).toMatch(/line \d+/);
  });

  it('points in-memory gzip input to the stream reader', () => {
    expect(formatError(() => parseLog(new Uint8Array(gzipSync(plain)))).code).toBe(
      'gzip-needs-stream',
    );
  });

  it('reports progress in input bytes and rows', async () => {
    const seen: { bytes: number; rows: number }[] = [];
    await parseLogStream(chunks(plain, 8192), { onProgress: (p) => seen.push(p) });
    expect(seen.length).toBeGreaterThan(3);
    expect(seen.at(-1)!.bytes).toBe(plain.length);
    for (let i = 1; i < seen.length; i++) {
      expect(seen[i]!.bytes).toBeGreaterThan(seen[i - 1]!.bytes);
      expect(seen[i]!.rows).toBeGreaterThanOrEqual(seen[i - 1]!.rows);
    }
  });

  it('stops between chunks when the signal is aborted', async () => {
    const controller = new AbortController();
    let calls = 0;
    const run = parseLogStream(chunks(plain, 1024), {
      signal: controller.signal,
      onProgress: () => {
        if (++calls === 3) controller.abort();
      },
    });
    await expect(run).rejects.toBeInstanceOf(ParseCancelledError);
    expect(calls).toBe(3);
  });

  it('rejects an empty stream as an empty file', async () => {
    const err = await formatErrorAsync(() => parseLogStream(chunks(new Uint8Array(0), 10)));
    expect(err.code).toBe('empty-file');
  });
});

describe('a source that reuses one read buffer', () => {
  async function* reusing(bytes: Uint8Array, size: number) {
    const buf = new Uint8Array(size);
    for (let i = 0; i < bytes.length; i += size) {
      const n = Math.min(size, bytes.length - i);
      buf.set(bytes.subarray(i, i + n));
      yield buf.subarray(0, n);
      buf.fill(0x2c); // scribble: nothing read earlier may depend on these bytes
    }
  }
  const text = log(700);
  const expected = parseLog(enc(text));

  it.each([1, 3, 64, 1000])(
    'reads the same columns from %i-byte chunks, plain and gzip',
    async (size) => {
      const plain = await parseLogStream(reusing(enc(text), size));
      expect(Array.from(plain.columns.vbat!)).toEqual(Array.from(expected.columns.vbat!));
      expect(plain.metadata).toEqual(expected.metadata);
      const gz = await parseLogStream(reusing(new Uint8Array(gzipSync(enc(text))), size));
      expect(Array.from(gz.columns.time!)).toEqual(Array.from(expected.columns.time!));
    },
  );
});
