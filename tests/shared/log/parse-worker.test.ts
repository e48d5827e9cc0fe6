import { proxy, wrap, type Remote } from 'comlink';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { ParseApi } from '../../../workers/parse.worker';
import { enc } from './helpers';

/**
 * The parse worker's API over a real MessageChannel, as comlink would carry it from the page:
 * the worker module's `expose()` listens on the global scope, so the global scope is pointed
 * at one end of the channel before the module loads.
 */
let api: Remote<ParseApi>;
let close: () => void;

beforeAll(async () => {
  const { port1, port2 } = new MessageChannel();
  const scope = globalThis as unknown as Record<string, unknown>;
  scope.addEventListener = port1.addEventListener.bind(port1);
  scope.postMessage = port1.postMessage.bind(port1);
  port1.start();
  await import('../../../workers/parse.worker');
  api = wrap<ParseApi>(port2 as unknown as Parameters<typeof wrap>[0]);
  close = () => {
    port1.close();
    port2.close();
  };
});

afterAll(() => close());

function kiteLog(rows: number): string {
  let s = '# aircraft: Kite\ntime,motor1,motor2,motor3,motor4,gyro_x [rad/s]\n';
  for (let i = 0; i < rows; i++) s += `${(i / 4000).toFixed(5)},0.4,0.41,0.42,0.43,0.01\n`;
  return s;
}

describe('parse worker', () => {
  it('parses a dropped file and hands back typed columns with progress', async () => {
    const text = kiteLog(5000);
    const seen: { bytes: number; totalBytes: number; rows: number }[] = [];
    const result = await api.parseFile(
      'job-1',
      new Blob([text]),
      {},
      proxy((p: { bytes: number; totalBytes: number; rows: number }) => void seen.push(p)),
    );
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.log.rows).toBe(5000);
    expect(result.log.columns.time).toBeInstanceOf(Float64Array);
    expect(result.log.columns.motor4).toBeInstanceOf(Float32Array);
    expect(result.log.columns.gyro_x![0]).toBeCloseTo(0.5729578, 5);
    expect(result.log.metadata).toEqual({ aircraft: 'Kite' });
    // Progress travels on its own channel, so it may land just after the result.
    await vi.waitFor(() =>
      expect(seen.at(-1)).toEqual({ bytes: text.length, totalBytes: text.length, rows: 5000 }),
    );
  });

  it('reads a .csv.gz file', async () => {
    const gz = gzipSync(enc(kiteLog(2000)));
    const result = await api.parseFile('job-gz', new Blob([new Uint8Array(gz)]), {});
    expect(result.ok && result.log.rows).toBe(2000);
  });

  it('returns a readable failure with line, column and header instead of throwing', async () => {
    const result = await api.parseFile(
      'job-2',
      new Blob(['time,motor1\n0,0.5\n1,half\n2,0.5\n']),
      {},
    );
    expect(result).toEqual({
      ok: false,
      error: expect.objectContaining({ code: 'bad-number', line: 3, column: 2, header: 'motor1' }),
    });
  });

  it('returns the headers and a proposal when a column map is needed', async () => {
    const result = await api.parseFile('job-3', new Blob(['Stamp (ms),Motor 1\n0,1500\n']), {});
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error.code).toBe('needs-column-map');
    expect(result.error.headers).toEqual(['Stamp (ms)', 'Motor 1']);
    expect(result.error.proposal?.entries.map((e) => e.channel)).toEqual([null, 'motor1']);
  });

  it('stops a job that is cancelled between chunks', async () => {
    const text = kiteLog(4000);
    const body = text.slice(text.indexOf('\n', text.indexOf('time')) + 1);
    const big = new Blob([text, ...Array.from({ length: 40 }, () => body)]);
    // The cancel message is handled while the worker awaits its next chunk.
    const running = api.parseFile('job-4', big, {});
    await api.cancel('job-4');
    expect(await running).toEqual({
      ok: false,
      error: expect.objectContaining({ code: 'cancelled' }),
    });
    // The id is free again afterwards.
    const again = await api.parseFile('job-4', new Blob([kiteLog(10)]), {});
    expect(again.ok).toBe(true);
  });

  it('inspects only the start of a file for the column-map screen', async () => {
    const result = await api.inspectHeader(new Blob([kiteLog(50_000)]));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.preview.canonical).toBe(true);
    expect(result.preview.headers[0]).toBe('time');
    expect(result.preview.sampleRows).toHaveLength(10);
    const gz = await api.inspectHeader(new Blob([new Uint8Array(gzipSync(enc(kiteLog(50_000))))]));
    expect(gz.ok && gz.preview.headers.length).toBe(6);
  });
});
