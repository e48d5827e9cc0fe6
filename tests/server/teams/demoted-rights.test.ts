import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { crew, flightBy } from '../helpers/crew';
import { startTestApp, type TestApp } from '../helpers/test-app';

/** What someone may do with their own work follows their role now, not when they wrote it. */
describe('rights after a demotion to viewer', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('a demoted pilot can no longer edit or delete their comments or delete their flights', async () => {
    const c = await crew(t, ['pilot']);
    const flightId = await flightBy(t, c.pilot.id, c.teamId, c.aircraftId);
    const commentId = randomUUID();
    await c.pilot.agent
      .put(`/api/comments/${commentId}`)
      .send({ flightId, tS: 4, body: 'Props swapped before this one' })
      .expect(201);
    await c.owner.agent
      .patch(`/api/teams/${c.teamId}/members/${c.pilot.id}`)
      .send({ role: 'viewer' })
      .expect(200);

    const edit = await c.pilot.agent
      .patch(`/api/comments/${commentId}`)
      .send({ body: 'rewritten after demotion' })
      .expect(403);
    expect(edit.body.error.code).toBe('forbidden');
    await c.pilot.agent.delete(`/api/comments/${commentId}`).expect(403);
    await c.pilot.agent.delete(`/api/flights/${flightId}`).expect(403);

    // Nothing changed, and promoted back the same person may again.
    const list = await c.owner.agent.get(`/api/flights/${flightId}/comments`).expect(200);
    expect(list.body.comments[0].body).toBe('Props swapped before this one');
    await c.owner.agent
      .patch(`/api/teams/${c.teamId}/members/${c.pilot.id}`)
      .send({ role: 'pilot' })
      .expect(200);
    await c.pilot.agent.delete(`/api/comments/${commentId}`).expect(204);
    await c.pilot.agent.delete(`/api/flights/${flightId}`).expect(204);
  });
});
