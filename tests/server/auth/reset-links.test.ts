import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sentMail } from '../helpers/crew';
import { PASSWORD, signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';

/** Once a password is set anew, no older reset link may set it again. */
describe('reset links end when the password changes', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  const tokensFor = async (email: string) =>
    (await sentMail(t))
      .filter((m) => m.to.includes(email) && /reset/i.test(m.subject))
      .map((m) => /\/reset\/([A-Za-z0-9_-]+)/.exec(m.text)![1]!);
  const askReset = (email: string) =>
    request(t.app).post('/api/auth/reset/request').send({ email }).expect(202);
  const confirm = (token: string, password: string) =>
    request(t.app).post('/api/auth/reset/confirm').send({ token, password });

  it('using one link spends every other unused link of the user', async () => {
    const user = await signedUpAgent(t.app, 'Jonah');
    await askReset(user.email);
    await askReset(user.email);
    const [newer, older] = await tokensFor(user.email);
    await confirm(newer!, 'new passphrase one').expect(200);
    const res = await confirm(older!, 'attacker passphrase').expect(400);
    expect(res.body.error.code).toBe('invalid_token');
    await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: 'new passphrase one' })
      .expect(200);
  });

  it('changing the password spends every unused link', async () => {
    const user = await signedUpAgent(t.app, 'Ines');
    await askReset(user.email);
    const [token] = await tokensFor(user.email);
    await user.agent
      .post('/api/auth/password')
      .send({ currentPassword: PASSWORD, newPassword: 'changed passphrase' })
      .expect(200);
    await confirm(token!, 'attacker passphrase').expect(400);
  });
});
