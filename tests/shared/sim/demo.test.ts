import { describe, expect, it } from 'vitest';
import { expectedHoverShares } from '../../../shared/airframe/allocation';
import { Airframe } from '../../../shared/schemas/airframe';
import { demoComments } from '../../../shared/sim/demo/comments';
import { demoMembers, demoTeam } from '../../../shared/sim/demo/crew';
import { demoFlightLog } from '../../../shared/sim/demo/demo-flight-log';
import { demoAircraft, demoFleet } from '../../../shared/sim/demo/fleet';
import { demoFlights, demoServiceLog } from '../../../shared/sim/demo/flights';
import { buildPhases } from '../../../shared/sim/pilot-script';
import { col, hoverOutputs, hoverRows, hoverThrusts, tonePower } from './helpers';

const member = (key: string) => demoMembers.find((m) => m.key === key);
const efficiencyOf = (i: number) => {
  const f = demoFlights[i]!.faults.find((x) => x.kind === 'weak-motor');
  return f && f.kind === 'weak-motor' ? f.efficiency : 1;
};

describe('demo crew and fleet', () => {
  it('has an owner, two pilots, a coach and a viewer with distinct example.com addresses', () => {
    // RFC 2606 reserves example.com, so the demo never mails a real person.
    expect(demoTeam.name).toBe('Tern Field Flyers');
    expect(demoMembers.map((m) => m.role).sort()).toEqual([
      'coach',
      'owner',
      'pilot',
      'pilot',
      'viewer',
    ]);
    for (const m of demoMembers) expect(m.email).toMatch(/^[a-z.-]+@example\.com$/);
    expect(new Set(demoMembers.map((m) => m.email)).size).toBe(demoMembers.length);
    expect(new Set(demoMembers.map((m) => m.key)).size).toBe(demoMembers.length);
  });

  it('has Kite, Heron and Osprey with airframes the shared schema accepts', () => {
    expect(demoFleet.map((a) => a.name)).toEqual(['Kite', 'Heron', 'Osprey']);
    for (const a of demoFleet) expect(() => Airframe.parse(a.airframe)).not.toThrow();
    expect(demoAircraft('kite').airframe.motors).toHaveLength(4);
    expect(demoAircraft('osprey').airframe.motors).toHaveLength(6);
    // Heron is wide-front: its front motors are expected to carry less (tests/REFERENCES.md §5.3).
    const s = expectedHoverShares(demoAircraft('heron').airframe);
    expect(s[1]! / s[0]!).toBeCloseTo(1.2, 9);
    expect(() => demoAircraft('albatross')).toThrow(/no demo aircraft/);
  });
});

