import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiErrorBody } from '../../../shared/api/error';
import type { Role } from '../../../shared/schemas/common';
import { Aircraft, BenchRunList, ServiceEntry, ServiceLog } from '../../../shared/schemas/aircraft';
import { Team } from '../../../shared/schemas/teams';
import { kite } from '../helpers/fixtures';
import { signedUpAgent, startTestApp, type TestApp } from '../helpers/test-app';
import { addMember, sql } from '../helpers/sql';

type Member = Awaited<ReturnType<typeof signedUpAgent>>;

describe('correcting the aircraft record', () => {
  let t: TestApp;
  let teamId: string;
  let aircraftId: string;
  const crew = {} as Record<Role, Member>;

  beforeAll(async () => {
    t = await startTestApp();
    for (const role of ['owner', 'tuner', 'pilot', 'coach', 'viewer'] as const)
      crew[role] = await signedUpAgent(t.app, role[0]!.toUpperCase() + role.slice(1));
    teamId = Team.parse(
      (await crew.owner.agent.post('/api/teams').send({ name: 'Club crew' }).expect(201)).body,
    ).id;
    for (const role of ['tuner', 'pilot', 'coach', 'viewer'] as const)
      await addMember(t.dataSource, teamId, crew[role].id, role);
    aircraftId = Aircraft.parse(
      (await crew.owner.agent.post(`/api/teams/${teamId}/aircraft`).send(kite).expect(201)).body,
    ).id;
  });
  afterAll(() => t.close());

  async function logEntry(by: Member, note: string, onAircraft = aircraftId) {
    return ServiceEntry.parse(
      (
        await by.agent
          .post(`/api/aircraft/${onAircraft}/service-log`)
          .send({ date: '2026-05-04', kind: 'repair', motor: 3, note })
          .expect(201)
      ).body,
    );
  }
  async function benchRun(by: Member, onAircraft = aircraftId) {
    const res = await by.agent
      .post(`/api/aircraft/${onAircraft}/bench-runs`)
      .send({
        date: '2026-05-04',
        motor: '2207 1950 kV',
        prop: '5.1x3.6x3',
        rows: [
          { throttle: 0.5, thrustG: 600 },
          { throttle: 1, thrustG: 1650 },
        ],
      })
      .expect(201);
    return (res.body as { id: string }).id;
  }
  const stored = async (table: string, id: string) =>
    ((await sql(t.dataSource, `SELECT id FROM ${table} WHERE id = ?`, [id])) as unknown[]).length;
  const entryPath = (id: string, onAircraft = aircraftId) =>
    `/api/aircraft/${onAircraft}/service-log/${id}`;

  it('lets a pilot delete a service entry they added, but not one a tuner added', async () => {
    const own = await logEntry(crew.pilot, 'Swapped prop 3 after a clipped gate');
    const tunerS = await logEntry(crew.tuner, 'Replaced arm 3');
    await crew.pilot.agent.delete(entryPath(own.id)).expect(204);
    expect(await stored('service_entries', own.id)).toBe(0);
    const res = await crew.pilot.agent.delete(entryPath(tunerS.id)).expect(403);
    expect(ApiErrorBody.parse(res.body).error.message).toMatch(
      /only the service entries they added/,
    );
    expect(await stored('service_entries', tunerS.id)).toBe(1);
  });

  it('lets the owner and a tuner delete anyone’s service entry', async () => {
    const a = await logEntry(crew.pilot, 'Loose motor screw');
    const b = await logEntry(crew.tuner, 'Bearing check');
    await crew.tuner.agent.delete(entryPath(a.id)).expect(204);
    await crew.owner.agent.delete(entryPath(b.id)).expect(204);
    expect(await stored('service_entries', a.id)).toBe(0);
    expect(await stored('service_entries', b.id)).toBe(0);
  });

  it('never lets a coach or viewer delete a service entry', async () => {
    const e = await logEntry(crew.owner, 'Frame inspection');
    for (const role of ['coach', 'viewer'] as const)
      await crew[role].agent.delete(entryPath(e.id)).expect(403);
    expect(await stored('service_entries', e.id)).toBe(1);
  });

  it('finds an entry only under its own aircraft', async () => {
    const other = Aircraft.parse(
      (
        await crew.owner.agent
          .post(`/api/teams/${teamId}/aircraft`)
          .send({ ...kite, name: 'Heron' })
          .expect(201)
      ).body,
    );
    const e = await logEntry(crew.owner, 'Heron gimbal damper', other.id);
    await crew.owner.agent.delete(entryPath(e.id)).expect(404);
    await crew.owner.agent.delete(entryPath('00000000-0000-4000-8000-000000000000')).expect(404);
    expect(await stored('service_entries', e.id)).toBe(1);
    const run = await benchRun(crew.owner, other.id);
    await crew.owner.agent.delete(`/api/aircraft/${aircraftId}/bench-runs/${run}`).expect(404);
    expect(await stored('bench_runs', run)).toBe(1);
  });

  it('tells each caller which service entries they may delete', async () => {
    const byPilot = await logEntry(crew.pilot, 'Prop nick on motor 1');
    const byTuner = await logEntry(crew.tuner, 'Re-soldered motor 3');
    const flags = async (who: Member) => {
      const log = ServiceLog.parse(
        (await who.agent.get(`/api/aircraft/${aircraftId}/service-log`).expect(200)).body,
      );
      const of = (id: string) => log.entries.find((e) => e.id === id)!.canDelete;
      return [of(byPilot.id), of(byTuner.id)];
    };
    expect(byPilot.canDelete).toBe(true);
    expect(await flags(crew.owner)).toEqual([true, true]);
    expect(await flags(crew.tuner)).toEqual([true, true]);
    expect(await flags(crew.pilot)).toEqual([true, false]);
    expect(await flags(crew.coach)).toEqual([false, false]);
    expect(await flags(crew.viewer)).toEqual([false, false]);
  });

  it('lets the owner and a tuner delete a bench run, and tells the others they cannot', async () => {
    const first = await benchRun(crew.tuner);
    const second = await benchRun(crew.owner);
    for (const role of ['pilot', 'coach', 'viewer'] as const) {
      const runs = BenchRunList.parse(
        (await crew[role].agent.get(`/api/aircraft/${aircraftId}/bench-runs`).expect(200)).body,
      ).runs;
      expect(runs.every((r) => !r.canDelete)).toBe(true);
      await crew[role].agent.delete(`/api/aircraft/${aircraftId}/bench-runs/${first}`).expect(403);
    }
    const runs = BenchRunList.parse(
      (await crew.tuner.agent.get(`/api/aircraft/${aircraftId}/bench-runs`).expect(200)).body,
    ).runs;
    expect(runs.every((r) => r.canDelete)).toBe(true);
    await crew.owner.agent.delete(`/api/aircraft/${aircraftId}/bench-runs/${first}`).expect(204);
    await crew.tuner.agent.delete(`/api/aircraft/${aircraftId}/bench-runs/${second}`).expect(204);
    expect(await stored('bench_runs', first)).toBe(0);
    expect(await stored('bench_runs', second)).toBe(0);
  });
});
