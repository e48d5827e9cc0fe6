import { describe, expect, it } from 'vitest';
import { describeDifferences } from '../../../src/features/compare/model/compare-words';
import { sampleReport } from '../helpers/flight-fixture';

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

  it('calls a deviation that grows in size a rise, whichever its sign', () => {
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
      'Motor 3 deviation rose from −1 % to −6 %.',
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
