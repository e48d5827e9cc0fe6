import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import { defaultThresholds } from '../../../shared/schemas/thresholds';
import { kite } from '../helpers/fixtures';
import { crew, flightBy, type Agent } from '../helpers/crew';
import { startTestApp, type TestApp } from '../helpers/test-app';

/**
 * Lost updates: each editable record carries a version; a write naming an older one answers
 * 412 with the current version, and a write without If-Match still goes through.
 */
describe('versions, ETag and If-Match', () => {
  let t: TestApp;
  let c: Awaited<ReturnType<typeof crew<'tuner'>>>;
  beforeAll(async () => {
    t = await startTestApp();
    c = await crew(t, ['tuner']);
  });
  afterAll(() => t.close());

  /** Two editors saw version `v`; the first saves, the second is told and changes nothing. */
  async function lostUpdateRefused(
    first: Agent,
    second: Agent,
    write: (a: Agent, ifMatch?: string) => ReturnType<Agent['agent']['patch']>,
    read: () => Promise<unknown>,
    v: number,
  ) {
    const ok = await write(first, `"${v}"`).expect(200);
    expect(ok.body.version).toBe(v + 1);
    expect(ok.headers.etag).toBe(`"${v + 1}"`);
    const before = await read();
    const stale = await write(second, `"${v}"`).expect(412);
    const err = ApiErrorBody.parse(stale.body).error;
    expect(err.code).toBe('version_conflict');
    expect(err.currentVersion).toBe(v + 1);
    expect(stale.headers.etag).toBe(`"${v + 1}"`);
    expect(await read()).toEqual(before);
    // Without If-Match the write goes through as before (and counts as a new version).
    const blind = await write(second).expect(200);
    expect(blind.body.version).toBe(v + 2);
  }

  it('comments', async () => {
    const flightId = await flightBy(t, c.owner.id, c.teamId, c.aircraftId);
    const id = randomUUID();
    const created = await c.owner.agent
      .put(`/api/comments/${id}`)
      .send({ flightId, tS: 2, body: 'first words' })
      .expect(201);
    expect(created.body.version).toBe(1);
    let n = 0;
    await lostUpdateRefused(
      c.owner,
      c.owner,
      (a, ifMatch) => {
        const r = a.agent.patch(`/api/comments/${id}`).send({ body: `edit ${++n}` });
        return ifMatch ? r.set('if-match', ifMatch) : r;
      },
      async () => (await c.owner.agent.get(`/api/flights/${flightId}/comments`)).body,
      1,
    );
  });

  it('aircraft airframe and parts', async () => {
    const aircraftId = (await t.services.aircraft.create(c.owner.id, c.teamId, kite)).id;
    let mass = 600;
    await lostUpdateRefused(
      c.owner,
      c.tuner,
      (a, ifMatch) => {
        const r = a.agent.patch(`/api/aircraft/${aircraftId}`).send({
          airframe: { ...kite.airframe, massG: ++mass },
          components: { motors: `m${mass}` },
        });
        return ifMatch ? r.set('if-match', ifMatch) : r;
      },
      async () => (await c.owner.agent.get(`/api/aircraft/${aircraftId}`)).body,
      1,
    );
  });

  it('team thresholds', async () => {
    const got = await c.owner.agent.get(`/api/teams/${c.teamId}/thresholds`).expect(200);
    expect(got.headers.etag).toBe(`"${got.body.version}"`);
    let step = 0;
    await lostUpdateRefused(
      c.owner,
      c.tuner,
      (a, ifMatch) => {
        const r = a.agent
          .put(`/api/teams/${c.teamId}/thresholds`)
          .send({ ...defaultThresholds, hoverRateDegS: 20 + ++step });
        return ifMatch ? r.set('if-match', ifMatch) : r;
      },
      async () => (await c.owner.agent.get(`/api/teams/${c.teamId}/thresholds`)).body,
      got.body.version as number,
    );
  });

  it('import presets', async () => {
    const created = await c.owner.agent
      .post(`/api/teams/${c.teamId}/presets`)
      .send({
        name: 'Bench logger',
        columnMap: { columns: { t_ms: { channel: 'time', unit: 'ms' } } },
      })
      .expect(201);
    let n = 0;
    await lostUpdateRefused(
      c.owner,
      c.tuner,
      (a, ifMatch) => {
        const r = a.agent.patch(`/api/presets/${created.body.id}`).send({ name: `Bench ${++n}` });
        return ifMatch ? r.set('if-match', ifMatch) : r;
      },
      async () => (await c.owner.agent.get(`/api/teams/${c.teamId}/presets`)).body,
      1,
    );
  });

  it('refuses an If-Match that names no version', async () => {
    const got = await c.owner.agent.get(`/api/teams/${c.teamId}/thresholds`);
    await c.owner.agent
      .put(`/api/teams/${c.teamId}/thresholds`)
      .set('if-match', 'yesterday')
      .send(got.body.thresholds)
      .expect(400);
  });
});
