import { describe, expect, it } from 'vitest';
import type { TrendPoint } from '../../../../../shared/schemas/aircraft';
import { defaultThresholds } from '../../../../../shared/schemas/thresholds';
import { driftMarks } from '../../../../../src/features/aircraft/model/drift-marks';

const point = (day: number, motor3: number, hoverS = 20): TrendPoint => ({
  flightId: `00000000-0000-4000-8000-0000000000${String(day).padStart(2, '0')}`,
  recordedAt: `2026-11-${String(day).padStart(2, '0')}T10:00:00.000Z`,
  deviationPct: [0.2, -0.1, motor3, -0.2],
  asymmetryPct: 0.3,
  cg: null,
  bandRms: { gyro_x: 2 },
  sagCellV: 0.3,
  minCellV: 3.6,
  internalResistanceOhm: 0.02,
  saturationS: 0,
  worstSeverity: null,
  hoverS,
  lagMs: null,
});

describe('trend marks for flights that raised drift', () => {
  it('marks the flight whose motor moved beyond its spread, not the healthy ones', () => {
    const points = [point(1, 0.1), point(2, 0.2), point(3, 0.15), point(4, 0.1), point(5, 2.4)];
    const marks = driftMarks(points, [], defaultThresholds);
    expect(marks.map((m) => [m.recordedAt.slice(0, 10), m.codes, m.motors])).toEqual([
      ['2026-11-05', ['motor-drift'], [3]],
    ]);
  });

  it('starts again after a configuration change, so a swap is not drift', () => {
    const points = [point(1, 0.1), point(2, 0.2), point(3, 0.15), point(5, 2.4), point(6, 2.5)];
    const swap = { date: '2026-11-04', kind: 'part-swap' as const, motor: 3, note: 'new motor' };
    expect(driftMarks(points, [swap], defaultThresholds)).toEqual([]);
  });
});
