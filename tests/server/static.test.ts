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
    writeFileSync(join(dist, 'sw.js'), 'self.addEventListener("fetch", () => {})');
    writeFileSync(join(dist, 'registerSW.js'), 'navigator.serviceWorker.register("/sw.js")');
    writeFileSync(join(dist, 'manifest.webmanifest'), '{"name":"Hoverprint"}');
    writeFileSync(join(dist, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
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

  it('keeps hashed assets cached for good, since a new build gives them new names', async () => {
    const res = await request(app).get('/assets/app.js').expect(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('has the browser revalidate the service worker and its companions on every load', async () => {
    // A cached sw.js would keep users on the old deploy until the cache ran out.
    for (const path of ['/sw.js', '/registerSW.js', '/manifest.webmanifest', '/index.html']) {
      const res = await request(app).get(path).expect(200);
      expect([path, res.headers['cache-control']]).toEqual([path, 'no-cache']);
      expect([path, res.headers.etag]).toEqual([path, expect.any(String)]);
    }
  });

  it('keeps other top-level files cached for an hour', async () => {
    const res = await request(app).get('/favicon.svg').expect(200);
    expect(res.headers['cache-control']).toBe('public, max-age=3600');
  });

  it('answers client routes with the app shell', async () => {
    for (const path of ['/', '/fleet', '/flights/0b6f3c1e-1111-4222-8333-944445555666', '/team']) {
      const res = await request(app).get(path).expect(200);
      expect(res.text).toContain('<div id="root">');
      expect(res.headers['cache-control']).toBe('no-cache');
    }
  });

  it('keeps unknown API routes as JSON 404s, not the shell', async () => {
    const res = await request(app).get('/api/nothing-here').expect(404);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('not_found');
  });

  it('has no dev inbox without MAIL_FAKE=1, even for this machine', async () => {
    // supertest connects over loopback, the case the old inbox trusted.
    const res = await request(app).get('/api/dev/mail').expect(404);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('not_found');
  });

  it('answers the health check', async () => {
    await request(app).get('/api/health').expect(200, { ok: true, db: 'ok', devMail: false });
  });
});
