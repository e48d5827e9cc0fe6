import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import type { ParsedLog } from '../../../shared/log/types';
import {
  formatFixed,
  writeCanonicalCsv,
  writeCanonicalCsvBytes,
} from '../../../shared/sim/csv-writer';
import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';

const scenario = scenarios['esc-overcurrent']!;
const csvOf = (seed: number) =>
  [...writeCanonicalCsv(simulate(scenario, { seconds: 12, rateHz: 200, seed }).log)].join('');

function tiny(): ParsedLog {
  return {
    channels: ['time', 'motor1', 'rpm1', 'gyro_x'],
    columns: {
      time: Float64Array.from([0, 0.001, 0.002]),
      motor1: Float32Array.from([0.04, 0.5, 1]),
      rpm1: Float32Array.from([0, 12890.6, 30000]),
      gyro_x: Float32Array.from([-0.0004, NaN, -12.3456]),
    },
    rows: 3,
    sampleRateHz: 1000,
    durationS: 0.002,
    metadata: { scenario: 'tiny' },
    warnings: [],
  };
}

describe('formatFixed', () => {
  it('agrees with Number.prototype.toFixed away from rounding ties', () => {
    // ECMAScript's toFixed as the reference formatter.
    for (const v of [0, 1, -1, 0.5, 3.14159, -2.71828, 12890.4, 123456.789012, 1e-7, -0.00004]) {
      for (const d of [0, 2, 3, 4, 6]) {
        const ref = v.toFixed(d);
        expect(formatFixed(v, d)).toBe(/^-0(\.0+)?$/.test(ref) ? ref.slice(1) : ref);
      }
    }
  });

  it('prints NaN as an empty cell and never prints minus zero', () => {
    expect(formatFixed(NaN, 3)).toBe('');
    expect(formatFixed(-0.0001, 3)).toBe('0.000');
    expect(formatFixed(-0.4, 0)).toBe('0');
  });
});

describe('writeCanonicalCsv', () => {
  it('writes metadata lines, unit headers and rows', () => {
    const text = [...writeCanonicalCsv(tiny(), { metadata: { note: 'two\nlines' } })].join('');
    expect(text).toBe(
      [
        '# scenario: tiny',
        '# note: two lines',
        'time [s],motor1 [frac],rpm1 [rpm],gyro_x [deg/s]',
        '0.000000,0.0400,0,0.000',
        '0.001000,0.5000,12891,',
        '0.002000,1.0000,30000,-12.346',
        '',
      ].join('\n'),
    );
  });

  it('leaves units out when asked', () => {
    const text = [...writeCanonicalCsv(tiny(), { units: false, metadata: {} })].join('');
    expect(text.split('\n')[1]).toBe('time,motor1,rpm1,gyro_x');
  });

  it('yields bounded chunks whose bytes equal the text', () => {
    const log = tiny();
    const chunks = [...writeCanonicalCsvBytes(log, { chunkRows: 1 })];
    expect(chunks.length).toBe(4);
    const text = chunks.map((c) => String.fromCharCode(...c)).join('');
    expect(text).toBe([...writeCanonicalCsv(log)].join(''));
  });

  it('refuses a log whose columns are missing or short', () => {
    const log = tiny();
    log.columns.rpm1 = new Float32Array(1);
    expect(() => [...writeCanonicalCsv(log)]).toThrow(/shorter/);
    delete log.columns.rpm1;
    expect(() => [...writeCanonicalCsv(log)]).toThrow(/no column/);
  });

  it('reads back through papaparse with every value within its printed precision', () => {
    // papaparse as an independent reference CSV reader.
    const { log } = simulate(scenario, { seconds: 12, rateHz: 200, seed: 2 });
    const text = [...writeCanonicalCsv(log)].join('');
    const lines = text.split('\n');
    const meta = lines.filter((l) => l.startsWith('#'));
    expect(meta).toContain('# scenario: esc-overcurrent');
    const body = lines.slice(meta.length).join('\n');
    const parsed = Papa.parse<Record<string, number>>(body, {
      header: true,
      dynamicTyping: true,
      skipEmptyLines: true,
    });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBe(log.rows);
    expect(parsed.meta.fields).toContain('imotor4 [A]');
    const check = (name: string, header: string, tol: number) => {
      const c = log.columns[name]!;
      parsed.data.forEach((row, i) =>
        expect(Math.abs(row[header]! - c[i]!)).toBeLessThanOrEqual(tol),
      );
    };
    // Each allowance is half a unit in the last decimal the writer prints for that channel
    // (FORMATS in shared/sim/csv-writer.ts, after shared/log/FORMAT.md): rounding, nothing more.
    check('time', 'time [s]', 5e-7);
    check('motor2', 'motor2 [frac]', 5e-5);
    check('rpm3', 'rpm3 [rpm]', 0.5);
    check('gyro_z', 'gyro_z [deg/s]', 5e-4);
    check('acc_z', 'acc_z [g]', 5e-5);
    check('vbat', 'vbat [V]', 5e-4);
  });

  it('is byte-identical for the same seed and differs for another', () => {
    const a = csvOf(11);
    expect(csvOf(11)).toBe(a);
    expect(csvOf(12)).not.toBe(a);
  });
});
