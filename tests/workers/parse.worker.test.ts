import { proxy, type Remote } from 'comlink';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { ParseApi, ParseProgress } from '../../workers/protocol';
import { kiteFile } from '../src/helpers/kite-file';
import { handoffPorts, loadWorker } from './harness';

let api: Remote<ParseApi>;
let close: () => void;

beforeAll(async () => {
  ({ api, close } = await loadWorker<ParseApi>(() => import('../../workers/parse.worker')));
});

afterAll(() => close());

const enc = (s: string) => new TextEncoder().encode(s);

function kiteLog(rows: number): string {
  let s = '# aircraft: Kite\ntime,motor1,motor2,motor3,motor4,gyro_x [rad/s]\n';
  for (let i = 0; i < rows; i++) s += `${(i / 4000).toFixed(5)},0.4,0.41,0.42,0.43,0.01\n`;
  return s;
}

/** Reads a file with the columns going to a port of their own, as the import does. */
async function read(jobId: string, file: Blob, onProgress?: (p: ParseProgress) => void) {
  const ports = handoffPorts();
  const delivered = ports.delivered();
  const result = await api.parseInto(
    jobId,
    file,
    {},
    ports.port,
    ...(onProgress ? [proxy(onProgress)] : []),
  );
  return { result, delivered };
}

describe('parse worker', () => {
  it('reads a dropped file into typed columns with progress', async () => {
    const text = kiteLog(5000);
    const seen: ParseProgress[] = [];
    const { result, delivered } = await read('job-1', new Blob([text]), (p) => void seen.push(p));
    expect(result.ok && result.summary.rows).toBe(5000);
    const got = await delivered;
    expect(got.ok).toBe(true);
    if (!got.ok) return;
    expect(got.log.columns.time).toBeInstanceOf(Float64Array);
    expect(got.log.columns.motor4).toBeInstanceOf(Float32Array);
    expect(got.log.columns.gyro_x![0]).toBeCloseTo(0.5729578, 5);
    expect(got.log.metadata).toEqual({ aircraft: 'Kite' });
    // Progress travels on its own channel, so it may land just after the result.
    await vi.waitFor(() =>
      expect(seen.at(-1)).toEqual({ bytes: text.length, totalBytes: text.length, rows: 5000 }),
    );
  });

  it('reads a .csv.gz file', async () => {
    const gz = gzipSync(enc(kiteLog(2000)));
    const { result } = await read('job-gz', new Blob([new Uint8Array(gz)]));
    expect(result.ok && result.summary.rows).toBe(2000);
  });

  it('returns a readable failure with line, column and header instead of throwing', async () => {
    const { result } = await read('job-2', new Blob(['time,motor1\n0,0.5\n1,half\n2,0.5\n']));
    expect(result).toEqual({
      ok: false,
      error: expect.objectContaining({ code: 'bad-number', line: 3, column: 2, header: 'motor1' }),
    });
  });

  it('returns the headers and a proposal when a column map is needed', async () => {
    const { result } = await read('job-3', new Blob(['Stamp (ms),Motor 1\n0,1500\n']));
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
    const running = read('job-4', big);
    await api.cancel('job-4');
    const { result, delivered } = await running;
    expect(result).toEqual({ ok: false, error: expect.objectContaining({ code: 'cancelled' }) });
    expect(await delivered).toEqual({ ok: false });
    // The id is free again afterwards.
    const again = await read('job-4', new Blob([kiteLog(10)]));
    expect(again.result.ok).toBe(true);
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

describe('parse worker hand-off', () => {
  it('posts the typed columns on the port and answers the page with a summary only', async () => {
    const { result, delivered } = await read('job-a', kiteFile(12));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect('columns' in result.summary).toBe(false);
    expect(result.summary.rows).toBeGreaterThanOrEqual(12_000);
    expect(result.summary.metadata['aircraft']).toBe('Kite');
    const got = await delivered;
    expect(got.ok).toBe(true);
    if (!got.ok) return;
    expect(got.log.rows).toBe(result.summary.rows);
    expect(got.log.columns.time).toBeInstanceOf(Float64Array);
    expect(got.log.columns.motor1).toBeInstanceOf(Float32Array);
    expect(got.log.columns.motor1!.length).toBe(result.summary.rows);
  });

  it('posts word that no log is coming when the file cannot be read', async () => {
    const { result, delivered } = await read('job-b', new Blob(['not,a,log\n1,2,3\n']));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error.code).toBe('needs-column-map');
    expect(await delivered).toEqual({ ok: false });
  });
});
