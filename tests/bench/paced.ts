import { Agent, request as httpRequest } from 'node:http';

export interface Paced {
  p50: number;
  p99: number;
  max: number;
  sent: number;
  failed: number;
  /** Why requests failed: HTTP status or socket error code, with counts. */
  reasons: Record<string, number>;
}

/**
 * Open-loop load: request k is due at start + k / rate; its latency runs from that moment to
 * the last byte of the answer, in ms. Sockets are opened as needed, never waited for.
 */
export async function paced(
  url: string,
  rate: number,
  seconds: number,
  headers: Record<string, string>,
  next: () => { method: string; path: string; body?: string },
): Promise<Paced> {
  const agent = new Agent({ keepAlive: true, maxSockets: Infinity });
  const { hostname, port } = new URL(url);
  const total = Math.round(rate * seconds);
  const latency = new Float64Array(total);
  let done = 0;
  let failed = 0;
  const reasons: Record<string, number> = {};
  let sent = 0;
  const start = performance.now() + 20;
  await new Promise<void>((resolve) => {
    const finish = (k: number, due: number, ok: boolean, reason: string) => {
      latency[k] = performance.now() - due;
      if (!ok) {
        failed++;
        reasons[reason] = (reasons[reason] ?? 0) + 1;
      }
      if (++done === total) resolve();
    };
    const fire = () => {
      const now = performance.now();
      while (sent < total && start + (sent * 1000) / rate <= now) {
        const k = sent++;
        const due = start + (k * 1000) / rate;
        const r = next();
        const req = httpRequest(
          {
            agent,
            hostname,
            port,
            method: r.method,
            path: r.path,
            headers: r.body
              ? { ...headers, 'content-length': String(Buffer.byteLength(r.body)) }
              : headers,
          },
          (res) => {
            res.resume();
            const status = res.statusCode ?? 500;
            res.once('end', () => finish(k, due, status < 300, String(status)));
          },
        );
        req.once('error', (err: NodeJS.ErrnoException) =>
          finish(k, due, false, err.code ?? 'error'),
        );
        req.end(r.body);
      }
      if (sent < total) setTimeout(fire, Math.max(0, start + (sent * 1000) / rate - now - 0.5));
    };
    fire();
  });
  agent.destroy();
  const sorted = latency.sort();
  const at = (q: number) =>
    Math.round(sorted[Math.min(total - 1, Math.floor(q * total))]! * 10) / 10;
  return { p50: at(0.5), p99: at(0.99), max: at(1), sent: total, failed, reasons };
}
