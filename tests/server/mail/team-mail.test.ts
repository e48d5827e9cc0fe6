import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { limits } from '../../../server/limits';
import { crew, flightBy, sentMail, type Agent } from '../helpers/crew';
import { addMember } from '../helpers/sql';
import { signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';

/** Mail about a team's flights goes to its members as they are when the mail is sent. */
describe('team mail and membership', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  const mailTo = async (email: string) => (await sentMail(t)).filter((m) => m.to.includes(email));

  it('sends a removed pilot nothing about comments or reviews of their old flights', async () => {
    const c = await crew(t, ['pilot', 'coach']);
    const flightId = await flightBy(t, c.pilot.id, c.teamId, c.aircraftId);
    // While a member, a comment on their flight reaches them.
    await c.coach.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 3, body: 'Motor 2 sounds rough' })
      .expect(201);
    expect(await mailTo(c.pilot.email)).toHaveLength(1);

    await c.owner.agent.delete(`/api/teams/${c.teamId}/members/${c.pilot.id}`).expect(204);
    await c.coach.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 9, body: 'Same again at 9 s' })
      .expect(201);
    await c.owner.agent
      .post(`/api/flights/${flightId}/review`)
      .send({ state: 'reviewed', note: 'Fine' })
      .expect(200);
    expect(await mailTo(c.pilot.email)).toHaveLength(1);
  });

  it('sends no reply mail to the author of a thread who has left the team', async () => {
    const c = await crew(t, ['coach']);
    const flightId = await flightBy(t, c.owner.id, c.teamId, c.aircraftId);
    const root = randomUUID();
    await c.coach.agent
      .put(`/api/comments/${root}`)
      .send({ flightId, tS: 5, body: 'Frame resonance?' })
      .expect(201);
    await c.coach.agent.delete(`/api/teams/${c.teamId}/members/${c.coach.id}`).expect(204);
    await c.owner.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 5, parentId: root, body: 'Yes, the arms' })
      .expect(201);
    expect(await mailTo(c.coach.email)).toHaveLength(0);
  });

  it('mails mentions up to the hourly quota of the author, then keeps the comments unmailed', async () => {
    const c = await crew(t, ['coach', 'pilot']);
    const flightId = await flightBy(t, c.pilot.id, c.teamId, c.aircraftId);
    const total = limits.mentionMailsPerPersonPerHour + 5;
    for (let i = 0; i < total; i++) {
      await c.pilot.agent
        .put(`/api/comments/${randomUUID()}`)
        .send({ flightId, tS: i, body: `@Coach look at ${i} s`, mentions: [c.coach.id] })
        .expect(201);
    }
    const mentions = (await mailTo(c.coach.email)).filter((m) => /mentioned/.test(m.subject));
    expect(mentions).toHaveLength(limits.mentionMailsPerPersonPerHour);
    const list = await c.coach.agent.get(`/api/flights/${flightId}/comments`).expect(200);
    expect(list.body.comments).toHaveLength(total);
  });

  it('answers 429 once review requests would mail more people than the hourly quota', async () => {
    const c = await crew(t, ['pilot']);
    const coaches: Agent[] = [];
    for (let i = 0; i < 4; i++) {
      const coach = await signedUpAgent(t.app, `Coach${i}`);
      await addMember(t.dataSource, c.teamId, coach.id, 'coach');
      coaches.push(coach);
    }
    const flightId = await flightBy(t, c.pilot.id, c.teamId, c.aircraftId);
    const ask = () =>
      c.pilot.agent
        .post(`/api/flights/${flightId}/review-request`)
        .send({ userIds: coaches.map((x) => x.id) });
    const rounds = Math.floor(limits.reviewRequestMailsPerPersonPerHour / coaches.length);
    for (let i = 0; i < rounds; i++) await ask().expect(200);
    const res = await ask().expect(429);
    expect(res.body.error.code).toBe('rate_limited');
    const asked = (await sentMail(t)).filter((m) => /asks you to review/.test(m.subject));
    expect(asked).toHaveLength(rounds * coaches.length);
  });
});
