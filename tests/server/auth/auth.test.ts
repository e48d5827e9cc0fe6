import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import { MeResponse } from '../../../shared/schemas/auth';
import { PasswordReset } from '../../../server/auth/password-reset.entity';
import { hashToken } from '../../../server/auth/tokens';
import { User } from '../../../server/auth/user.entity';
import {
  PASSWORD,
  signedUpAgent,
  startTestApp,
  uniqueEmail,
  type TestApp,
} from '../helpers/test-app';

const resetToken = (text: string) => /\/reset\/([A-Za-z0-9_-]+)/.exec(text)?.[1];

/** GET /api/auth/me for nobody signed in: the app asks on every start, so it is not a 401. */
const signedOut = { user: null };

describe('auth', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('signs up, sets an httpOnly SameSite=Lax session cookie and answers me', async () => {
    const email = uniqueEmail('sky');
    const res = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ email, password: PASSWORD, name: 'Sky' })
      .expect(201);
    const cookie = res.headers['set-cookie']?.[0] ?? '';
    expect(cookie).toMatch(/^hp_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // plain HTTP here
    const me = await request(t.app)
      .get('/api/auth/me')
      .set('cookie', cookie.split(';')[0]!)
      .expect(200);
    expect(MeResponse.parse(me.body).user).toMatchObject({
      email,
      name: 'Sky',
      commentMail: true,
      teams: [],
    });
  });

  it('stores an argon2id hash with the OWASP parameters, never the password', async () => {
    const { email } = await signedUpAgent(t.app, 'Rook');
    const user = await t.dataSource.getRepository(User).findOneByOrFail({ email });
    expect(user.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(user.passwordHash).not.toContain(PASSWORD);
  });

  it('marks the cookie Secure when the request came over HTTPS behind a trusted proxy', async () => {
    const s = await startTestApp({ env: { TRUST_PROXY: 'loopback' } });
    try {
      const res = await request(s.app)
        .post('/api/auth/sign-up')
        .set('x-forwarded-proto', 'https')
        .send({ email: uniqueEmail('tls'), password: PASSWORD, name: 'Tls' })
        .expect(201);
      expect(res.headers['set-cookie']?.[0]).toMatch(/; Secure/);
    } finally {
      await s.close();
    }
  });

  it('refuses a second account with the same e-mail (any case) with 409', async () => {
    const { email } = await signedUpAgent(t.app, 'Wren');
    const res = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ email: email.toUpperCase(), password: PASSWORD, name: 'Other' })
      .expect(409);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('email_taken');
  });

  it('answers a wrong password and an unknown e-mail alike', async () => {
    const { email } = await signedUpAgent(t.app, 'Finch');
    const wrong = await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'not the password' });
    const unknown = await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail('nobody'), password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('rejects a short password and a malformed e-mail with 400 and the issues', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ email: 'not-mail', password: 'short', name: '' })
      .expect(400);
    const body = ApiErrorBody.parse(res.body);
    expect(body.error.issues?.map((i) => i.path[0]).sort()).toEqual(['email', 'name', 'password']);
  });

  it('answers me without a session, and after sign-out, with no user (an ordinary answer, not an error)', async () => {
    await request(t.app).get('/api/auth/me').expect(200, signedOut);
    const { agent } = await signedUpAgent(t.app, 'Lark');
    await agent.get('/api/auth/me').expect(200);
    await agent.post('/api/auth/sign-out').expect(200);
    await agent.get('/api/auth/me').expect(200, signedOut);
  });

  it('invalidates the old session server-side on sign-out even if the cookie is replayed', async () => {
    const email = uniqueEmail('kes');
    const res = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ email, password: PASSWORD, name: 'Kes' })
      .expect(201);
    const cookie = res.headers['set-cookie']![0]!.split(';')[0]!;
    await request(t.app).post('/api/auth/sign-out').set('cookie', cookie).expect(200);
    await request(t.app).get('/api/auth/me').set('cookie', cookie).expect(200, signedOut);
  });

  it('ends every session on password change and keeps the device that changed it signed in', async () => {
    const { agent, email } = await signedUpAgent(t.app, 'Tern');
    const other = request.agent(t.app);
    await other.post('/api/auth/sign-in').send({ email, password: PASSWORD }).expect(200);
    await agent
      .post('/api/auth/password')
      .send({ currentPassword: PASSWORD, newPassword: 'a brand new passphrase' })
      .expect(200);
    await other.get('/api/auth/me').expect(200, signedOut);
    await agent.get('/api/auth/me').expect(200);
    await request(t.app).post('/api/auth/sign-in').send({ email, password: PASSWORD }).expect(401);
    await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'a brand new passphrase' })
      .expect(200);
  });

  it('resets a password with the mailed token once, and signs out other sessions', async () => {
    const { agent, email } = await signedUpAgent(t.app, 'Swift');
    t.mailer.inbox!.clear();
    const ack = await request(t.app).post('/api/auth/reset/request').send({ email }).expect(202);
    const unknownAck = await request(t.app)
      .post('/api/auth/reset/request')
      .send({ email: uniqueEmail('ghost') })
      .expect(202);
    expect(ack.body).toEqual(unknownAck.body);
    await t.mailer.idle();
    const mails = t.mailer.inbox!.messages();
    expect(mails).toHaveLength(1);
    expect(mails[0]!.to).toEqual([email]);
    const token = resetToken(mails[0]!.text);
    expect(token).toBeDefined();
    // Only the hash is stored.
    const stored = await t.dataSource.getRepository(PasswordReset).find();
    expect(stored.some((r) => r.tokenHash === token)).toBe(false);

    await request(t.app)
      .post('/api/auth/reset/confirm')
      .send({ token, password: 'reset passphrase 1' })
      .expect(200);
    await agent.get('/api/auth/me').expect(200, signedOut);
    const again = await request(t.app)
      .post('/api/auth/reset/confirm')
      .send({ token, password: 'reset passphrase 2' })
      .expect(400);
    expect(ApiErrorBody.parse(again.body).error.code).toBe('invalid_token');
    await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'reset passphrase 1' })
      .expect(200);
  });

  it('refuses an expired reset token', async () => {
    const { email } = await signedUpAgent(t.app, 'Crake');
    t.mailer.inbox!.clear();
    await request(t.app).post('/api/auth/reset/request').send({ email }).expect(202);
    await t.mailer.idle();
    const token = resetToken(t.mailer.inbox!.messages()[0]!.text)!;
    await t.dataSource
      .getRepository(PasswordReset)
      .update({ tokenHash: hashToken(token) }, { expiresAt: Date.now() - 1 });
    await request(t.app)
      .post('/api/auth/reset/confirm')
      .send({ token, password: 'reset passphrase 3' })
      .expect(400);
    await request(t.app).post('/api/auth/sign-in').send({ email, password: PASSWORD }).expect(200);
  });

  it('updates the comment-mail preference and name', async () => {
    const { agent } = await signedUpAgent(t.app, 'Rail');
    const res = await agent
      .patch('/api/auth/me')
      .send({ commentMail: false, name: 'Rail R.' })
      .expect(200);
    expect(MeResponse.parse(res.body).user).toMatchObject({ commentMail: false, name: 'Rail R.' });
  });

  it('refuses a state-changing request from another site', async () => {
    const { agent } = await signedUpAgent(t.app, 'Shrike');
    const res = await agent
      .post('/api/teams')
      .set('origin', 'http://evil.example')
      .send({ name: 'X' })
      .expect(403);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('forbidden');
    await agent
      .post('/api/teams')
      .set('origin', 'http://hoverprint.test')
      .send({ name: 'Field crew' })
      .expect(201);
  });
});

describe('auth rate limit', () => {
  it('answers 429 in the error shape after the limit of sign-in attempts', async () => {
    const t = await startTestApp({ env: { AUTH_RATE_LIMIT: '3' } });
    try {
      for (let i = 0; i < 3; i++) {
        await request(t.app)
          .post('/api/auth/sign-in')
          .send({ email: 'a@b.example', password: 'x' })
          .expect(401);
      }
      const res = await request(t.app)
        .post('/api/auth/sign-in')
        .send({ email: 'a@b.example', password: 'x' })
        .expect(429);
      expect(ApiErrorBody.parse(res.body).error.code).toBe('rate_limited');
      // Sign-up has its own budget.
      await request(t.app)
        .post('/api/auth/sign-up')
        .send({ email: uniqueEmail('ok'), password: PASSWORD, name: 'Ok' })
        .expect(201);
    } finally {
      await t.close();
    }
  });
});
