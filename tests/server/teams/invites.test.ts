import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import { Invite, InviteList, InvitePreview, Team } from '../../../shared/schemas/teams';
import { PASSWORD, signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';
import { sql } from '../helpers/sql';

describe('invitations: withdrawal and state', () => {
  let t: TestApp;
  let owner: Awaited<ReturnType<typeof signedUpAgent>>;
  let teamId: string;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedUpAgent(t.app, 'Mara');
    teamId = Team.parse(
      (await owner.agent.post('/api/teams').send({ name: 'Club and filming crew' }).expect(201))
        .body,
    ).id;
  });
  afterAll(() => t.close());

  async function invite(email: string, role = 'pilot') {
    const created = Invite.parse(
      (await owner.agent.post(`/api/teams/${teamId}/invites`).send({ email, role }).expect(201))
        .body,
    );
    return { ...created, token: created.link!.split('/invite/')[1]! };
  }
  const listed = async (id: string) =>
    InviteList.parse(
      (await owner.agent.get(`/api/teams/${teamId}/invites`).expect(200)).body,
    ).invites.find((i) => i.id === id);

  it('withdraws an open invitation: 204, stored with who and when, listed as withdrawn', async () => {
    const inv = await invite('noor@crew.example');
    expect(inv.state).toBe('open');
    const before = Date.now();
    await owner.agent.delete(`/api/teams/${teamId}/invites/${inv.id}`).expect(204);
    const [row] = (await sql(
      t.dataSource,
      'SELECT "withdrawnAt", "withdrawnById" FROM invites WHERE id = ?',
      [inv.id],
    )) as { withdrawnAt: number; withdrawnById: string }[];
    expect(row!.withdrawnById).toBe(owner.id);
    expect(row!.withdrawnAt).toBeGreaterThanOrEqual(before);
    const shown = await listed(inv.id);
    expect(shown).toMatchObject({
      state: 'withdrawn',
      withdrawnBy: 'Mara',
      acceptedAt: null,
      acceptedBy: null,
    });
    expect(Date.parse(shown!.withdrawnAt!)).toBe(row!.withdrawnAt);
  });

  it('answers a withdrawn link with "withdrawn", and lets nobody in through it', async () => {
    const inv = await invite('ines@crew.example', 'coach');
    await owner.agent.delete(`/api/teams/${teamId}/invites/${inv.id}`).expect(204);

    const preview = await request(t.app).get(`/api/invites/${inv.token}`).expect(410);
    const error = ApiErrorBody.parse(preview.body).error;
    expect(error.code).toBe('invite_withdrawn');
    expect(error.message).toMatch(/withdrawn/);

    // Signed in already: accepting fails the same way and adds no membership.
    const someone = await signedUpAgent(t.app, 'Ines');
    const accept = await someone.agent.post(`/api/invites/${inv.token}/accept`).expect(410);
    expect(ApiErrorBody.parse(accept.body).error.code).toBe('invite_withdrawn');
    await someone.agent.get(`/api/teams/${teamId}`).expect(404);

    // New here: signing up through the link creates no account at all.
    const signUp = await request(t.app).post('/api/auth/sign-up').send({
      email: 'ines.new@crew.example',
      password: PASSWORD,
      name: 'Ines',
      inviteToken: inv.token,
    });
    expect(signUp.status).toBe(410);
    const users = await sql(t.dataSource, 'SELECT id FROM users WHERE email = ?', [
      'ines.new@crew.example',
    ]);
    expect(users).toEqual([]);
  });

  it('treats a second withdrawal as done, keeping the first time', async () => {
    const inv = await invite('ravi@crew.example');
    await owner.agent.delete(`/api/teams/${teamId}/invites/${inv.id}`).expect(204);
    const first = (await listed(inv.id))!.withdrawnAt;
    await owner.agent.delete(`/api/teams/${teamId}/invites/${inv.id}`).expect(204);
    expect((await listed(inv.id))!.withdrawnAt).toBe(first);
  });

  it('refuses to withdraw an invitation someone already joined with, and keeps the member', async () => {
    const inv = await invite('cato@crew.example', 'viewer');
    const cato = await signedUpAgent(t.app, 'Cato', 'cato@crew.example');
    await cato.agent.post(`/api/invites/${inv.token}/accept`).expect(200);
    const res = await owner.agent.delete(`/api/teams/${teamId}/invites/${inv.id}`).expect(409);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('invite_accepted');
    await cato.agent.get(`/api/teams/${teamId}`).expect(200);
    expect(await listed(inv.id)).toMatchObject({
      state: 'accepted',
      acceptedBy: 'Cato',
      withdrawnAt: null,
      withdrawnBy: null,
    });
  });

  it("does not find another team's invitation under this team", async () => {
    const other = await signedUpAgent(t.app, 'Tamsin');
    const otherTeam = Team.parse(
      (await other.agent.post('/api/teams').send({ name: 'Survey work' }).expect(201)).body,
    );
    const inv = await invite('dov@crew.example');
    await other.agent.delete(`/api/teams/${otherTeam.id}/invites/${inv.id}`).expect(404);
    await owner.agent
      .delete(`/api/teams/${teamId}/invites/00000000-0000-4000-8000-000000000000`)
      .expect(404);
    expect((await listed(inv.id))!.state).toBe('open');
  });

  it('states each invitation plainly: open, accepted, withdrawn or expired', async () => {
    const open = await invite('open@crew.example');
    const expired = await invite('late@crew.example');
    await sql(t.dataSource, 'UPDATE invites SET "expiresAt" = ? WHERE id = ?', [
      Date.now() - 1000,
      expired.id,
    ]);
    const all = InviteList.parse(
      (await owner.agent.get(`/api/teams/${teamId}/invites`).expect(200)).body,
    ).invites;
    const state = Object.fromEntries(all.map((i) => [i.email, i.state]));
    expect(state).toMatchObject({
      'open@crew.example': 'open',
      'late@crew.example': 'expired',
      'cato@crew.example': 'accepted',
      'noor@crew.example': 'withdrawn',
    });
    // Every row says when it was sent and by whom, newest first.
    expect(all.every((i) => i.invitedBy === 'Mara')).toBe(true);
    const sent = all.map((i) => Date.parse(i.createdAt));
    expect(sent).toEqual([...sent].sort((a, b) => b - a));

    InvitePreview.parse((await request(t.app).get(`/api/invites/${open.token}`).expect(200)).body);
    const late = await request(t.app).get(`/api/invites/${expired.token}`).expect(400);
    expect(ApiErrorBody.parse(late.body).error.message).toMatch(/expired/);
    // An expired invite can still be withdrawn, so the list reads as the owner meant it.
    await owner.agent.delete(`/api/teams/${teamId}/invites/${expired.id}`).expect(204);
    expect((await listed(expired.id))!.state).toBe('withdrawn');
  });

  it('says a used link was already used', async () => {
    const inv = await invite('sol@crew.example');
    const sol = await signedUpAgent(t.app, 'Sol', 'sol@crew.example');
    await sol.agent.post(`/api/invites/${inv.token}/accept`).expect(200);
    const again = await request(t.app).get(`/api/invites/${inv.token}`).expect(400);
    const error = ApiErrorBody.parse(again.body).error;
    expect(error.code).toBe('invalid_token');
    expect(error.message).toMatch(/already been used/);
  });
});
