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
