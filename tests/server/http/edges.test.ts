import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PASSWORD, signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';

/** Origin, Host, request ids, the sign-in limiter and HSTS, probed as an outsider would. */
describe('origin check and forwarded hosts', () => {
  let t: TestApp;
  let proxied: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    proxied = await startTestApp({ env: { TRUST_PROXY: 'loopback' } });
  });
  afterAll(async () => {
    await t.close();
    await proxied.close();
  });

  it('refuses an origin that only matches a forged Host or X-Forwarded-Host', async () => {
    const { agent } = await signedUpAgent(t.app, 'Shrike');
    for (const header of ['host', 'x-forwarded-host']) {
      const res = await agent
        .post('/api/teams')
        .set('origin', 'http://evil.example')
        .set(header, 'evil.example')
        .send({ name: 'Forged' })
        .expect(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    await agent
      .post('/api/teams')
      .set('origin', 'http://hoverprint.test')
      .send({ name: 'Ours' })
      .expect(201);
  });

  it('behind a trusted proxy, accepts the host the proxy forwarded', async () => {
    const { agent } = await signedUpAgent(proxied.app, 'Shrike');
    await agent
      .post('/api/teams')
      .set('origin', 'https://hp.crew.example')
      .set('x-forwarded-host', 'hp.crew.example')
      .set('x-forwarded-proto', 'https')
      .send({ name: 'Behind the proxy' })
      .expect(201);
  });
});

describe('request ids', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('keeps a short plain id and replaces a long or odd one with a fresh one', async () => {
    const kept = await request(t.app).get('/api/health').set('x-request-id', 'probe-42.a:b');
    expect(kept.headers['x-request-id']).toBe('probe-42.a:b');
    const long = await request(t.app).get('/api/health').set('x-request-id', 'x'.repeat(5000));
    expect(long.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    const odd = await request(t.app).get('/api/health').set('x-request-id', 'a b"}{\\');
    expect(odd.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });
});

describe('sign-in limiter', () => {
  const signIn = (t: TestApp, email: string, password = 'wrong guess') =>
    request(t.app).post('/api/auth/sign-in').send({ email, password });

  it('lets 30 good sign-ins in a row through and counts failures per account', async () => {
    const t = await startTestApp({ env: { AUTH_RATE_LIMIT: '5' } });
    try {
      const user = await signedUpAgent(t.app, 'Jonah');
      for (let i = 0; i < 30; i++) await signIn(t, user.email, PASSWORD).expect(200);
      // Failures against another account do not lock this one out.
      for (let i = 0; i < 5; i++) await signIn(t, 'someone.else@crew.example').expect(401);
      await signIn(t, 'someone.else@crew.example').expect(429);
      await signIn(t, user.email, PASSWORD).expect(200);
    } finally {
      await t.close();
    }
  });

  it('counts failed sign-ins with malformed addresses under the client address alone', async () => {
    const t = await startTestApp({ env: { AUTH_RATE_LIMIT: '5' } });
    try {
      const user = await signedUpAgent(t.app, 'Jonah');
      // Each body names a different non-address (one far over the 254-character bound): none
      // may open a counter of its own, or keep its raw text in the limiter's store.
      const junk = (i: number) => (i === 0 ? `${'x'.repeat(100_000)}@` : `not an address ${i}`);
      for (let i = 0; i < 5; i++) await signIn(t, junk(i)).expect(400);
      const sixth = await signIn(t, junk(5)).expect(429);
      expect(sixth.body.error.code).toBe('rate_limited');
      // A real account from the same address keeps its own counter.
      await signIn(t, user.email, PASSWORD).expect(200);
    } finally {
      await t.close();
    }
  });
});

describe('HSTS', () => {
  it('is sent only when PUBLIC_URL is https', async () => {
    const plain = await startTestApp({ env: { PUBLIC_URL: 'http://192.168.1.20:8080' } });
    const tls = await startTestApp({ env: { PUBLIC_URL: 'https://hp.crew.example' } });
    try {
      const a = await request(plain.app).get('/api/health').expect(200);
      expect(a.headers['strict-transport-security']).toBeUndefined();
      const b = await request(tls.app).get('/api/health').expect(200);
      expect(b.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    } finally {
      await plain.close();
      await tls.close();
    }
  });
});
