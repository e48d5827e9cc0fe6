import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MeResponse } from '../../../shared/schemas/auth';
import { DevMailList } from '../../../shared/schemas/mail';
import { InvitePreview } from '../../../shared/schemas/teams';
import { flightBody, kite } from '../helpers/fixtures';
import {
  PASSWORD,
  signedUpAgent,
  startTestApp,
  uniqueEmail,
  type TestApp,
} from '../helpers/test-app';
import { addMember } from '../helpers/sql';

/** Mail goes through nodemailer over real SMTP into the local fake server, and is read back over HTTP. */
describe('e-mail through the fake SMTP server', () => {
  let t: TestApp;
  let owner: Awaited<ReturnType<typeof signedUpAgent>>;
  let teamId: string;

  beforeAll(async () => {
    t = await startTestApp({ smtp: true });
    owner = await signedUpAgent(t.app, 'Mara');
    teamId = (await t.services.teams.create(owner.id, 'Club and filming crew')).id;
  });
  afterAll(() => t.close());

  const inbox = async () =>
    DevMailList.parse((await request(t.app).get('/api/dev/mail').expect(200)).body).messages;
  const linkIn = (text: string, path: string) =>
    new RegExp(`http://hoverprint\\.test${path}([A-Za-z0-9_-]+)`).exec(text)?.[1];

  it('delivers an invite to the invited address with a link that joins the team', async () => {
    const email = uniqueEmail('noor');
    await owner.agent
      .post(`/api/teams/${teamId}/invites`)
      .send({ email, role: 'coach' })
      .expect(201);
    const mail = (await inbox()).find((m) => m.to.includes(email));
    expect(mail).toBeDefined();
    expect(mail!.subject).toBe('Mara invited you to Club and filming crew on Hoverprint');
    expect(mail!.html).toContain('href="http://hoverprint.test/invite/');
    const token = linkIn(mail!.text, '/invite/');
    expect(token).toBeDefined();

    const preview = InvitePreview.parse(
      (await request(t.app).get(`/api/invites/${token}`).expect(200)).body,
    );
    expect(preview).toMatchObject({ teamName: 'Club and filming crew', role: 'coach', email });
    // Joining by signing up through the link.
    const res = await request(t.app)
      .post('/api/auth/sign-up')
      .send({ email, password: PASSWORD, name: 'Noor', inviteToken: token })
      .expect(201);
    expect(MeResponse.parse(res.body).user.teams).toEqual([
      { id: teamId, name: 'Club and filming crew', role: 'coach' },
    ]);
    // The link works once.
    const other = await signedUpAgent(t.app, 'Late');
    await other.agent.post(`/api/invites/${token}/accept`).expect(400);
  });

  it('lets a signed-in user accept an invite link', async () => {
    const invitee = await signedUpAgent(t.app, 'Oskar');
    await owner.agent
      .post(`/api/teams/${teamId}/invites`)
      .send({ email: invitee.email, role: 'pilot' })
      .expect(201);
    const mail = (await inbox()).find((m) => m.to.includes(invitee.email))!;
    const token = linkIn(mail.text, '/invite/')!;
    const res = await invitee.agent.post(`/api/invites/${token}/accept`).expect(200);
    expect(res.body.team).toMatchObject({ id: teamId, role: 'pilot' });
  });

  it('delivers a mention to the mentioned member with a link to the comment', async () => {
    const coach = await signedUpAgent(t.app, 'Ines');
    await addMember(t.dataSource, teamId, coach.id, 'coach');
    const aircraftId = (await t.services.aircraft.create(owner.id, teamId, kite)).id;
    const flightId = randomUUID();
    await t.services.flights.put(
      owner.id,
      flightId,
      flightBody(teamId, aircraftId, { fileName: 'kite-park.csv' }),
    );
    const commentId = randomUUID();
    await owner.agent
      .put(`/api/comments/${commentId}`)
      .send({
        flightId,
        tS: 75.2,
        body: '@Ines is this the frame resonance?',
        mentions: [coach.id],
      })
      .expect(201);
    const mail = (await inbox()).find(
      (m) => m.to.includes(coach.email) && m.subject.includes('mentioned'),
    );
    expect(mail).toBeDefined();
    expect(mail!.subject).toBe('Mara mentioned you on Kite · kite-park.csv');
    expect(mail!.text).toContain('@Ines is this the frame resonance?');
    const link = /http:\/\/hoverprint\.test(\/flights\/[^\s?]+)\?comment=([\w-]+)/.exec(mail!.text);
    expect(link?.[1]).toBe(`/flights/${flightId}`);
    expect(link?.[2]).toBe(commentId);
    // The link's comment is reachable by the recipient.
    const list = await coach.agent.get(`/api/flights/${flightId}/comments`).expect(200);
    expect((list.body.comments as { id: string }[]).map((c) => c.id)).toContain(commentId);
  });

  it('sends a review request to the chosen coach', async () => {
    const coach = await signedUpAgent(t.app, 'Pia');
    await addMember(t.dataSource, teamId, coach.id, 'coach');
    const aircraftId = (
      await t.services.aircraft.create(owner.id, teamId, { ...kite, name: 'Heron' })
    ).id;
    const flightId = randomUUID();
    await t.services.flights.put(owner.id, flightId, flightBody(teamId, aircraftId));
    const res = await owner.agent
      .post(`/api/flights/${flightId}/review-request`)
      .send({ userIds: [coach.id], note: 'Vibration after the rebuild?' })
      .expect(200);
    expect(res.body.reviewState).toBe('requested');
    const mail = (await inbox()).find((m) => m.to.includes(coach.email));
    expect(mail?.subject).toContain('asks you to review');
    expect(mail?.text).toContain('Vibration after the rebuild?');
  });
});
