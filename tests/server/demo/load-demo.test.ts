import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { judgeAgainst } from '../../../shared/analysis/baseline';
import { driftSample } from '../../../shared/analysis/drift';
import { BenchRunList, ServiceLog } from '../../../shared/schemas/aircraft';
import { AircraftBaseline } from '../../../shared/schemas/baseline';
import { FlightDetail, FlightPage } from '../../../shared/schemas/flights';
import { defaultThresholds } from '../../../shared/schemas/thresholds';
import { DEMO_PASSWORD, demoMembers } from '../../../shared/sim/demo/crew';
import { demoFlights } from '../../../shared/sim/demo/flights';
import { demoComments } from '../../../shared/sim/demo/comments';
import { demoId, loadDemo } from '../../../server/demo/load-demo';
import { startTestApp, type TestApp } from '../helpers/test-app';

const email = (key: string) => demoMembers.find((m) => m.key === key)!.email;

describe('demo loader', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    await loadDemo(t.dataSource, t.services);
  }, 120_000);
  afterAll(() => t.close());

  async function signedIn(key: string) {
    const agent = request.agent(t.app);
    await agent
      .post('/api/auth/sign-in')
      .send({ email: email(key), password: DEMO_PASSWORD })
      .expect(200);
    const teams = await agent.get('/api/teams').expect(200);
    return { agent, teamId: (teams.body as { teams: { id: string }[] }).teams[0]!.id };
  }

  it('loads once: a second run changes nothing', async () => {
    expect(await loadDemo(t.dataSource, t.services)).toEqual({
      loaded: false,
      flights: 0,
      comments: 0,
    });
  });

  it('gives every demo member their role and the whole team history', async () => {
    const { agent, teamId } = await signedIn('wren');
    const members = await agent.get(`/api/teams/${teamId}/members`).expect(200);
    const roles = Object.fromEntries(
      (members.body as { members: { email: string; role: string }[] }).members.map((m) => [
        m.email,
        m.role,
      ]),
    );
    for (const m of demoMembers) expect(roles[m.email]).toBe(m.role);
    const page = FlightPage.parse(
      (await agent.get(`/api/teams/${teamId}/flights?limit=50`).expect(200)).body,
    );
    expect(page.flights).toHaveLength(demoFlights.length);
  });

  it('gives the coach a flight awaiting review and shows one review closed', async () => {
    const { agent, teamId } = await signedIn('wren');
    const list = async (review: string) =>
      FlightPage.parse(
        (await agent.get(`/api/teams/${teamId}/flights?review=${review}`).expect(200)).body,
      ).flights.map((f) => f.id);
    const asked = demoFlights.filter((f) => f.review && !f.review.outcome);
    const closed = demoFlights.filter((f) => f.review?.outcome === 'reviewed');
    expect(asked.length).toBeGreaterThan(0);
    expect(closed.length).toBeGreaterThan(0);
    expect(await list('requested')).toEqual(
      expect.arrayContaining(asked.map((f) => demoId('flight', f.index))),
    );
    expect(await list('reviewed')).toEqual(
      expect.arrayContaining(closed.map((f) => demoId('flight', f.index))),
    );
  });

  it("tells Kite's story: the worn motor 3 is named before its replacement", async () => {
    const { agent } = await signedIn('tobin');
    const worn = demoFlights.filter(
      (f) => f.aircraft === 'kite' && f.faults.some((x) => x.kind === 'weak-motor'),
    );
    const worst = worn.reduce((a, b) => (weakness(b) > weakness(a) ? b : a));
    const detail = FlightDetail.parse(
      (await agent.get(`/api/flights/${demoId('flight', worst.index)}`).expect(200)).body,
    );
    const finding = detail.report.findings.find((f) => f.code === 'motor-working-hard');
    expect(finding?.motor).toBe(3);
  });

  it("catches Kite's worn motor 3 by drift a flight before the fixed limits do", async () => {
    const { agent } = await signedIn('tobin');
    const worn = demoFlights.filter(
      (f) =>
        f.aircraft === 'kite' &&
        f.faults.some((x) => x.kind === 'weak-motor' && x.efficiency < 0.99),
    );
    const [first, second] = worn;
    const judge = async (f: (typeof demoFlights)[number]) => {
      const detail = FlightDetail.parse(
        (await agent.get(`/api/flights/${demoId('flight', f.index)}`).expect(200)).body,
      );
      const baseline = AircraftBaseline.parse(
        (
          await agent
            .get(`/api/aircraft/${detail.aircraftId}/baseline`)
            .query({ before: f.date, exclude: detail.id })
            .expect(200)
        ).body,
      );
      return {
        fixed: detail.report.findings.filter((x) => x.code === 'motor-working-hard'),
        drift: judgeAgainst(driftSample(detail.report), f.date, baseline, defaultThresholds),
      };
    };
    const a = await judge(first!);
    expect(a.fixed).toEqual([]);
    expect(a.drift.kind).toBe('compared');
    if (a.drift.kind === 'compared') {
      expect(a.drift.against).toBe('Kite’s last 3 flights');
      expect(a.drift.findings.map((x) => [x.code, x.motor])).toEqual([['motor-drift', 3]]);
    }
    const b = await judge(second!);
    expect(b.fixed.map((x) => x.motor)).toEqual([3]);
  });

  it('keeps the bench runs its service log cites', async () => {
    const { agent, teamId } = await signedIn('maren');
    const aircraft = (await agent.get(`/api/teams/${teamId}/aircraft`).expect(200)).body as {
      aircraft: { id: string; name: string }[];
    };
    const kite = aircraft.aircraft.find((a) => a.name === 'Kite')!;
    const log = ServiceLog.parse((await agent.get(`/api/aircraft/${kite.id}/service-log`)).body);
    const runs = BenchRunList.parse((await agent.get(`/api/aircraft/${kite.id}/bench-runs`)).body);
    const citing = log.entries.filter((e) => /bench run/i.test(e.note));
    expect(citing.length).toBeGreaterThan(0);
    for (const e of citing) {
      const runsBefore = runs.runs.filter((r) => r.date <= e.date);
      expect(runsBefore.some((r) => /motor 3/i.test(r.motor))).toBe(true);
    }
  });

  it("tells Heron's story: the CG estimate moves forward after the camera swap", async () => {
    const { agent } = await signedIn('sol');
    const heron = demoFlights.filter((f) => f.aircraft === 'heron');
    const shifted = heron.find((f) =>
      f.faults.some((x) => x.kind === 'cg-offset' && x.dxMm >= 10),
    )!;
    const detail = FlightDetail.parse(
      (await agent.get(`/api/flights/${demoId('flight', shifted.index)}`).expect(200)).body,
    );
    const truth = shifted.faults.find((x) => x.kind === 'cg-offset')!;
    expect(detail.report.cg?.xMm).toBeGreaterThan(truth.kind === 'cg-offset' ? truth.dxMm - 5 : 0);
  });

  it('pins the coach comments to their moments', async () => {
    const { agent } = await signedIn('wren');
    const first = demoComments[0]!;
    const res = await agent
      .get(`/api/flights/${demoId('flight', first.flight)}/comments`)
      .expect(200);
    const bodies = (res.body as { comments: { body: string; tS: number }[] }).comments;
    expect(bodies.some((c) => c.body === first.body && c.tS === first.tS)).toBe(true);
  });
});

function weakness(f: (typeof demoFlights)[number]): number {
  const w = f.faults.find((x) => x.kind === 'weak-motor');
  return w && w.kind === 'weak-motor' ? 1 - w.efficiency : 0;
}
