import { describe, expect, it } from 'vitest';
import {
  monthLabel,
  monthStarts,
  trendAxes,
  trendValueRange,
} from '../../../../../src/features/aircraft/model/trend-axis';

const day = (y: number, m: number, d: number) => new Date(y, m - 1, d, 12).getTime();

describe('trend value range', () => {
  it('widens a noisy, steady series to the minimum span, centred, on round numbers', () => {
    // Deviations of 1.1 to 1.9 % would fill an auto-scaled axis; with a 6-point minimum they sit
    // in the middle of −1.5 … 4.5, which the step of 1 rounds out to −2 … 5.
    expect(trendValueRange([1.1, 1.9, 1.4, null], 6)).toEqual({ min: -2, max: 5 });
  });

  it('leaves the axis to the chart when the data already spans the minimum', () => {
    expect(trendValueRange([0, 7], 6)).toBeUndefined();
    expect(trendValueRange([null, NaN], 6)).toBeUndefined();
  });

  it('keeps decimal steps free of binary noise', () => {
    // 0.2 V minimum, step 0.05: 3.71 … 3.74 becomes 3.6 … 3.85 with no 3.6000000000000005.
    const r = trendValueRange([3.71, 3.74], 0.2)!;
    expect(r.min).toBe(3.6);
    expect(r.max).toBe(3.85);
    expect(r.max - r.min).toBeGreaterThanOrEqual(0.2);
  });
});

describe('month boundaries', () => {
  it('names every month boundary between the first and last flight', () => {
    const starts = monthStarts(day(2026, 10, 20), day(2027, 2, 3));
    expect(starts).toEqual([
      new Date(2026, 10, 1).getTime(),
      new Date(2026, 11, 1).getTime(),
      new Date(2027, 0, 1).getTime(),
      new Date(2027, 1, 1).getTime(),
    ]);
    expect(starts.map((t, i) => monthLabel(t, i === 0))).toEqual([
      'Nov 2026',
      'Dec',
      'Jan 2027',
      'Feb',
    ]);
  });

  it('has none inside one month', () => {
    expect(monthStarts(day(2026, 12, 2), day(2026, 12, 28))).toEqual([]);
  });

  it('puts the time axis ticks and labels on those boundaries', () => {
    const axes = trendAxes(
      [
        {
          points: [
            [day(2026, 9, 28), 1],
            [day(2026, 12, 2), 2],
          ],
        },
      ],
      6,
    );
    const x = axes.x as { axisLabel: { customValues?: number[] }; min: number; max: number };
    // October, November and December begin between 28 September and 2 December.
    expect(x.axisLabel.customValues).toEqual(
      [9, 10, 11].map((m) => new Date(2026, m, 1).getTime()),
    );
    expect(x.min).toBeLessThan(day(2026, 9, 28));
    expect(x.max).toBeGreaterThan(day(2026, 12, 2));
    expect(axes.y).toEqual({ min: -2, max: 5 });
  });
});
