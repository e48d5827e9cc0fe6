import { createHash, randomUUID } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import {
  FlightDetail,
  FlightPage,
  FlightPutResponse,
  RawUploadResponse,
} from '../../../shared/schemas/flights';
import { Trends } from '../../../shared/schemas/aircraft';
import { FlightPayload } from '../../../server/flights/flight-payload.entity';
import { Flight } from '../../../server/flights/flight.entity';
import { csvLog, flightBody, kite, report, sha256 } from '../helpers/fixtures';
import { storedRaw } from '../helpers/engine';
import { signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';
import { addMember } from '../helpers/sql';

type Agent = Awaited<ReturnType<typeof signedUpAgent>>;

/** Every raw log the store keeps (files under DATA_DIR/raw, staging included, or bucket keys). */
const rawFiles = (t: TestApp) => storedRaw(t.config);

describe('flights', () => {
  let t: TestApp;
  let owner: Agent;
  let pilot: Agent;
  let outsider: Agent;
  let teamId: string;
  let aircraftId: string;

  beforeAll(async () => {
    t = await startTestApp({ env: { MAX_UPLOAD_MB: '0.01' } }); // 10 KB, so "too large" is cheap to send
    owner = await signedUpAgent(t.app, 'Mara');
    pilot = await signedUpAgent(t.app, 'Jonah');
    outsider = await signedUpAgent(t.app, 'Tess');
    teamId = (await t.services.teams.create(owner.id, 'Club and filming crew')).id;
    await addMember(t.dataSource, teamId, pilot.id, 'pilot');
    aircraftId = (await t.services.aircraft.create(owner.id, teamId, kite)).id;
  });
  afterAll(() => t.close());

  it('stores one flight when the same PUT arrives twice', async () => {
    const id = randomUUID();
    const body = flightBody(teamId, aircraftId);
    const first = await pilot.agent.put(`/api/flights/${id}`).send(body).expect(201);
    expect(FlightPutResponse.parse(first.body).outcome).toBe('created');
    const second = await pilot.agent.put(`/api/flights/${id}`).send(body).expect(200);
    expect(FlightPutResponse.parse(second.body).outcome).toBe('unchanged');
    expect(await t.dataSource.getRepository(Flight).countBy({ id })).toBe(1);
  });

  it('replaces the summary when the uploader sends a new analysis of the same flight', async () => {
    const id = randomUUID();
    const body = flightBody(teamId, aircraftId);
    await pilot.agent.put(`/api/flights/${id}`).send(body).expect(201);
    const res = await pilot.agent
      .put(`/api/flights/${id}`)
      .send({ ...body, report: report({ findings: [] }) })
      .expect(200);
    const put = FlightPutResponse.parse(res.body);
    expect(put.outcome).toBe('replaced');
    expect(put.flight.worstSeverity).toBeNull();
  });

  it('answers a second upload of the same raw file with the existing flight', async () => {
    const body = flightBody(teamId, aircraftId);
    const firstId = randomUUID();
    await pilot.agent.put(`/api/flights/${firstId}`).send(body).expect(201);
    const res = await owner.agent.put(`/api/flights/${randomUUID()}`).send(body).expect(200);
    const put = FlightPutResponse.parse(res.body);
    expect(put.outcome).toBe('duplicate');
    expect(put.flight.id).toBe(firstId);
    expect(await t.dataSource.getRepository(Flight).countBy({ sha256: body.sha256 })).toBe(1);
  });

  it('refuses a report that does not match the shared schema, naming the field', async () => {
    const body = flightBody(teamId, aircraftId);
    const bad = {
      ...body,
      report: { ...body.report, findings: [{ code: 'made-up', severity: 'act', message: 'x' }] },
    };
    const res = await pilot.agent.put(`/api/flights/${randomUUID()}`).send(bad).expect(400);
    expect(ApiErrorBody.parse(res.body).error.issues?.[0]?.path).toEqual([
      'report',
      'findings',
      0,
      'code',
    ]);
  });

  it('refuses review detail larger than the bound', async () => {
    const big = {
      effort: { t: new Array(800_000).fill(1.234567), series: {} },
      spectra: {},
      diagnosis: {},
      tracking: null,
      power: null,
      campbell: null,
    };
    const res = await pilot.agent
      .put(`/api/flights/${randomUUID()}`)
      .send({ ...flightBody(teamId, aircraftId), detail: big });
    expect([400, 413]).toContain(res.status);
    ApiErrorBody.parse(res.body);
  });

  it('returns the stored report and detail on GET', async () => {
    const id = randomUUID();
    const detail = {
      effort: { t: [0, 0.5], series: { collective: [0.4, 0.41] } },
      tracking: null,
      power: null,
      spectra: { gyro_x: { hz: [100, 200], db: [-10, 5] } },
      campbell: null,
      diagnosis: {
        pattern: 'weak-motor',
        motor: 1,
        confidence: 0.7,
        text: 'Motor 1 carries more than its share.',
      },
    };
    await pilot.agent
      .put(`/api/flights/${id}`)
      .send({ ...flightBody(teamId, aircraftId), detail })
      .expect(201);
    const res = await owner.agent.get(`/api/flights/${id}`).expect(200);
    const f = FlightDetail.parse(res.body);
    expect(f.report.findings).toHaveLength(2);
    expect(f.detail).toEqual(detail);
    expect(f.findingCounts).toEqual({ note: 1, watch: 1, act: 0 });
    expect(f.pilot).toEqual({ id: pilot.id, name: 'Jonah' });
  });

  describe('list', () => {
    let listTeam: string;
    let kiteId: string;
    let heronId: string;
    beforeAll(async () => {
      listTeam = (await t.services.teams.create(owner.id, 'List crew')).id;
      await addMember(t.dataSource, listTeam, pilot.id, 'pilot');
      kiteId = (await t.services.aircraft.create(owner.id, listTeam, kite)).id;
      heronId = (await t.services.aircraft.create(owner.id, listTeam, { ...kite, name: 'Heron' }))
        .id;
      for (let i = 0; i < 25; i++) {
        const act = i % 5 === 0;
        await t.services.flights.put(
          i % 2 ? pilot.id : owner.id,
          randomUUID(),
          flightBody(listTeam, i % 3 ? kiteId : heronId, {
            recordedAt: new Date(Date.UTC(2026, 4, 1 + i, 10)).toISOString(),
            report: report({
              findings: act
                ? [{ code: 'battery-sag', severity: 'act', message: 'Land sooner.' }]
                : [],
            }),
          }),
        );
      }
    });

    it('pages newest first with a cursor and no repeats', async () => {
      const seen: string[] = [];
      let cursor: string | null = null;
      let pages = 0;
      do {
        const res = await owner.agent
          .get(`/api/teams/${listTeam}/flights`)
          .query({ limit: 10, ...(cursor ? { cursor } : {}) })
          .expect(200);
        const page = FlightPage.parse(res.body);
        seen.push(...page.flights.map((f) => f.recordedAt));
        cursor = page.nextCursor;
        pages++;
      } while (cursor);
      expect(pages).toBe(3);
      expect(seen).toHaveLength(25);
      expect([...seen].sort().reverse()).toEqual(seen);
      expect(new Set(seen).size).toBe(25);
    });

    it('filters by aircraft, pilot, date range and severity', async () => {
      const q = async (query: Record<string, string>) =>
        FlightPage.parse(
          (
            await owner.agent
              .get(`/api/teams/${listTeam}/flights`)
              .query({ limit: 100, ...query })
              .expect(200)
          ).body,
        ).flights;
      expect((await q({ aircraftId: heronId })).every((f) => f.aircraftName === 'Heron')).toBe(
        true,
      );
      expect(await q({ aircraftId: heronId })).toHaveLength(9); // i % 3 === 0 for i < 25
      expect((await q({ pilotId: pilot.id })).length).toBe(12);
      expect(await q({ from: '2026-05-10T00:00:00Z', to: '2026-05-15T00:00:00Z' })).toHaveLength(5);
      const acts = await q({ severity: 'act' });
      expect(acts).toHaveLength(5);
      expect(acts.every((f) => f.worstSeverity === 'act')).toBe(true);
      expect(await q({ severity: 'note' })).toHaveLength(5);
    });

    it('filters by open comments', async () => {
      const flights = FlightPage.parse(
        (await owner.agent.get(`/api/teams/${listTeam}/flights`).query({ limit: 1 })).body,
      ).flights;
      const target = flights[0]!;
      await owner.agent
        .put(`/api/comments/${randomUUID()}`)
        .send({ flightId: target.id, tS: 1, body: 'check this' })
        .expect(201);
      const open = FlightPage.parse(
        (await owner.agent.get(`/api/teams/${listTeam}/flights`).query({ openComments: 'true' }))
          .body,
      ).flights;
      expect(open.map((f) => f.id)).toEqual([target.id]);
      expect(open[0]!.openComments).toBe(1);
    });

    it('rejects a forged cursor and a bad filter with 400', async () => {
      await owner.agent
        .get(`/api/teams/${listTeam}/flights`)
        .query({ cursor: 'bm9wZQ' })
        .expect(400);
      await owner.agent
        .get(`/api/teams/${listTeam}/flights`)
        .query({ severity: 'dire' })
        .expect(400);
    });

    it('builds trends oldest first from stored summaries', async () => {
      const res = await owner.agent.get(`/api/aircraft/${kiteId}/trends`).expect(200);
      const trends = Trends.parse(res.body);
      expect(trends.points).toHaveLength(16);
      expect(trends.points[0]!.recordedAt < trends.points[15]!.recordedAt).toBe(true);
      expect(trends.points[0]).toMatchObject({
        deviationPct: [8, 0, -4, -4],
        sagCellV: 0.41,
        bandRms: { gyro_x: 4.2, gyro_y: 3.9 },
      });
    });
  });

  describe('raw logs', () => {
    async function newFlight(agent: Agent, csv: string) {
      const id = randomUUID();
      await agent.agent
        .put(`/api/flights/${id}`)
        .send(flightBody(teamId, aircraftId, { sha256: sha256(csv) }))
        .expect(201);
      return id;
    }

    it('stores the log by hash and gives it back byte for byte to team members only', async () => {
      const csv = csvLog('raw-1');
      const id = await newFlight(pilot, csv);
      const up = await pilot.agent
        .put(`/api/flights/${id}/raw`)
        .attach('file', Buffer.from(csv), 'kite.csv')
        .expect(201);
      expect(RawUploadResponse.parse(up.body)).toMatchObject({
        sha256: sha256(csv),
        gzip: false,
        stored: true,
      });
      const down = await owner.agent
        .get(`/api/flights/${id}/raw`)
        .buffer(true)
        .parse((res, cb) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => cb(null, Buffer.concat(chunks)));
        })
        .expect(200);
      expect((down.body as Buffer).toString('utf8')).toBe(csv);
      expect(down.headers['content-type']).toMatch(/text\/csv/);
      await outsider.agent.get(`/api/flights/${id}/raw`).expect(404);
      await request(t.app).get(`/api/flights/${id}/raw`).expect(401);
      expect((await owner.agent.get(`/api/flights/${id}`)).body.hasRaw).toBe(true);
    });

    it('keeps a gzipped log as gzip', async () => {
      const gz = gzipSync(Buffer.from(csvLog('raw-gz')));
      const id = randomUUID();
      await pilot.agent
        .put(`/api/flights/${id}`)
        .send(flightBody(teamId, aircraftId, { sha256: sha256Buf(gz) }))
        .expect(201);
      const up = await pilot.agent
        .put(`/api/flights/${id}/raw`)
        .attach('file', gz, 'kite.csv.gz')
        .expect(201);
      expect(RawUploadResponse.parse(up.body).gzip).toBe(true);
      const down = await owner.agent
        .get(`/api/flights/${id}/raw`)
        .buffer(true)
        .parse((res, cb) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => cb(null, Buffer.concat(chunks)));
        });
      expect(down.headers['content-type']).toBe('application/gzip');
      expect(Buffer.compare(down.body as Buffer, gz)).toBe(0);
    });

    it('refuses an over-size upload with 413 and stores nothing', async () => {
      const big = 'time,motor1\n' + '0.001,0.5\n'.repeat(2000); // ~20 KB > 10 KB limit
      const id = await newFlight(pilot, big);
      const before = await rawFiles(t);
      const res = await pilot.agent
        .put(`/api/flights/${id}/raw`)
        .attach('file', Buffer.from(big), 'big.csv')
        .expect(413);
      expect(ApiErrorBody.parse(res.body).error.code).toBe('too_large');
      expect(await rawFiles(t)).toEqual(before);
      expect((await owner.agent.get(`/api/flights/${id}`)).body.hasRaw).toBe(false);
    });

    it('refuses a file that is not a CSV log and stores nothing', async () => {
      const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
      const id = randomUUID();
      await pilot.agent
        .put(`/api/flights/${id}`)
        .send(flightBody(teamId, aircraftId, { sha256: sha256Buf(png) }))
        .expect(201);
      const before = await rawFiles(t);
      const res = await pilot.agent
        .put(`/api/flights/${id}/raw`)
        .attach('file', png, 'photo.csv')
        .expect(415);
      expect(ApiErrorBody.parse(res.body).error.code).toBe('not_csv');
      expect(await rawFiles(t)).toEqual(before);
    });

    it('refuses a file whose hash is not the analysed one', async () => {
      const id = await newFlight(pilot, csvLog('one'));
      const res = await pilot.agent
        .put(`/api/flights/${id}/raw`)
        .attach('file', Buffer.from(csvLog('two')), 'x.csv')
        .expect(409);
      expect(ApiErrorBody.parse(res.body).error.code).toBe('hash_mismatch');
    });

    it('refuses a request without a file part', async () => {
      const id = await newFlight(pilot, csvLog('none'));
      await pilot.agent.put(`/api/flights/${id}/raw`).field('note', 'x').expect(400);
    });

    it('removes the stored log when its last flight is deleted', async () => {
      const csv = csvLog('delete-me');
      const id = await newFlight(pilot, csv);
      await pilot.agent
        .put(`/api/flights/${id}/raw`)
        .attach('file', Buffer.from(csv), 'd.csv')
        .expect(201);
      expect((await rawFiles(t)).some((f: string) => f.includes(sha256(csv)))).toBe(true);
      await pilot.agent.delete(`/api/flights/${id}`).expect(204);
      expect((await rawFiles(t)).some((f: string) => f.includes(sha256(csv)))).toBe(false);
      await owner.agent.get(`/api/flights/${id}`).expect(404);
      // The report and detail go with it.
      expect(await t.dataSource.getRepository(FlightPayload).countBy({ flightId: id })).toBe(0);
    });
  });
});

function sha256Buf(b: Buffer) {
  return createHash('sha256').update(b).digest('hex');
}
