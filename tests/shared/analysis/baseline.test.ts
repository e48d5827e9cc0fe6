import { describe, expect, it } from 'vitest';
import {
  cutWords,
  judgeAgainst,
  latestConfigChange,
  selectBaseline,
} from '../../../shared/analysis/baseline';
import type { BaselineCut, BaselineFlight, DriftSample } from '../../../shared/schemas/baseline';
import { defaultThresholds } from '../../../shared/schemas/thresholds';

const sample = (over: Partial<DriftSample> = {}): DriftSample => ({
  hoverS: 20,
  deviationPct: [0.5, -0.4, 0.2, -0.3],
  asymmetryPct: 0.4,
  cg: { xMm: 1, yMm: -1 },
  bandRms: { gyro_x: 2 },
  internalResistanceOhm: 0.02,
  lagMs: { roll: 4, pitch: 4, yaw: 6 },
  ...over,
});
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const flight = (n: number, day: string, over: Partial<DriftSample> = {}): BaselineFlight => ({
  flightId: id(n),
  recordedAt: `${day}T10:00:00.000Z`,
  sample: sample(over),
});
const entry = (date: string, kind: BaselineCut['kind'], motor: number | null = null) => ({
  date,
  kind,
  motor,
  note: 'work done',
});

describe('the latest configuration change before a flight', () => {
  const log = [
    entry('2026-11-20', 'prop-change'),
    entry('2026-11-28', 'inspection'),
    entry('2026-12-02', 'part-swap', 3),
    entry('2026-12-05', 'repair'),
  ];
  it('skips inspections and entries after the flight’s day, and counts the same day', () => {
    expect(latestConfigChange(log, '2026-12-01T12:00:00Z')?.kind).toBe('prop-change');
    expect(latestConfigChange(log, '2026-12-02T08:00:00Z')).toMatchObject({ kind: 'part-swap' });
    expect(latestConfigChange(log, '2026-12-04T08:00:00Z')?.date).toBe('2026-12-02');
    expect(latestConfigChange(log, '2026-11-01T08:00:00Z')).toBeNull();
  });
  it('names the change in words, with the year only when it differs', () => {
    expect(cutWords(log[2]!, '2026-12-03T00:00:00Z')).toBe('the motor 3 swap on 2 Dec');
    expect(cutWords(log[0]!, '2027-01-03T00:00:00Z')).toBe('the prop change on 20 Nov 2026');
  });
});

describe('choosing the baseline flights', () => {
  const flights = [
    flight(1, '2026-11-25'),
    flight(2, '2026-11-30'),
    flight(3, '2026-12-02'),
    flight(4, '2026-12-02', { hoverS: 1 }),
    flight(5, '2026-12-03'),
    flight(6, '2026-12-04'),
    flight(7, '2026-12-06'),
  ];
  const th = { ...defaultThresholds, driftMaxFlights: 10, minHoverForVerdictS: 4 };

  it('keeps earlier flights since the cut with enough hover, oldest first, and counts the short ones', () => {
    const cut = entry('2026-12-02', 'part-swap', 3);
    const r = selectBaseline(
      flights,
      { beforeIso: '2026-12-06T10:00:00Z', excludeId: id(7), cut },
      th,
    );
    expect(r.flights.map((f) => f.flightId)).toEqual([id(3), id(5), id(6)]);
    expect(r.shortHover).toBe(1);
  });

  it('is bounded by the team’s most flights, taking the most recent', () => {
    const r = selectBaseline(
      flights,
      { beforeIso: '2026-12-07T00:00:00Z', cut: null },
      { ...th, driftMaxFlights: 3 },
    );
    expect(r.flights.map((f) => f.flightId)).toEqual([id(5), id(6), id(7)]);
  });

  it('never counts the flight itself or later flights', () => {
    const r = selectBaseline(
      flights,
      { beforeIso: '2026-12-03T10:00:00Z', excludeId: id(5), cut: null },
      th,
    );
    expect(r.flights.map((f) => f.flightId)).toEqual([id(1), id(2), id(3)]);
  });
});

describe('judging a flight against its baseline', () => {
  const base = [1, 2, 3, 4].map((n) =>
    flight(n, `2026-12-0${n}`, { deviationPct: [0.5 + n * 0.05, -0.4, 0.2, -0.3] }),
  );
  it('says what it compared with, and finds a motor that moved beyond its spread', () => {
    const now = sample({ deviationPct: [0.6, 3.4, 0.2, -0.3] });
    const r = judgeAgainst(
      now,
      '2026-12-05T10:00:00Z',
      {
        aircraftName: 'Kite',
        since: entry('2026-12-01', 'part-swap', 3),
        flights: base,
        shortHover: 0,
      },
      defaultThresholds,
    );
    expect(r.kind).toBe('compared');
    if (r.kind !== 'compared') return;
    expect(r.against).toBe('Kite’s last 4 flights, since the motor 3 swap on 1 Dec');
    expect(r.findings.map((f) => [f.code, f.motor])).toEqual([['motor-drift', 2]]);
    // Worked by hand from the definition (shared/README.md §7.3): 3.4 − (−0.4) = 3.8 points,
    // past motorDriftPts 1.5 (common practice, shared/schemas/thresholds.ts).
    expect(r.drift.motors[1]!.changePts).toBeCloseTo(3.8, 5);
  });

  it('says why there is no drift when too few flights qualify', () => {
    const r = judgeAgainst(
      sample(),
      '2026-12-05T10:00:00Z',
      { aircraftName: 'Kite', since: null, flights: base.slice(0, 2), shortHover: 3 },
      defaultThresholds,
      'kept on this device',
    );
    expect(r).toEqual({
      kind: 'none',
      reason:
        'No drift: Kite has 2 earlier flights with enough hover kept on this device (3 more had under 4 s of hover); it takes 3.',
    });
  });
});
