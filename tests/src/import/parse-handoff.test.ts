import { transfer, wrap, type Remote } from 'comlink';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LogDelivery, ParseApi } from '../../../workers/parse.worker';
import { kiteFile } from '../helpers/kite-file';

/**
 * The parse worker's handoff over real MessageChannels: the columns go to a port of their own
 * (the analysis worker's, in the app) and the page gets only the summary. The worker module's
 * `expose()` listens on the global scope, so the global is pointed at a channel before it loads.
 */
let parse: Remote<ParseApi>;
let close: () => void;

beforeAll(async () => {
  const { port1, port2 } = new MessageChannel();
  const scope = globalThis as unknown as Record<string, unknown>;
  scope.addEventListener = port1.addEventListener.bind(port1);
  scope.postMessage = port1.postMessage.bind(port1);
  port1.start();
  await import('../../../workers/parse.worker');
  parse = wrap<ParseApi>(port2 as unknown as Parameters<typeof wrap>[0]);
  close = () => {
    port1.close();
    port2.close();
  };
});

afterAll(() => close());

/** The one message the worker posts on the handoff port. */
function delivery(port: MessagePort): Promise<LogDelivery> {
  return new Promise((resolve) => {
    port.onmessage = (e: MessageEvent<LogDelivery>) => {
      port.close();
      resolve(e.data);
    };
  });
}

describe('parse worker handoff (parseInto)', () => {
  it('posts the typed columns on the port and answers the page with a summary only', async () => {
    const { port1, port2 } = new MessageChannel();
    const arrived = delivery(port2);
    const read = await parse.parseInto('job-a', kiteFile(12), {}, transfer(port1, [port1]));
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect('columns' in read.summary).toBe(false);
    expect(read.summary.rows).toBeGreaterThanOrEqual(12_000);
    expect(read.summary.metadata['aircraft']).toBe('Kite');
    const got = await arrived;
    expect(got.ok).toBe(true);
    if (!got.ok) return;
    expect(got.log.rows).toBe(read.summary.rows);
    expect(got.log.columns.time).toBeInstanceOf(Float64Array);
    expect(got.log.columns.motor1).toBeInstanceOf(Float32Array);
    expect(got.log.columns.motor1!.length).toBe(read.summary.rows);
  });

  it('posts word that no log is coming when the file cannot be read', async () => {
    const { port1, port2 } = new MessageChannel();
    const arrived = delivery(port2);
    const read = await parse.parseInto(
      'job-b',
      new Blob(['not,a,log\n1,2,3\n']),
      {},
      transfer(port1, [port1]),
    );
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.error.code).toBe('needs-column-map');
    expect(await arrived).toEqual({ ok: false });
  });
});
