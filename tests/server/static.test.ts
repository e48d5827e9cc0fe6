import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../server/app';
import { parseConfig } from '../../server/config';
import { openDatabase } from '../../server/db/data-source';
import { ApiErrorBody } from '../../shared/api/error';
import { tempDir } from './helpers/temp-dir';

describe('production: one process serves the client and the API', () => {
  const tmp = tempDir();
  let ds: DataSource;
  let app: ReturnType<typeof createApp>;
  beforeAll(async () => {
    const dist = join(tmp.dir, 'dist');
    mkdirSync(join(dist, 'assets'), { recursive: true });
    writeFileSync(
      join(dist, 'index.html'),
      '<!doctype html><title>Hoverprint</title><div id="root"></div>',
    );
    writeFileSync(join(dist, 'assets', 'app.js'), 'console.log("app")');
    const config = parseConfig({ NODE_ENV: 'production', DATA_DIR: tmp.dir, LOG_LEVEL: 'silent' });
    ({ dataSource: ds } = await openDatabase(config));
    app = createApp({ dataSource: ds, config, clientDir: dist });
  });
  afterAll(async () => {
    await ds.destroy();
    tmp.cleanup();
  });

  it('serves built assets', async () => {
    const res = await request(app).get('/assets/app.js').expect(200);
    expect(res.text).toContain('console.log');
  });

  it('answers client routes with the app shell', async () => {
    for (const path of ['/', '/fleet', '/flights/0b6f3c1e-1111-4222-8333-944445555666', '/team']) {
      const res = await request(app).get(path).expect(200);
      expect(res.text).toContain('<div id="root">');
    }
  });

  it('keeps unknown API routes as JSON 404s, not the shell', async () => {
    const res = await request(app).get('/api/nothing-here').expect(404);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('not_found');
  });

  it('shows the dev inbox of the fake mail only to this machine', async () => {
    // supertest connects over loopback, so this is the local case.
    const res = await request(app).get('/api/dev/mail').expect(200);
    expect(res.body).toEqual({ messages: [] });
  });

  it('answers the health check', async () => {
    await request(app).get('/api/health').expect(200, { ok: true, db: 'ok' });
  });
});
