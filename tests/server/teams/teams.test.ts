import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import { defaultThresholds } from '../../../shared/schemas/thresholds';
import { Aircraft, BenchRunList, ServiceLog } from '../../../shared/schemas/aircraft';
import { Invite, InviteList, MemberList, Team, TeamList } from '../../../shared/schemas/teams';
import { TeamThresholds } from '../../../shared/schemas/thresholds';
import { kite, sha256 } from '../helpers/fixtures';
import { signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';
import { addMember, sql } from '../helpers/sql';

describe('teams and fleet', () => {
  let t: TestApp;
  let owner: Awaited<ReturnType<typeof signedUpAgent>>;
  let tuner: Awaited<ReturnType<typeof signedUpAgent>>;
  let teamId: string;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedUpAgent(t.app, 'Mara');
    tuner = await signedUpAgent(t.app, 'Bo');
    teamId = Team.parse(
      (await owner.agent.post('/api/teams').send({ name: 'Club and filming crew' }).expect(201))
        .body,
    ).id;
    await addMember(t.dataSource, teamId, tuner.id, 'tuner');
  });
  afterAll(() => t.close());

  it('lists a user in several teams with a different role in each', async () => {
    const second = Team.parse(
      (await tuner.agent.post('/api/teams').send({ name: 'Survey work' }).expect(201)).body,
    );
    const teams = TeamList.parse((await tuner.agent.get('/api/teams').expect(200)).body).teams;
    expect(teams.map((x) => [x.name, x.role])).toEqual([
      ['Club and filming crew', 'tuner'],
      ['Survey work', 'owner'],
    ]);
    expect(second.memberCount).toBe(1);
  });

  it('keeps at least one owner', async () => {
    const res = await owner.agent
      .patch(`/api/teams/${teamId}/members/${owner.id}`)
      .send({ role: 'coach' })
      .expect(409);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('last_owner');
    await owner.agent.delete(`/api/teams/${teamId}/members/${owner.id}`).expect(409);
  });

  it('lets a member leave on their own', async () => {
    const leaver = await signedUpAgent(t.app, 'Cato');
    await addMember(t.dataSource, teamId, leaver.id, 'viewer');
    await leaver.agent.delete(`/api/teams/${teamId}/members/${leaver.id}`).expect(204);
    await leaver.agent.get(`/api/teams/${teamId}`).expect(404);
    const members = MemberList.parse(
      (await owner.agent.get(`/api/teams/${teamId}/members`)).body,
    ).members;
    expect(members.map((m) => m.name)).not.toContain('Cato');
  });

  it('refuses to invite someone already in the team', async () => {
    const res = await owner.agent
      .post(`/api/teams/${teamId}/invites`)
      .send({ email: tuner.email, role: 'pilot' })
      .expect(409);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('already_member');
  });

  it('hands the owner the accept link of a new invite, the same one the e-mail carries', async () => {
    const invite = Invite.parse(
      (
        await owner.agent
          .post(`/api/teams/${teamId}/invites`)
          .send({ email: 'noor@crew.example', role: 'coach' })
          .expect(201)
      ).body,
    );
    const token = /^http:\/\/hoverprint\.test\/invite\/([A-Za-z0-9_-]{43})$/.exec(
      invite.link ?? '',
    )?.[1];
    expect(token, `link ${invite.link}`).toBeDefined();
    await t.mailer.idle();
    const mail = t.mailer.inbox!.messages().find((m) => m.to.includes('noor@crew.example'));
    expect(mail?.text).toContain(`Join the team: ${invite.link}`);
    // The link opens the invite for whoever holds it, before signing in.
    const preview = await request(t.app).get(`/api/invites/${token}`).expect(200);
    expect(preview.body).toMatchObject({ email: 'noor@crew.example', role: 'coach' });
  });

  it('shows no invite link to a role that may not invite', async () => {
    const res = await tuner.agent
      .post(`/api/teams/${teamId}/invites`)
      .send({ email: 'ines@crew.example', role: 'pilot' })
      .expect(403);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('forbidden');
    expect(JSON.stringify(res.body)).not.toContain('/invite/');
    const list = await tuner.agent.get(`/api/teams/${teamId}/invites`).expect(403);
    expect(JSON.stringify(list.body)).not.toContain('/invite/');
    const stored = await sql(t.dataSource, 'SELECT email FROM invites WHERE email = ?', [
      'ines@crew.example',
    ]);
    expect(stored).toEqual([]);
  });

  it('keeps only the hash of an invite token, so the list cannot show the link again', async () => {
    const created = Invite.parse(
      (
        await owner.agent
          .post(`/api/teams/${teamId}/invites`)
          .send({ email: 'ravi@crew.example', role: 'viewer' })
          .expect(201)
      ).body,
    );
    const token = created.link!.split('/invite/')[1]!;
    const rows = (await sql(t.dataSource, 'SELECT * FROM invites WHERE id = ?', [
      created.id,
    ])) as Record<string, unknown>[];
    expect(rows).toHaveLength(1);
    expect(rows[0]!.tokenHash).toBe(sha256(token));
    expect(JSON.stringify(rows[0])).not.toContain(token);
    const listed = InviteList.parse(
      (await owner.agent.get(`/api/teams/${teamId}/invites`).expect(200)).body,
    ).invites.find((i) => i.id === created.id);
    const { link: _shownOnce, ...rest } = created;
    expect(listed).toEqual(rest);
  });

  it('validates the airframe with the shared schema', async () => {
    const bad = {
      ...kite,
      airframe: { ...kite.airframe, motors: kite.airframe.motors.slice(0, 2) },
    };
    const res = await tuner.agent.post(`/api/teams/${teamId}/aircraft`).send(bad).expect(400);
    expect(ApiErrorBody.parse(res.body).error.issues?.[0]?.path).toEqual(['airframe', 'motors']);
  });

  it('creates, edits and lists aircraft with their service log', async () => {
    const a = Aircraft.parse(
      (await tuner.agent.post(`/api/teams/${teamId}/aircraft`).send(kite).expect(201)).body,
    );
    expect(a).toMatchObject({ name: 'Kite', flightCount: 0, lastFlight: null });
    const edited = Aircraft.parse(
      (
        await tuner.agent
          .patch(`/api/aircraft/${a.id}`)
          .send({ notes: 'Bent arm 3 replaced' })
          .expect(200)
      ).body,
    );
    expect(edited.notes).toBe('Bent arm 3 replaced');
    await tuner.agent
      .post(`/api/aircraft/${a.id}/service-log`)
      .send({ date: '2026-05-04', kind: 'repair', motor: 5, note: 'x' })
      .expect(400);
    await tuner.agent
      .post(`/api/aircraft/${a.id}/service-log`)
      .send({ date: '2026-05-04', kind: 'repair', motor: 3, note: 'New arm' })
      .expect(201);
    const log = ServiceLog.parse((await owner.agent.get(`/api/aircraft/${a.id}/service-log`)).body);
    expect(log.entries[0]).toMatchObject({
      kind: 'repair',
      motor: 3,
      by: { id: tuner.id, name: 'Bo' },
    });
  });

  it('refuses a bench run whose throttle does not go up', async () => {
    const a = Aircraft.parse(
      (
        await tuner.agent
          .post(`/api/teams/${teamId}/aircraft`)
          .send({ ...kite, name: 'Osprey' })
          .expect(201)
      ).body,
    );
    await tuner.agent
      .post(`/api/aircraft/${a.id}/bench-runs`)
      .send({
        date: '2026-05-04',
        motor: 'm',
        prop: 'p',
        rows: [
          { throttle: 0.6, thrustG: 1 },
          { throttle: 0.5, thrustG: 2 },
        ],
      })
      .expect(400);
  });

  it('lists bench runs newest first, each with who ran it', async () => {
    const a = Aircraft.parse(
      (
        await tuner.agent
          .post(`/api/teams/${teamId}/aircraft`)
          .send({ ...kite, name: 'Heron' })
          .expect(201)
      ).body,
    );
    const rows = [
      { throttle: 0.5, thrustG: 410 },
      { throttle: 1, thrustG: 1180 },
    ];
    for (const [who, date] of [
      [tuner, '2026-05-01'],
      [owner, '2026-05-03'],
    ] as const)
      await who.agent
        .post(`/api/aircraft/${a.id}/bench-runs`)
        .send({ date, motor: '2306 1750 kV', prop: '5x4.3x3', rows })
        .expect(201);
    const list = BenchRunList.parse(
      (await owner.agent.get(`/api/aircraft/${a.id}/bench-runs`).expect(200)).body,
    );
    expect(list.runs.map((r) => [r.date, r.by])).toEqual([
      ['2026-05-03', { id: owner.id, name: 'Mara' }],
      ['2026-05-01', { id: tuner.id, name: 'Bo' }],
    ]);
  });

  it('stores team thresholds as validated JSON and falls back to defaults', async () => {
    const initial = TeamThresholds.parse(
      (await owner.agent.get(`/api/teams/${teamId}/thresholds`)).body,
    );
    expect(initial).toMatchObject({
      isDefault: true,
      thresholds: defaultThresholds,
      updatedAt: null,
    });
    await tuner.agent
      .put(`/api/teams/${teamId}/thresholds`)
      .send({ ...defaultThresholds, cellActV: -1 })
      .expect(400);
    const saved = TeamThresholds.parse(
      (
        await tuner.agent
          .put(`/api/teams/${teamId}/thresholds`)
          .send({ ...defaultThresholds, motorWatchPct: 5 })
          .expect(200)
      ).body,
    );
    expect(saved).toMatchObject({ isDefault: false, thresholds: { motorWatchPct: 5 } });
  });
});
