import { transfer, wrap, type Remote } from 'comlink';
import type { LogDelivery } from '../../workers/protocol';
import { postDelivery, receiveDelivery } from '../../workers/protocol';

/**
 * A worker module's API over a real MessageChannel, as comlink carries it from the page. The
 * module's `expose()` listens on the global scope, so the global scope is pointed at one end of
 * the channel before the module loads; one worker per test file.
 */
export async function loadWorker<T>(
  load: () => Promise<unknown>,
): Promise<{ api: Remote<T>; close: () => void }> {
  const { port1, port2 } = new MessageChannel();
  const scope = globalThis as unknown as Record<string, unknown>;
  scope.addEventListener = port1.addEventListener.bind(port1);
  scope.postMessage = port1.postMessage.bind(port1);
  port1.start();
  await load();
  return {
    api: wrap<T>(port2 as unknown as Parameters<typeof wrap>[0]),
    close: () => {
      port1.close();
      port2.close();
    },
  };
}

/**
 * A hand-off port pair: `port` goes to the worker under test (transferred), `delivered` is the
 * one message the worker posts on it, and `send` posts a delivery to it, playing the reader.
 */
export function handoffPorts() {
  const { port1, port2 } = new MessageChannel();
  return {
    port: transfer(port1, [port1]),
    delivered: (): Promise<LogDelivery> => receiveDelivery(port2),
    send: (delivery: LogDelivery) => postDelivery(port2, delivery),
  };
}
