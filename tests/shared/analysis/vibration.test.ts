import { describe, expect, it } from 'vitest';
import { analyseVibration, peakAmplitude } from '../../../shared/analysis/vibration';
import { attributeOrder } from '../../../shared/analysis/order-tracking';
import { benchFilters } from '../../../shared/analysis/filters/filter-bench';
import { welch } from '../../../shared/analysis/dsp/welch';
import type { ParsedLog } from '../../../shared/log/types';

const fs = 2000;
const seconds = 20;
const rows = fs * seconds;

/** Four rotors sweeping 6000 → 12000 rpm (motor 3 a little faster), a fixed 300 Hz mode, and an unbalance on motor 3. */
function sweepLog(): ParsedLog {
  const time = new Float64Array(rows);
  const rpm = [0, 1, 2, 3].map(() => new Float32Array(rows));
  const gyro = new Float32Array(rows);
  const acc = new Float32Array(rows);
  const phase = [0, 0, 0, 0];
  for (let i = 0; i < rows; i++) {
    const t = i / fs;
    time[i] = t;
    const base = 6000 + (6000 * t) / seconds;
    for (let m = 0; m < 4; m++) {
      const r = base * (m === 2 ? 1.08 : 1) * (1 + 0.01 * m);
      rpm[m]![i] = r;
      phase[m]! += (2 * Math.PI * r) / 60 / fs;
    }
    gyro[i] =
      4 * Math.sin(phase[2]!) + 3 * Math.sin(2 * Math.PI * 300 * t) + 0.3 * Math.sin(i * 1.7);
    acc[i] = 0.2 * Math.sin(phase[2]!);
  }
  const columns: ParsedLog['columns'] = { time, gyro_x: gyro, acc_x: acc };
  rpm.forEach((r, m) => (columns[`rpm${m + 1}`] = r));
  return {
    channels: Object.keys(columns),
    columns,
    rows,
    sampleRateHz: fs,
    durationS: seconds,
    metadata: {},
    warnings: [],
  };
}

describe('vibration analysis on a rotor sweep', () => {
  const log = sweepLog();
  const rpms = [1, 2, 3, 4].map((m) => log.columns[`rpm${m}`]!);
  const v = analyseVibration({
    log,
    ranges: [[0, rows]],
    rpms,
    collective: null,
    blades: 2,
    prominenceDb: 10,
  });

  it('builds a Campbell matrix binned by rpm with the rotor order lines', () => {
    const c = v.campbell!;
    expect(c.by).toBe('rpm');
    expect(c.rows.length).toBe(20);
    expect(c.db.every((row) => row.length === c.hz.length)).toBe(true);
    expect(c.rows[0]!).toBeLessThan(c.rows[19]!);
    expect(c.orders.map((o) => o.label)).toEqual(['rotor-1x', 'rotor-2x', 'blade-pass']);
    // In every row the loudest bin near the 300 Hz mode stays at 300 Hz.
    const k300 = Math.round(300 / (c.hz[1]! - c.hz[0]!));
    for (const row of c.db) expect(row[k300]!).toBeGreaterThan(row[k300 + 6]! + 10);
  });

  it('labels the fixed 300 Hz mode frame', () => {
    const frame = v.channels.gyro_x!.peaks.find((p) => Math.abs(p.hz - 300) < 2 * v.df);
    expect(frame?.label).toBe('frame');
  });

  it('traces the sweeping 1× tone to motor 3 by order tracking', () => {
    const gyro = [log.columns.gyro_x!];
    expect(attributeOrder(gyro, rpms, [[0, rows]], fs, 1).motor).toBe(3);
  });

  it('tells apart a diagonal pair that never differs by more than 2 Hz (only over longer windows)', () => {
    // Motors 2 and 4 spin the same way at nearly the same speed; rolling splits them by at most
    // 120 rpm (2 Hz), too little for a 0.25 s window to resolve. The unbalance is on motor 2;
    // every rotor adds a little 1× of its own.
    const f = 1000;
    const len = f * 30;
    const r = [0, 1, 2, 3].map(() => new Float32Array(len));
    const g = new Float32Array(len);
    const ph = [0, 0.7, 1.9, 2.6];
    for (let i = 0; i < len; i++) {
      const t = i / f;
      const split = 60 * Math.sin((2 * Math.PI * t) / 4);
      const speeds = [11600, 11000 + split, 11600, 11000 - split];
      g[i] = 0;
      for (let m = 0; m < 4; m++) {
        r[m]![i] = speeds[m]!;
        ph[m]! += (2 * Math.PI * speeds[m]!) / 60 / f;
        g[i]! += (m === 1 ? 3 : 0.4) * Math.sin(ph[m]!);
      }
    }
    const a = attributeOrder([g], r, [[0, len]], f, 1);
    expect(a).toMatchObject({ motor: 2, candidates: [2] });
  });

  it('measures a tone’s amplitude under its peak (Parseval over the main lobe)', () => {
    const x = Float32Array.from(
      { length: 40000 },
      (_, i) => 2.5 * Math.sin((2 * Math.PI * 123.4 * i) / fs),
    );
    const spec = welch(x, fs, { nperseg: 512 });
    const bin = Math.round(123.4 / spec.df);
    expect(peakAmplitude(spec, bin)).toBeCloseTo(2.5, 2);
  });
});

