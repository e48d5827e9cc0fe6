import { describe, expect, it } from 'vitest';
import { findSegments, rangeLength } from '../../../shared/analysis/segments';
import { defaultThresholds } from '../../../shared/schemas/thresholds';
import { downsampleMinMax } from '../../../shared/analysis/downsample';
import type { ParsedLog } from '../../../shared/log/types';

const fs = 500;

/** A scripted flight: [from s, to s, output, roll rate deg/s]. */
function scripted(parts: [number, number, number, number][]): ParsedLog {
  const end = parts[parts.length - 1]![1];
  const rows = Math.round(end * fs);
  const time = Float64Array.from({ length: rows }, (_, i) => i / fs);
  const motors = [0, 1, 2, 3].map(() => new Float32Array(rows));
  const gx = new Float32Array(rows);
  const gy = new Float32Array(rows);
  const gz = new Float32Array(rows);
  for (let i = 0; i < rows; i++) {
    const t = i / fs;
    const p = parts.find(([a, b]) => t >= a && t < b)!;
    // rotor vibration on the gyro averages out in 50 ms blocks
    const buzz = 8 * Math.sin(2 * Math.PI * 180 * t);
    motors.forEach((m) => (m[i] = p[2]));
    gx[i] = p[3] + buzz;
    gy[i] = buzz;
    gz[i] = 0;
  }
  const columns: ParsedLog['columns'] = { time, gyro_x: gx, gyro_y: gy, gyro_z: gz };
  motors.forEach((m, k) => (columns[`motor${k + 1}`] = m));
  return {
    channels: Object.keys(columns),
    columns,
    rows,
    sampleRateHz: fs,
    durationS: end,
    metadata: {},
    warnings: [],
  };
}

describe('segments', () => {
  const log = scripted([
    [0, 2, 0, 0], // disarmed
    [2, 3, 0.05, 0], // armed at idle on the ground
    [3, 10, 0.4, 0], // hover
    [10, 12, 0.5, 250], // roll
    [12, 12.6, 0.4, 0], // too short to count as hover
    [12.6, 13, 0.5, -250],
    [13, 20, 0.42, 0], // hover
    [20, 22, 0, 0], // disarmed
  ]);
  const seg = findSegments(log, defaultThresholds);
  const sec = (r: [number, number][]) => rangeLength(r) / fs;

  // The definition under test is the design's (shared/README.md §6: hover = steady body rates and
  // collective for at least 1 s); the rate and collective limits behind it are common practice,
  // each explained where it is defined (shared/schemas/thresholds.ts).
  it('finds the two hovers and not the short calm moment between flips', () => {
    expect(seg.hover.length).toBe(2);
    expect(seg.hover[0]![0] / fs).toBeCloseTo(3, 0);
    expect(seg.hover[1]![1] / fs).toBeCloseTo(20, 0);
    expect(Math.abs(seg.hoverS - 14)).toBeLessThan(1.2);
  });

  // Armed 2 → 20 s and 3 s of rolls, read off the script above; the allowances are this test's.
  it('counts armed time from idle spin-up to disarm, and idle on the ground', () => {
    expect(Math.abs(sec(seg.armed) - 18)).toBeLessThan(0.1);
    expect(seg.idle.some(([a, b]) => a / fs <= 2.05 && b / fs >= 2.95)).toBe(true);
    expect(Math.abs(sec(seg.manoeuvre) - 3)).toBeLessThan(0.7);
  });

  it('returns nothing armed for a log of stopped motors, and copes with one sample', () => {
    const idle = findSegments(scripted([[0, 5, 0, 0]]), defaultThresholds);
    expect(idle.armed).toEqual([]);
    expect(idle.hoverS).toBe(0);
    const one = scripted([[0, 0.002, 0.4, 0]]);
    expect(findSegments(one, defaultThresholds).hover).toEqual([]);
  });
});

describe('min/max downsampling for charts', () => {
  it('keeps every spike and stays under the point budget', () => {
    const n = 100_000;
    const t = Float64Array.from({ length: n }, (_, i) => i);
    const v = new Float32Array(n);
    v[54_321] = 9;
    v[77_777] = -4;
    const tr = downsampleMinMax(t, { v }, 1000);
    expect(tr.t.length).toBeLessThanOrEqual(1000);
    expect(Math.max(...tr.series.v!)).toBe(9);
    expect(Math.min(...tr.series.v!)).toBe(-4);
  });

  it('passes short series through unchanged', () => {
    const tr = downsampleMinMax([0, 1, 2], { a: [5, 6, 7] }, 1000);
    expect(tr).toEqual({ t: [0, 1, 2], series: { a: [5, 6, 7] } });
  });
});