describe('demo flights', () => {
  it('are about fifteen flights over several weeks, in date order, flown by pilots', () => {
    expect(demoFlights.length).toBeGreaterThanOrEqual(14);
    demoFlights.forEach((f, i) => {
      expect(f.index).toBe(i);
      expect(['pilot', 'owner', 'tuner']).toContain(member(f.pilot)?.role);
      expect(f.seconds).toBeGreaterThanOrEqual(20);
      expect(f.seconds).toBeLessThanOrEqual(40);
      expect(f.rateHz).toBeGreaterThanOrEqual(500);
      expect(f.rateHz).toBeLessThanOrEqual(1000);
      if (i > 0) expect(Date.parse(f.date)).toBeGreaterThan(Date.parse(demoFlights[i - 1]!.date));
    });
    const spanDays =
      (Date.parse(demoFlights.at(-1)!.date) - Date.parse(demoFlights[0]!.date)) / 86_400_000;
    expect(spanDays).toBeGreaterThan(21);
    expect(new Set(demoFlights.map((f) => f.seed)).size).toBe(demoFlights.length);
    expect(new Set(demoFlights.map((f) => f.fileName)).size).toBe(demoFlights.length);
  });

  it('keeps Kite’s motor 3 healthy for three flights, then wears it flight after flight until the service log replaces it', () => {
    const swap = demoServiceLog.find((e) => e.aircraft === 'kite' && e.motor === 3)!;
    expect(swap.kind).toBe('part-swap');
    const kite = demoFlights.filter((f) => f.aircraft === 'kite');
    const before = kite.filter((f) => f.date < swap.date).map((f) => efficiencyOf(f.index));
    const after = kite.filter((f) => f.date > swap.date).map((f) => efficiencyOf(f.index));
    // Three flights within a point of healthy give drift its baseline before the wear shows.
    before.slice(0, 3).forEach((e) => expect(e).toBeGreaterThanOrEqual(0.99));
    for (let i = 1; i < before.length; i++) expect(before[i]!).toBeLessThanOrEqual(before[i - 1]!);
    const worn = before.slice(3);
    expect(worn.length).toBeGreaterThanOrEqual(2);
    expect(worn[0]!).toBeLessThan(0.95);
    for (let i = 1; i < worn.length; i++) expect(worn[i]!).toBeLessThan(worn[i - 1]!);
    expect(before.at(-1)!).toBeLessThan(0.9);
    expect(after.length).toBeGreaterThan(0);
    after.forEach((e) => expect(e).toBe(1));
  });

  it('moves Heron’s CG forward only after the camera swap', () => {
    const swap = demoServiceLog.find((e) => e.aircraft === 'heron' && e.kind === 'part-swap')!;
    for (const f of demoFlights.filter((x) => x.aircraft === 'heron')) {
      const cg = f.faults.find((x) => x.kind === 'cg-offset');
      const dx = cg && cg.kind === 'cg-offset' ? cg.dxMm : 0;
      if (f.date < swap.date) expect(dx).toBe(0);
      else expect(dx).toBeGreaterThan(0);
    }
  });

  it('gives Osprey a frame resonance only after the arm repair', () => {
    const repair = demoServiceLog.find((e) => e.aircraft === 'osprey' && e.kind === 'repair')!;
    for (const f of demoFlights.filter((x) => x.aircraft === 'osprey')) {
      const has = f.faults.some((x) => x.kind === 'frame-resonance');
      expect(has).toBe(f.date > repair.date);
    }
  });

  it('synthesises a worn-motor Kite flight where motor 3 works harder by 1/√efficiency', () => {
    const worn = demoFlights[10]!;
    const { log, truth } = demoFlightLog(worn);
    expect(log.metadata.aircraft).toBe('Kite');
    expect(log.metadata.pilot).toBe(member(worn.pilot)!.name);
    expect(log.durationS).toBe(worn.seconds);
    const out = hoverOutputs(log, truth);
    const others = (out[0]! + out[1]! + out[3]!) / 3;
    expect(out[2]! / others).toBeCloseTo(1 / Math.sqrt(efficiencyOf(10)), 2);
  });

  it('synthesises a post-swap Heron flight whose CG from the thrusts sits forward', () => {
    const f = demoFlights[7]!;
    const { log, truth } = demoFlightLog(f);
    const t = hoverThrusts(log, truth);
    const total = t.reduce((a, b) => a + b, 0);
    const xc = truth.airframe.motors.reduce((s, m, i) => s + m.x * t[i]!, 0) / total;
    expect(Math.abs(xc - 14)).toBeLessThan(1);
  });

  it('synthesises a post-repair Osprey flight with a 140 Hz line on the gyro', () => {
    const { log, truth } = demoFlightLog(demoFlights[9]!);
    expect(log.channels).toContain('imotor6');
    const [a, b] = hoverRows(log, truth)[1]!;
    const g = col(log, 'gyro_y');
    const band = (hz: number) => {
      let s = 0;
      for (let f = hz - 3; f <= hz + 3; f += 0.5) s += tonePower(g, a, b, f, log.sampleRateHz);
      return s;
    };
    expect(band(140) / band(115)).toBeGreaterThan(10);
  });

  it('is the same log every time', () => {
    const f = demoFlights[14]!;
    const a = demoFlightLog(f).log;
    const b = demoFlightLog(f).log;
    for (const c of a.channels) expect(b.columns[c]).toEqual(a.columns[c]);
  });
});

describe('demo comments and service log', () => {
  it('pins coach comments inside the phases they talk about', () => {
    expect(demoComments.length).toBeGreaterThanOrEqual(5);
    for (const c of demoComments) {
      const f = demoFlights[c.flight];
      expect(f).toBeDefined();
      expect(member(c.author)).toBeDefined();
      expect(c.tS).toBeGreaterThan(0);
      expect(c.tS).toBeLessThan(f!.seconds);
      const phase = buildPhases(f!.seconds).find((p) => c.tS >= p.t0 && c.tS < p.t1)!;
      expect(phase.kind).not.toBe('idle');
      for (const m of c.mentions ?? []) {
        expect(member(m)).toBeDefined();
        expect(c.body).toContain(`@${m}`);
      }
      for (const r of c.replies ?? []) expect(member(r.author)).toBeDefined();
    }
    expect(demoComments.some((c) => member(c.author)!.role === 'coach')).toBe(true);
  });

  it('has service entries by members on fleet aircraft, within the season', () => {
    for (const e of demoServiceLog) {
      expect(() => demoAircraft(e.aircraft)).not.toThrow();
      expect(member(e.author)).toBeDefined();
      expect(Number.isNaN(Date.parse(e.date))).toBe(false);
    }
  });
});
