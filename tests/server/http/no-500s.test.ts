import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { User } from '../../../server/auth/user.entity';
import { crew } from '../helpers/crew';
import { PASSWORD, startTestApp, uniqueEmail, type TestApp } from '../helpers/test-app';

/** Races and odd bodies get a 4xx in the error shape, never a 500. */
describe('no 500s from races or odd bodies', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('five sign-ups with one address at once: one 201, the others 409', async () => {
    const email = uniqueEmail('race');
    const results = await Promise.all(
      Array.from({ length: 5 }, (_, i) =>
        request(t.app)
          .post('/api/auth/sign-up')
          .send({ email, password: PASSWORD, name: `Racer ${i}` }),
      ),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([201, 409, 409, 409, 409]);
    for (const r of results.filter((x) => x.status === 409))
      expect(r.body.error.code).toBe('email_taken');
    expect(await t.dataSource.getRepository(User).countBy({ email })).toBe(1);
  });

  it('two sign-ups racing for one invite: one joins, the other creates no account', async () => {
    const c = await crew(t, []);
    const invite = await c.owner.agent
      .post(`/api/teams/${c.teamId}/invites`)
      .send({ email: uniqueEmail('invited'), role: 'pilot' })
      .expect(201);
    const token = new URL(invite.body.link as string).pathname.split('/').pop();
    const emails = [uniqueEmail('first'), uniqueEmail('second')];
    const results = await Promise.all(
      emails.map((email) =>
        request(t.app)
          .post('/api/auth/sign-up')
          .send({ email, password: PASSWORD, name: 'Noor', inviteToken: token }),
      ),
    );
    expect(results.map((r) => r.status).sort()).toEqual([201, 400]);
    const loser = emails[results.findIndex((r) => r.status === 400)]!;
    // The refused sign-up left nothing behind: the address is still free.
    expect(await t.dataSource.getRepository(User).countBy({ email: loser })).toBe(0);
  });

  it('answers 400 to a 100 000-deep JSON body', async () => {
    const deep = '['.repeat(100_000) + ']'.repeat(100_000);
    const res = await request(t.app)
      .post('/api/auth/sign-in')
      .set('content-type', 'application/json')
      .send(deep)
      .expect(400);
    expect(res.body.error.code).toBe('bad_request');
    expect(res.body.error.message).toMatch(/nested deeper/);
  });

  it('still reads brackets inside strings as text', async () => {
    await request(t.app)
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail('x'), password: '['.repeat(200) })
      .expect(401);
  });
});
