import { describe, expect, it } from 'vitest';
import { defaultQuadX, presetAirframe } from '../../../shared/airframe/presets';
import { analyzeFlight } from '../../../shared/analysis/analyze-flight';
import { Airframe } from '../../../shared/schemas/airframe';
import { ReviewDetailLoose } from '../../../shared/schemas/flights';
import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';
import {
  lttbIndices,
  STRIP_POINTS,
  stripTrace,
  type Trace,
} from '../../../shared/analysis/review-detail';

describe('lttbIndices', () => {
  it('keeps every index when there are no more points than asked for (empty, one, few)', () => {
    expect(lttbIndices([], [[]], 10)).toEqual([]);
    expect(lttbIndices([0], [[1]], 10)).toEqual([0]);
    expect(lttbIndices([0, 1, 2], [[1, 2, 3]], 3)).toEqual([0, 1, 2]);
  });

  it('picks the point of the largest triangle in a worked example', () => {
    // Worked by hand from the algorithm's definition (Steinarsson 2013, ch. 4.2): one middle
    // bucket {1, 2, 3}, the next bucket's mean is (4, 0), the previous pick (0, 0); triangle
    // areas are 2·|y_i|, so the spike at index 1 wins.
    expect(lttbIndices([0, 1, 2, 3, 4], [[0, 5, 0, 1, 0]], 3)).toEqual([0, 1, 4]);
  });

  it('keeps first and last, stays within the budget and in time order', () => {
    const n = 10_000;
    const t = Array.from({ length: n }, (_, i) => i / 100);
    const y = t.map((v) => Math.sin(v));
    const idx = lttbIndices(t, [y], 500);
    expect(idx.length).toBe(500);
    expect(idx[0]).toBe(0);
    expect(idx.at(-1)).toBe(n - 1);
    for (let i = 1; i < idx.length; i++) expect(idx[i]!).toBeGreaterThan(idx[i - 1]!);
  });

  it('keeps a one-sample spike of either series on their shared time axis', () => {
    const n = 8000;
    const t = Array.from({ length: n }, (_, i) => i);
    const a = new Array<number>(n).fill(0.5);
    const b = new Array<number>(n).fill(0.2);
    a[3001] = 1;
    b[6007] = 0;
    const idx = lttbIndices(t, [a, b], 200);
    expect(idx).toContain(3001);
    expect(idx).toContain(6007);
  });

  it('prefers a real value over a missing one (NaN) in the same bucket', () => {
    const t = [0, 1, 2, 3, 4];
    expect(lttbIndices(t, [[0, NaN, 0.1, NaN, 0]], 3)).toEqual([0, 2, 4]);
  });
});

describe('stripTrace', () => {
  const effort = (n: number): Trace => {
    const t = Array.from({ length: n }, (_, i) => i / 50);
    return {
      t,
      series: {
        throttle: t.map((v) => 0.4 + 0.1 * Math.sin(v)),
        collective: t.map((v) => 0.35 + 0.1 * Math.cos(v)),
        motor1: t.map(() => 0.5),
      },
    };
  };

  it('thins throttle and collective to the strip budget on one time axis, other series left out', () => {
    const s = stripTrace(effort(4000));
    expect(s.t.length).toBe(STRIP_POINTS);
    expect(Object.keys(s.series).sort()).toEqual(['collective', 'throttle']);
    expect(s.series.throttle!.length).toBe(STRIP_POINTS);
    expect(s.series.collective!.length).toBe(STRIP_POINTS);
    expect(s.t[0]).toBe(0);
    expect(s.t.at(-1)).toBeCloseTo(3999 / 50, 10);
  });

  it('survives a trace without throttle and a JSON round trip', () => {
    const e = effort(3000);
    delete e.series.throttle;
    const s = stripTrace(e, 100);
    expect(Object.keys(s.series)).toEqual(['collective']);
    expect(JSON.parse(JSON.stringify(s))).toEqual(s);
  });
});

describe('the airframe in the detail', () => {
  const flight = () => simulate(scenarios['clean-quad-x']!, { seed: 4, seconds: 15 });

  it('carries the airframe the analysis was given', () => {
    const { log } = flight();
    const heron = presetAirframe('wide-front-x', { name: 'Heron' });
    const { report, detail } = analyzeFlight(log, { airframe: heron });
    expect(detail.airframe).toEqual(heron);
    expect(report.airframe).toEqual({ name: 'Heron', assumed: false });
  });

  it('carries the preset it assumed when none was given, as the report says', () => {
    const { log } = flight();
    const { report, detail } = analyzeFlight(log);
    expect(report.airframe.assumed).toBe(true);
    expect(detail.airframe).toEqual(defaultQuadX);
    expect(Airframe.safeParse(detail.airframe).success).toBe(true);
  });

  it('passes the server’s loose detail check and keeps the airframe through JSON', () => {
    const { log } = flight();
    const { detail } = analyzeFlight(log, { airframe: scenarios['clean-quad-x']!.airframe });
    const stored = ReviewDetailLoose.parse(JSON.parse(JSON.stringify(detail)));
    expect(stored.airframe).toEqual(scenarios['clean-quad-x']!.airframe);
    // A detail stored by an earlier version, without one, is still accepted.
    const { airframe: _none, ...older } = detail;
    expect(ReviewDetailLoose.safeParse(JSON.parse(JSON.stringify(older))).success).toBe(true);
  });
});
