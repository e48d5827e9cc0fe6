import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import { Comment, CommentList } from '../../../shared/schemas/comments';
import { FlightDetail } from '../../../shared/schemas/flights';
import { Comment as CommentEntity } from '../../../server/comments/comment.entity';
import { flightBody, kite } from '../helpers/fixtures';
import { signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';
import { addMember } from '../helpers/sql';

type Agent = Awaited<ReturnType<typeof signedUpAgent>>;

describe('comments', () => {
  let t: TestApp;
  let owner: Agent;
  let pilot: Agent;
  let coach: Agent;
  let teamId: string;
  let flightId: string;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedUpAgent(t.app, 'Mara');
    pilot = await signedUpAgent(t.app, 'Jonah');
    coach = await signedUpAgent(t.app, 'Ines');
    teamId = (await t.services.teams.create(owner.id, 'Club and filming crew')).id;
    for (const [u, role] of [
      [pilot, 'pilot'],
      [coach, 'coach'],
    ] as const) {
      await addMember(t.dataSource, teamId, u.id, role);
    }
    const aircraftId = (await t.services.aircraft.create(owner.id, teamId, kite)).id;
    flightId = randomUUID();
    await t.services.flights.put(pilot.id, flightId, flightBody(teamId, aircraftId));
  });
  afterAll(() => t.close());

  const counts = async () => {
    const f = FlightDetail.parse((await owner.agent.get(`/api/flights/${flightId}`)).body);
    return { commentCount: f.commentCount, openComments: f.openComments };
  };

  it('stores one comment when the same PUT is retried, answering 201 then 200', async () => {
    const id = randomUUID();
    const body = {
      flightId,
      tS: 41.5,
      body: 'Motor 3 pulls hard on the punch-out',
      channel: 'motor3',
    };
    const first = await coach.agent.put(`/api/comments/${id}`).send(body).expect(201);
    const counted = await counts();
    const again = await coach.agent.put(`/api/comments/${id}`).send(body).expect(200);
    expect(Comment.parse(again.body)).toEqual(Comment.parse(first.body));
    expect(await t.dataSource.getRepository(CommentEntity).countBy({ id })).toBe(1);
    // The retry leaves the flight's counters as they were.
    expect(await counts()).toEqual(counted);
  });

  it('counts a reply as a comment but not as another open thread', async () => {
    const root = randomUUID();
    await coach.agent
      .put(`/api/comments/${root}`)
      .send({ flightId, tS: 12, body: 'Yaw wobble here' })
      .expect(201);
    const before = await counts();
    await pilot.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 12, body: 'Props were swapped', parentId: root })
      .expect(201);
    expect(await counts()).toEqual({
      commentCount: before.commentCount + 1,
      openComments: before.openComments,
    });
  });

  it('refuses another author reusing a comment id', async () => {
    const id = randomUUID();
    await coach.agent
      .put(`/api/comments/${id}`)
      .send({ flightId, tS: 1, body: 'first' })
      .expect(201);
    const res = await pilot.agent
      .put(`/api/comments/${id}`)
      .send({ flightId, tS: 1, body: 'mine?' })
      .expect(409);
    expect(ApiErrorBody.parse(res.body).error.code).toBe('id_taken');
  });

  it('threads replies under the root, even a reply to a reply', async () => {
    const root = randomUUID();
    const r1 = randomUUID();
    const r2 = randomUUID();
    await coach.agent
      .put(`/api/comments/${root}`)
      .send({ flightId, tS: 10, body: 'Yaw kick at 10 s' })
      .expect(201);
    await pilot.agent
      .put(`/api/comments/${r1}`)
      .send({ flightId, tS: 10, body: 'Prop strike earlier', parentId: root })
      .expect(201);
    const res = await coach.agent
      .put(`/api/comments/${r2}`)
      .send({ flightId, tS: 10, body: 'Swap it', parentId: r1 })
      .expect(201);
    expect(Comment.parse(res.body).parentId).toBe(root);
    const list = CommentList.parse(
      (await owner.agent.get(`/api/flights/${flightId}/comments`)).body,
    ).comments;
    expect(
      list
        .filter((c) => c.parentId === root)
        .map((c) => c.id)
        .sort(),
    ).toEqual([r1, r2].sort());
  });

  it('counts open threads and updates on resolve and reopen', async () => {
    const before = await counts();
    const id = randomUUID();
    await coach.agent
      .put(`/api/comments/${id}`)
      .send({ flightId, tS: 5, body: 'Check the CG' })
      .expect(201);
    expect(await counts()).toEqual({
      commentCount: before.commentCount + 1,
      openComments: before.openComments + 1,
    });
    const resolved = Comment.parse(
      (await pilot.agent.patch(`/api/comments/${id}`).send({ resolved: true }).expect(200)).body,
    );
    expect(resolved.resolvedBy).toEqual({ id: pilot.id, name: 'Jonah' });
    expect((await counts()).openComments).toBe(before.openComments);
    await coach.agent.patch(`/api/comments/${id}`).send({ resolved: false }).expect(200);
    expect((await counts()).openComments).toBe(before.openComments + 1);
  });

  it('lets only the author edit, and marks the edit', async () => {
    const id = randomUUID();
    await coach.agent
      .put(`/api/comments/${id}`)
      .send({ flightId, tS: 7, body: 'typo' })
      .expect(201);
    await pilot.agent.patch(`/api/comments/${id}`).send({ body: 'hijack' }).expect(403);
    const edited = Comment.parse(
      (await coach.agent.patch(`/api/comments/${id}`).send({ body: 'fixed' }).expect(200)).body,
    );
    expect(edited.body).toBe('fixed');
    expect(edited.editedAt).not.toBeNull();
  });

  it('keeps a deleted root in place for its replies, with the text gone', async () => {
    const root = randomUUID();
    await coach.agent
      .put(`/api/comments/${root}`)
      .send({ flightId, tS: 20, body: 'secret' })
      .expect(201);
    await pilot.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 20, body: 'reply', parentId: root })
      .expect(201);
    await pilot.agent.delete(`/api/comments/${root}`).expect(403);
    await coach.agent.delete(`/api/comments/${root}`).expect(204);
    const list = CommentList.parse(
      (await owner.agent.get(`/api/flights/${flightId}/comments`)).body,
    ).comments;
    const gone = list.find((c) => c.id === root)!;
    expect(gone).toMatchObject({ deleted: true, body: '' });
    expect(list.some((c) => c.parentId === root)).toBe(true);
  });

  it('refuses mentions of people outside the team', async () => {
    const stranger = await signedUpAgent(t.app, 'Stranger');
    const res = await coach.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 3, body: '@Stranger look', mentions: [stranger.id] })
      .expect(400);
    ApiErrorBody.parse(res.body);
  });

  it('mails the pilot about a comment on their flight, unless they turned comment mail off', async () => {
    t.mailer.inbox!.clear();
    await coach.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 62, body: 'Nice hover' })
      .expect(201);
    await t.mailer.idle();
    const mails = t.mailer.inbox!.messages();
    expect(mails.map((m) => m.to[0])).toEqual([pilot.email]);
    expect(mails[0]!.subject).toContain('New comment');
    expect(mails[0]!.text).toContain(`http://hoverprint.test/flights/${flightId}`);

    await pilot.agent.patch('/api/auth/me').send({ commentMail: false }).expect(200);
    t.mailer.inbox!.clear();
    await coach.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 63, body: 'Again' })
      .expect(201);
    await t.mailer.idle();
    expect(t.mailer.inbox!.messages()).toHaveLength(0);
    // Mentions still arrive: someone asked for this person by name.
    await coach.agent
      .put(`/api/comments/${randomUUID()}`)
      .send({ flightId, tS: 64, body: '@Jonah see', mentions: [pilot.id] })
      .expect(201);
    await t.mailer.idle();
    expect(t.mailer.inbox!.messages().map((m) => m.subject)).toEqual([
      expect.stringContaining('mentioned you'),
    ]);
    await pilot.agent.patch('/api/auth/me').send({ commentMail: true }).expect(200);
  });
});
