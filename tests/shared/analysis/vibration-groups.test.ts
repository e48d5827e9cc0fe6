import { describe, expect, it } from 'vitest';
import {
  distinctLines,
  groupPeaks,
  sameLine,
  type GroupablePeak,
} from '../../../shared/analysis/vibration-groups';

// The bin width of 256-sample segments at 1000 Hz (tests/REFERENCES.md §2.2: Δf = 3.90625 Hz).
const df = 3.90625;
const peak = (p: Partial<GroupablePeak> & { channel: string; hz: number; db: number }) =>
  ({ label: null, ...p }) as GroupablePeak;

// The peaks below are made up for these cases, and every expectation is our own rule, defined
// in shared/analysis/vibration-groups.ts (which peaks share a cause, and in what order).
describe('grouping vibration peaks by cause', () => {
  it('puts one motor’s once-per-turn line at several speeds and axes, and its 2×, in one group', () => {
    const peaks = [
      peak({ channel: 'gyro_x', hz: 189, db: 12, label: 'rotor-1x', motor: 2 }),
      peak({ channel: 'gyro_y', hz: 189, db: 11.8, label: 'rotor-1x', motor: 2 }),
      peak({ channel: 'gyro_x', hz: 321, db: -3, label: 'rotor-1x', motor: 2 }),
      peak({ channel: 'acc_x', hz: 173, db: -17, label: 'rotor-1x', motor: 2 }),
      peak({ channel: 'gyro_z', hz: 378, db: -8, label: 'rotor-2x', motor: 2 }),
    ];
    const causes = groupPeaks(peaks, df);
    expect(causes).toHaveLength(1);
    const c = causes[0]!;
    expect(c).toMatchObject({
      key: 'rotor:2',
      kind: 'rotor',
      motors: [2],
      orders: ['rotor-1x', 'rotor-2x'],
      hzRange: [173, 378],
    });
    expect(c.channels).toEqual(['gyro_x', 'gyro_y', 'gyro_z', 'acc_x']);
    expect(c.members.map((m) => m.db)).toEqual([12, 11.8, -3, -8, -17]);
    // The 189 Hz line on two axes is one line.
    expect(distinctLines(c, df).map((m) => m.hz)).toEqual([173, 189, 321, 378]);
  });

  it('keeps different motors, and a rotor line from a frame mode, apart', () => {
    const causes = groupPeaks(
      [
        peak({ channel: 'gyro_x', hz: 189, db: 12, label: 'rotor-1x', motor: 2 }),
        peak({ channel: 'gyro_x', hz: 195, db: 4, label: 'rotor-1x', motor: 1 }),
        peak({ channel: 'gyro_x', hz: 290, db: 0, label: 'frame' }),
        peak({ channel: 'gyro_y', hz: 291, db: -0.4, label: 'frame' }),
      ],
      df,
    );
    expect(causes.map((c) => c.key)).toEqual(['rotor:2', 'rotor:1', 'frame:290']);
    expect(causes[2]!.channels).toEqual(['gyro_x', 'gyro_y']);
  });

  it('two frame modes at different frequencies are two causes; the same mode on two axes is one', () => {
    const causes = groupPeaks(
      [
        peak({ channel: 'gyro_x', hz: 140, db: 3, label: 'frame' }),
        peak({ channel: 'gyro_y', hz: 142, db: 2, label: 'frame' }),
        peak({ channel: 'gyro_x', hz: 290, db: 1, label: 'frame' }),
      ],
      df,
    );
    expect(causes.map((c) => [c.key, c.members.length])).toEqual([
      ['frame:140', 2],
      ['frame:290', 1],
    ]);
  });

  it('a motor named alone joins the set it was a candidate of, and the group keeps the narrower name', () => {
    const causes = groupPeaks(
      [
        peak({ channel: 'gyro_x', hz: 189, db: 10, label: 'rotor-1x', candidates: [2, 4] }),
        peak({ channel: 'gyro_y', hz: 321, db: 5, label: 'rotor-1x', motor: 2 }),
        peak({ channel: 'gyro_x', hz: 560, db: 1, label: 'blade-pass' }),
      ],
      df,
    );
    expect(causes.map((c) => [c.key, c.motors, c.members.length])).toEqual([
      ['rotor:2', [2], 2],
      ['rotor:any', [], 1],
    ]);
  });

  // aliasOfHz marks a line folded down from the motors' electrical frequency (folding as in
  // tests/REFERENCES.md §3); here it is set by hand, so only the grouping is under test.
  it('gathers the motors’ folded electrical lines into one cause and other lines by frequency', () => {
    const causes = groupPeaks(
      [
        peak({ channel: 'gyro_x', hz: 410, db: 2, aliasOfHz: 1590 }),
        peak({ channel: 'gyro_y', hz: 380, db: 1, aliasOfHz: 1620 }),
        peak({ channel: 'gyro_x', hz: 95, db: 0 }),
        peak({ channel: 'gyro_z', hz: 96, db: -1 }),
      ],
      df,
    );
    expect(causes.map((c) => [c.key, c.members.length])).toEqual([
      ['electrical', 2],
      ['line:95', 2],
    ]);
  });

  // Three bins or 3 %: our own rule (sameLine in shared/analysis/vibration-groups.ts), the
  // tolerance the peak labelling uses; each pair sits just inside and just outside it.
  it('tells lines apart at three bins or 3 %, whichever is wider', () => {
    expect(sameLine(100, 100 + 3 * df, df)).toBe(true);
    expect(sameLine(100, 100 + 3 * df + 0.1, df)).toBe(false);
    expect(sameLine(1000, 1029, df)).toBe(true);
    expect(sameLine(1000, 1032, df)).toBe(false);
  });

  it('returns nothing for no peaks', () => {
    expect(groupPeaks([], df)).toEqual([]);
  });
});
