import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { existsSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../../server/app';
import { parseConfig } from '../../../server/config';
import { openDatabase } from '../../../server/db/data-source';
import { ApiErrorBody } from '../../../shared/api/error';
import { HealthResponse } from '../../../shared/schemas/health';
import { tempDir } from '../helpers/temp-dir';

describe('GET /api/health over real HTTP', () => {
  const tmp = tempDir();
  let server: Server;
  let base: string;
  let dataSource: DataSource;

  beforeAll(async () => {
    const config = parseConfig({ NODE_ENV: 'test', DATA_DIR: tmp.dir, PORT: '0' });
    ({ dataSource } = await openDatabase(config));
    server = createApp({ dataSource, config }).listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await new Promise((r) => server.close(r));
    if (dataSource.isInitialized) await dataSource.destroy();
    tmp.cleanup();
  });

  it('answers ok after querying the SQLite file it created in DATA_DIR', async () => {
    const res = await fetch(`${base}/api/health`);
    expect(res.status).toBe(200);
    expect(HealthResponse.parse(await res.json())).toEqual({ ok: true, db: 'ok', devMail: false });
    expect(existsSync(`${tmp.dir}/hoverprint.sqlite`)).toBe(true);
  });

  it('runs the database in WAL mode with a busy timeout', async () => {
    const [mode] = (await dataSource.query('PRAGMA journal_mode')) as { journal_mode: string }[];
    expect(mode?.journal_mode).toBe('wal');
    const [busy] = (await dataSource.query('PRAGMA busy_timeout')) as { timeout: number }[];
    expect(busy?.timeout).toBeGreaterThanOrEqual(1000);
  });

  it('sends a CSP that allows blob workers and does not force HTTPS', async () => {
    const res = await fetch(`${base}/api/health`);
    const csp = res.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).not.toContain('upgrade-insecure-requests');
  });

  it('answers an unknown API route with 404 in the shared error shape', async () => {
    const res = await fetch(`${base}/api/no-such-thing`);
    expect(res.status).toBe(404);
    const body = ApiErrorBody.parse(await res.json());
    expect(body.error.code).toBe('not_found');
  });

  it('answers malformed JSON with 400 in the shared error shape', async () => {
    const res = await fetch(`${base}/api/health`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"oops"',
    });
    expect(res.status).toBe(400);
    expect(ApiErrorBody.parse(await res.json()).error.message).toMatch(/not valid JSON/);
  });

  it('answers 503 in the error shape when the database is gone', async () => {
    await dataSource.destroy();
    const res = await fetch(`${base}/api/health`);
    expect(res.status).toBe(503);
    expect(ApiErrorBody.parse(await res.json()).error.code).toBe('unavailable');
  });
});