describe('vibration levels and their references', () => {
  // A gyro sine of amplitude A on a bin centre, plus a tiny ripple so the floor is not zero.
  // Sources (tests/REFERENCES.md §2.1, from scipy's `welch` docstring and Parseval): the mean
  // square of a sine is A²/2, and the one-sided density reads it spread over the window's
  // equivalent noise bandwidth, ENBW = 1.5·fs/nperseg for the periodic Hann window.
  const A = 3;
  const fsTone = 2000;
  const n = fsTone * 10;
  const df = fsTone / 512; // chooseSegment picks 512 at 2 kHz (bins of about 4 Hz)
  const f0 = 50 * df; // 195.3125 Hz, bin 50
  const gyro = Float32Array.from(
    { length: n },
    (_, i) => A * Math.sin((2 * Math.PI * f0 * i) / fsTone),
  );
  const log: ParsedLog = {
    channels: ['time', 'gyro_x'],
    columns: { time: Float64Array.from({ length: n }, (_, i) => i / fsTone), gyro_x: gyro },
    rows: n,
    sampleRateHz: fsTone,
    durationS: n / fsTone,
    metadata: {},
    warnings: [],
  };
  const v = analyseVibration({
    log,
    ranges: [[0, n]],
    rpms: null,
    collective: null,
    blades: 3,
    prominenceDb: 10,
  });
  const ch = v.channels.gyro_x!;

  it('band RMS is in channel units: A/√2 for a sine above 50 Hz', () => {
    expect(v.df).toBeCloseTo(df, 12);
    expect(ch.bandRms).toBeCloseTo(A / Math.SQRT2, 3);
  });

  it('a peak’s level is dB re 1 (channel unit)²/Hz: 10·log10(A²/2 ÷ ENBW)', () => {
    const p = ch.peaks[0]!;
    expect(p.hz).toBeCloseTo(f0, 1);
    const expected = 10 * Math.log10((A * A) / 2 / (1.5 * df)); // −1.146 dB re 1 (deg/s)²/Hz
    expect(p.db).toBeCloseTo(expected, 2);
    expect(p.amplitude).toBeCloseTo(A, 2);
  });
});

describe('filter bench', () => {
  it('returns the response and before/after spectra, and the notch removes its tone', () => {
    const log = sweepLog();
    const r = benchFilters(log, 'gyro_x', [{ kind: 'notch', hz: 300, q: 4 }]);
    expect(r.response.hz.length).toBe(512);
    const k = r.before.hz.findIndex((f) => f >= 300);
    expect(r.before.db[k]! - r.after.db[k]!).toBeGreaterThan(20);
  });

  it('refuses a channel the log does not have', () => {
    expect(() => benchFilters(sweepLog(), 'gyro_z', [])).toThrow(/no "gyro_z"/);
  });
});
