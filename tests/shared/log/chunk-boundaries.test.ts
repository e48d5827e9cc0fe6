import { describe, expect, it } from 'vitest';
import { LogFormatError } from '../../../shared/log/errors';
import { parseLog } from '../../../shared/log/parse';
import type { ParsedLog } from '../../../shared/log/types';
import { enc } from './helpers';

/** Everything a caller can see, with columns as plain arrays (NaN and −0 kept by toEqual). */
function snapshot(log: ParsedLog) {
  return {
    channels: log.channels,
    columns: Object.fromEntries(Object.entries(log.columns).map(([k, v]) => [k, Array.from(v)])),
    rows: log.rows,
    metadata: log.metadata,
    warnings: log.warnings,
    emptyCells: log.emptyCells,
  };
}

function outcome(chunks: Uint8Array[]) {
  try {
    return snapshot(parseLog(chunks));
  } catch (err) {
    if (!(err instanceof LogFormatError)) throw err;
    return { code: err.code, line: err.line, column: err.column, message: err.message };
  }
}

const files: Record<string, string> = {
  'metadata, BOM, CRLF, quotes':
    '\ufeff# aircraft: Osprey\r\n# note: "survey"\r\n"time [ms]";"motor1 [%]";gyro_x [rad/s];"Mode"\r\n0;12,5;-1e-3;"A;B"\r\n4;13;0.5;x\r\n\r\n8;"14";;y\r\n12;15;-inf;z',
  'blank and comment lines, lone CR':
    'time,motor1,motor2\r0,0.5,0.25\r\r# gap\r1,0.5,0.25\n2,NaN,0.125\n',
  'truncated last line': 'time,motor1,motor2\n0,0.1,0.2\n1,0.3,0.4\n2,0.5',
  'error mid-file': 'time,motor1\n0,0.5\n1,0.5x\n2,0.5\n',
  'long numbers and exponents':
    'time,motor1,acc_z [m/s2]\n0.000250000000000000001,5E-1,-9.80665e0\n1.23456789012345678,0.0000001,1e22\n',
};

describe('chunk boundaries', () => {
  it.each(Object.entries(files))('give identical results at every split of: %s', (_name, text) => {
    const bytes = enc(text);
    const whole = outcome([bytes]);
    for (let cut = 0; cut <= bytes.length; cut++) {
      expect(
        outcome([bytes.subarray(0, cut), bytes.subarray(cut)]),
        `split at byte ${cut}`,
      ).toEqual(whole);
    }
    for (let a = 1; a < bytes.length; a += 3) {
      const b = Math.min(bytes.length, a + 1 + (a % 7));
      expect(
        outcome([bytes.subarray(0, a), bytes.subarray(a, b), bytes.subarray(b)]),
        `splits at ${a}, ${b}`,
      ).toEqual(whole);
    }
    const single = Array.from({ length: bytes.length }, (_, i) => bytes.subarray(i, i + 1));
    expect(outcome(single), 'one byte per chunk').toEqual(whole);
  });
});
