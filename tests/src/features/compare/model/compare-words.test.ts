import { describe, expect, it } from 'vitest';
import { defaultQuadX, presetAirframe } from '../../../../../shared/airframe/presets';
import {
  describeDifferences,
  describeGeometryChange,
} from '../../../../../src/features/compare/model/compare-words';
import { sampleReport } from '../../../helpers/flight-fixture';

const quiet = { findings: [] };

describe('compare in words', () => {
  it('says how a motor deviation moved, with signs and rounded percent', () => {
    const before = sampleReport({
      ...quiet,
      balance: {
        expectedShare: [0.25, 0.25, 0.25, 0.25],
        measuredShare: [0.25, 0.25, 0.25, 0.25],
        deviationPct: [0.2, -0.4, 9.2, -0.1],
      },
    });
    const after = sampleReport({
      ...quiet,
      balance: {
        expectedShare: [0.25, 0.25, 0.25, 0.25],
        measuredShare: [0.25, 0.25, 0.25, 0.25],
        deviationPct: [0.1, -0.2, 1.1, 0.3],
      },
    });
    const lines = describeDifferences(before, after);
    expect(lines).toContain('Motor 3 deviation fell from +9 % to +1 %.');
    expect(lines.filter((l) => l.startsWith('Motor'))).toHaveLength(1);
  });

  it('words a change by its sign: a deviation going more negative fell', () => {
    const before = sampleReport({
      ...quiet,
      balance: {
        expectedShare: [0.25, 0.25, 0.25, 0.25],
        measuredShare: [0.25, 0.25, 0.25, 0.25],
        deviationPct: [0, 0, -1, 0],
      },
    });
    const after = sampleReport({
      ...quiet,
      balance: {
        expectedShare: [0.25, 0.25, 0.25, 0.25],
        measuredShare: [0.25, 0.25, 0.25, 0.25],
        deviationPct: [0, 0, -6, 0],
      },
    });
    expect(describeDifferences(before, after)).toContain(
      'Motor 3 deviation fell from −1 % to −6 %.',
    );
  });

  it('says a deviation from nothing to −8 % fell, and one crossing zero moved', () => {
    const report = (d: number[]) =>
      sampleReport({
        ...quiet,
        balance: {
          expectedShare: [0.25, 0.25, 0.25, 0.25],
          measuredShare: [0.25, 0.25, 0.25, 0.25],
          deviationPct: d,
        },
      });
    expect(describeDifferences(report([0, 0, 0, 0]), report([0, 0, -8, 0]))).toContain(
      'Motor 3 deviation fell from 0 % to −8 %.',
    );
    expect(describeDifferences(report([0, 4, 0, 0]), report([0, -5, 0, 0]))).toContain(
      'Motor 2 deviation moved from +4 % to −5 %.',
    );
  });

  it('states the CG move in millimetres and its direction', () => {
    const before = sampleReport({ ...quiet, cg: { xMm: 0, yMm: 0 } });
    const after = sampleReport({ ...quiet, cg: { xMm: 12, yMm: 0 } });
    expect(describeDifferences(before, after)).toContain(
      'The estimated CG moved 12.0 mm forward (now x 12.0 mm, y 0.0 mm).',
    );
  });

  it('does not compare balance across different motor counts', () => {
    const before = sampleReport({ ...quiet });
    const after = sampleReport({
      ...quiet,
      motorCount: 6,
      balance: {
        expectedShare: Array(6).fill(1 / 6),
        measuredShare: Array(6).fill(1 / 6),
        deviationPct: [20, 0, 0, 0, 0, 0],
      },
    });
    const lines = describeDifferences(before, after);
    expect(lines[0]).toContain('different motor counts (4 and 6)');
    expect(lines.some((l) => l.startsWith('Motor'))).toBe(false);
  });

  it('says so when nothing moved beyond flight-to-flight noise', () => {
    const a = sampleReport(quiet);
    expect(describeDifferences(a, sampleReport(quiet))).toEqual([
      'No difference above flight-to-flight noise in balance, torque split, CG, vibration or sag.',
    ]);
  });
});

describe('compare: the geometry each flight was judged against', () => {
  const kite = presetAirframe('quad-x', { name: 'Kite' });
  const heron = presetAirframe('wide-front-x', { name: 'Heron' });

  it('says so when the balance was judged against different geometry, naming both', () => {
    const line = describeGeometryChange(
      { airframe: defaultQuadX, assumed: true },
      { airframe: heron, assumed: false },
    );
    expect(line).toMatch(/different geometry/);
    expect(line).toContain(`${defaultQuadX.name} (assumed) before`);
    expect(line).toContain('Heron now');
  });

  it('stays quiet for the same geometry under another name, or when one is not known', () => {
    expect(
      describeGeometryChange(
        { airframe: kite, assumed: false },
        {
          airframe: { ...kite, name: 'Kite after repair', massG: kite.massG + 30 },
          assumed: false,
        },
      ),
    ).toBeNull();
    expect(
      describeGeometryChange(
        { airframe: null, assumed: false },
        { airframe: kite, assumed: false },
      ),
    ).toBeNull();
  });

  it('counts a moved design CG or a swapped spin as different geometry', () => {
    const movedCg = { ...kite, cg: { x: 4, y: 0 } };
    expect(
      describeGeometryChange(
        { airframe: kite, assumed: false },
        { airframe: movedCg, assumed: false },
      ),
    ).not.toBeNull();
    const swapped = {
      ...kite,
      motors: kite.motors.map((m) => ({
        ...m,
        spin: m.spin === 'cw' ? ('ccw' as const) : ('cw' as const),
      })),
    };
    expect(
      describeGeometryChange(
        { airframe: kite, assumed: false },
        { airframe: swapped, assumed: false },
      ),
    ).not.toBeNull();
  });
});
