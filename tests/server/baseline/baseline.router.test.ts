import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AircraftBaseline } from '../../../shared/schemas/baseline';
import { DriftSamples1764979200000 } from '../../../server/db/migrations/1764979200000-drift-samples';
import { crew, type Agent } from '../helpers/crew';
import { flightBody, report } from '../helpers/fixtures';
import { signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';

/**
 * GET /api/aircraft/:id/baseline over HTTP on a real SQLite file: the aircraft's flights before
 * the one judged, since its latest configuration change, with enough hover, bounded.
 */
describe('the baseline a review judges drift against', () => {
  let t: TestApp;
  let owner: Agent;
  let viewer: Agent;
  let aircraftId: string;
  let teamId: string;
  const ids: string[] = [];
  const put = async (day: string, hoverS: number, motor2: number) => {
    const id = randomUUID();
    ids.push(id);
    await t.services.flights.put(
      owner.id,
      id,
      flightBody(teamId, aircraftId, {
        recordedAt: `${day}T09:00:00.000Z`,
        report: report({
          segments: { hoverS, hover: [[0, hoverS]] },
          balance: {
            expectedShare: [0.25, 0.25, 0.25, 0.25],
            measuredShare: [0.25, 0.25, 0.25, 0.25],
            deviationPct: [0.3, motor2, -0.2, -0.1],
          },
        }),
      }),
    );
    return id;
  };

  beforeAll(async () => {
    t = await startTestApp();
    const c = await crew(t, ['viewer']);
    ({ owner, viewer, aircraftId, teamId } = c);
    // Before the motor swap: must not count.
    await put('2026-11-20', 30, 6);
    await put('2026-11-25', 30, 6);
    await owner.agent
      .post(`/api/aircraft/${aircraftId}/service-log`)
      .send({ date: '2026-11-28', kind: 'part-swap', motor: 2, note: 'New motor 2 after a crash' })
      .expect(201);
    await owner.agent
      .post(`/api/aircraft/${aircraftId}/service-log`)
      .send({ date: '2026-11-30', kind: 'inspection', note: 'All screws checked' })
      .expect(201);
    await put('2026-11-29', 30, 0.1);
    await put('2026-11-30', 2, 0.1); // too little hover
    for (const day of ['01', '02', '03', '04', '05', '06', '07', '08', '09', '10', '11', '12'])
      await put(`2026-12-${day}`, 25, 0.2);
  }, 60_000);
  afterAll(() => t.close());

  it('starts after the latest configuration change, skips short hovers and keeps the team’s most recent', async () => {
    const now = await put('2026-12-13', 25, 3);
    const res = await viewer.agent
      .get(`/api/aircraft/${aircraftId}/baseline`)
      .query({ before: '2026-12-13T09:00:00.000Z', exclude: now })
      .expect(200);
    const b = AircraftBaseline.parse(res.body);
    expect(b.aircraftName).toBe('Kite');
    expect(b.since).toMatchObject({ date: '2026-11-28', kind: 'part-swap', motor: 2 });
    // 13 flights qualify since the swap; the default team settings keep the last 10.
    expect(b.flights).toHaveLength(10);
    expect(b.flights.map((f) => f.recordedAt.slice(0, 10))).toEqual(
      ['03', '04', '05', '06', '07', '08', '09', '10', '11', '12'].map((d) => `2026-12-${d}`),
    );
    expect(b.flights.every((f) => f.flightId !== now)).toBe(true);
    expect(b.flights[0]!.sample).toMatchObject({
      hoverS: 25,
      deviationPct: [0.3, 0.2, -0.2, -0.1],
      lagMs: { roll: 14, pitch: 15, yaw: 22 },
    });
  });

  it('follows the team’s thresholds and counts the short flights it left out', async () => {
    await owner.agent
      .put(`/api/teams/${teamId}/thresholds`)
      .send({
        ...(
          (await owner.agent.get(`/api/teams/${teamId}/thresholds`)).body as {
            thresholds: object;
          }
        ).thresholds,
        driftMaxFlights: 4,
      })
      .expect(200);
    const b = AircraftBaseline.parse(
      (
        await owner.agent
          .get(`/api/aircraft/${aircraftId}/baseline`)
          .query({ before: '2026-12-02T12:00:00.000Z' })
          .expect(200)
      ).body,
    );
    expect(b.flights.map((f) => f.recordedAt.slice(0, 10))).toEqual([
      '2026-11-29',
      '2026-12-01',
      '2026-12-02',
    ]);
    expect(b.shortHover).toBe(1);
  });

  it('answers 400 for a bad time, and nothing to people outside the team', async () => {
    await owner.agent
      .get(`/api/aircraft/${aircraftId}/baseline`)
      .query({ before: 'yesterday' })
      .expect(400);
    const stranger = await signedUpAgent(t.app, 'Stray');
    await stranger.agent
      .get(`/api/aircraft/${aircraftId}/baseline`)
      .query({ before: '2026-12-13T09:00:00.000Z' })
      .expect(404);
  });

  it('reads hover and lag of flights stored before they were kept, once the migration copied them', async () => {
    if (t.dataSource.options.type !== 'better-sqlite3') return; // the PostgreSQL twin runs in its own leg
    const old = ids[ids.length - 1]!;
    await t.dataSource.query(
      `UPDATE "flights" SET "trend" = json_remove("trend", '$.hoverS', '$.lagMs') WHERE "id" = ?`,
      [old],
    );
    const [row] = (await t.dataSource.query('SELECT "trend" FROM "flights" WHERE "id" = ?', [
      old,
    ])) as { trend: string }[];
    expect(JSON.parse(row!.trend)).not.toHaveProperty('hoverS');
    const runner = t.dataSource.createQueryRunner();
    try {
      await new DriftSamples1764979200000().up(runner);
    } finally {
      await runner.release();
    }
    const [after] = (await t.dataSource.query('SELECT "trend" FROM "flights" WHERE "id" = ?', [
      old,
    ])) as { trend: string }[];
    expect(JSON.parse(after!.trend)).toMatchObject({
      hoverS: 25,
      lagMs: { roll: 14, pitch: 15, yaw: 22 },
    });
  });
});
