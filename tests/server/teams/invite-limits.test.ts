import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { limits } from '../../../server/limits';
import { crew, sentMail } from '../helpers/crew';
import { sql } from '../helpers/sql';
import { startTestApp, type TestApp } from '../helpers/test-app';

/** An account must not be usable to mail strangers in bulk through invitations. */
describe('invitation limits', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('refuses a burst of 40 invites with 429 well before the end', async () => {
    const c = await crew(t, []);
    const statuses: number[] = [];
    for (let i = 0; i < 40; i++) {
      const res = await c.owner.agent
        .post(`/api/teams/${c.teamId}/invites`)
        .send({ email: `stranger${i}@burst.example`, role: 'viewer' });
      statuses.push(res.status);
    }
    const first429 = statuses.indexOf(429);
    expect(first429).toBeGreaterThan(0);
    expect(first429).toBeLessThanOrEqual(limits.invitesPerInviterPerHour);
    expect(statuses.slice(first429).every((s) => s === 429)).toBe(true);
    const mailed = (await sentMail(t)).filter((m) => m.to[0]!.endsWith('@burst.example'));
    expect(mailed).toHaveLength(first429);
  });

  it('answers a repeat invite to an address with an open one without mailing it again', async () => {
    const c = await crew(t, []);
    const email = 'noor@repeat.example';
    const first = await c.owner.agent
      .post(`/api/teams/${c.teamId}/invites`)
      .send({ email, role: 'pilot' })
      .expect(201);
    const again = await c.owner.agent
      .post(`/api/teams/${c.teamId}/invites`)
      .send({ email, role: 'pilot' })
      .expect(200);
    expect(again.body.id).toBe(first.body.id);
    expect(again.body.link).toBeUndefined();
    expect((await sentMail(t)).filter((m) => m.to.includes(email))).toHaveLength(1);
  });

  it('caps the open invitations of a team', async () => {
    const c = await crew(t, []);
    // Open invitations made earlier (as if over several hours), straight into the table.
    for (let i = 0; i < limits.openInvitesPerTeam; i++) {
      await sql(
        t.dataSource,
        `INSERT INTO invites (id, "teamId", email, role, "tokenHash", "invitedById", "expiresAt", "createdAt")
         VALUES (?, ?, ?, 'viewer', ?, ?, ?, ?)`,
        [
          crypto.randomUUID(),
          c.teamId,
          `old${i}@cap.example`,
          crypto.randomUUID(),
          c.owner.id,
          Date.now() + 86_400_000,
          Date.now(),
        ],
      );
    }
    const res = await c.owner.agent
      .post(`/api/teams/${c.teamId}/invites`)
      .send({ email: 'one-more@cap.example', role: 'viewer' })
      .expect(409);
    expect(res.body.error.code).toBe('too_many_invites');
  });

  it('does not count refused requests against the team', async () => {
    const c = await crew(t, ['viewer']);
    for (let i = 0; i < limits.invitesPerTeamPerHour + 1; i++) {
      await c.viewer.agent
        .post(`/api/teams/${c.teamId}/invites`)
        .send({ email: `x${i}@refused.example`, role: 'viewer' })
        .expect(403);
    }
    await c.owner.agent
      .post(`/api/teams/${c.teamId}/invites`)
      .send({ email: 'welcome@refused.example', role: 'viewer' })
      .expect(201);
  });
});

describe('names at the schema', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('strips control characters, line breaks and bidi overrides from people, teams and aircraft', async () => {
    const c = await crew(t, []);
    const me = await c.owner.agent
      .patch('/api/auth/me')
      .send({ name: 'Mara\r\nBcc: all@example.org\u202Egnp.exe' })
      .expect(200);
    expect(me.body.user.name).toBe('Mara Bcc: all@example.org gnp.exe');
    const team = await c.owner.agent
      .patch(`/api/teams/${c.teamId}`)
      .send({ name: '\u2066Tern\u0007 Field\u0000 Flyers\u2069' })
      .expect(200);
    expect(team.body.name).toBe('Tern Field Flyers');
    const aircraft = await c.owner.agent
      .patch(`/api/aircraft/${c.aircraftId}`)
      .send({ name: 'Kite\u200F\n2' })
      .expect(200);
    expect(aircraft.body.name).toBe('Kite 2');
    await c.owner.agent.patch(`/api/teams/${c.teamId}`).send({ name: '\u202E\u0000' }).expect(400);
  });
});
