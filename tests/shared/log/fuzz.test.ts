import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LogFormatError } from '../../../shared/log/errors';
import { inspectHeader } from '../../../shared/log/header';
import { parseLog } from '../../../shared/log/parse';
import { enc } from './helpers';

/**
 * Malformed input: the engine either returns a log or throws a LogFormatError that names a
 * line inside the file — never another error, never a hang (vitest's test timeout would
 * catch one; no wall-clock limit is asserted).
 */
function check(bytes: Uint8Array, chunk = 0): void {
  const lineCount =
    1 +
    bytes.reduce((n, b) => n + (b === 10 ? 1 : 0), 0) +
    bytes.reduce((n, b, i) => n + (b === 13 && bytes[i + 1] !== 10 ? 1 : 0), 0);
  const parts: Uint8Array[] = [];
  if (chunk > 0)
    for (let i = 0; i < bytes.length; i += chunk) parts.push(bytes.subarray(i, i + chunk));
  try {
    const log = chunk > 0 ? parseLog(parts) : parseLog(bytes);
    expect(log.rows).toBeGreaterThan(0);
    for (const c of log.channels) expect(log.columns[c]!.length).toBe(log.rows);
  } catch (err) {
    if (!(err instanceof LogFormatError)) throw err;
    expect(Number.isInteger(err.line)).toBe(true);
    expect(err.line).toBeGreaterThanOrEqual(1);
    expect(err.line).toBeLessThanOrEqual(lineCount + 1);
    expect(err.message.toLowerCase()).toContain(`line ${err.line}`);
  }
  try {
    inspectHeader(bytes.subarray(0, 65536));
  } catch (err) {
    if (!(err instanceof LogFormatError)) throw err;
  }
}

const good =
  'time,motor1,motor2,gyro_x\n0,0.5,0.5,1\n0.001,0.5,0.5,2\n0.002,0.5,0.5,3\n0.003,0.5,0.5,4\n';

const mutation = fc.oneof(
  fc.record({ kind: fc.constant('cut' as const), at: fc.nat() }),
  fc.record({
    kind: fc.constant('insert' as const),
    at: fc.nat(),
    text: fc.constantFrom(
      '"',
      '""',
      ',',
      ';',
      '\n',
      '\r',
      '\t',
      'abc',
      '1e',
      '-',
      '.',
      '#',
      '\u0000',
      '\ufeff',
      'NaN',
      '9'.repeat(400),
      ',,,,,',
    ),
  }),
  fc.record({
    kind: fc.constant('delete' as const),
    at: fc.nat(),
    len: fc.integer({ min: 1, max: 10 }),
  }),
);

describe('malformed input', () => {
  it('mutated logs give a log or a LogFormatError naming a line', () => {
    fc.assert(
      fc.property(
        fc.array(mutation, { minLength: 1, maxLength: 6 }),
        fc.integer({ min: 0, max: 9 }),
        (muts, chunk) => {
          let s = good;
          for (const m of muts) {
            const at = m.at % (s.length + 1);
            if (m.kind === 'cut') s = s.slice(0, at);
            else if (m.kind === 'insert') s = s.slice(0, at) + m.text + s.slice(at);
            else s = s.slice(0, at) + s.slice(at + m.len);
          }
          check(enc(s), chunk);
        },
      ),
      { numRuns: 600 },
    );
  });

  it('binary garbage gives a LogFormatError', () => {
    fc.assert(
      fc.property(
        fc.uint8Array({ minLength: 0, maxLength: 3000 }),
        fc.integer({ min: 0, max: 64 }),
        (bytes, chunk) => {
          check(bytes, chunk);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('random text made of CSV characters gives a log or a LogFormatError', () => {
    const alphabet = fc.constantFrom(
      't',
      'i',
      'm',
      'e',
      'motor1',
      'time',
      ',',
      '\n',
      '\r\n',
      '"',
      '0',
      '1',
      '.',
      '-',
      ' ',
      '#',
      ':',
      'e5',
      ';',
    );
    fc.assert(
      fc.property(fc.array(alphabet, { maxLength: 300 }), (parts) => {
        check(enc(parts.join('')));
        check(enc(`time,motor1\n${parts.join('')}`), 5);
      }),
      { numRuns: 400 },
    );
  });

  it('a huge line without line endings is refused with its line number', () => {
    const bytes = enc(`time,motor1\n0,0.5\n${'1'.repeat(3 << 20)}`);
    const parts: Uint8Array[] = [];
    for (let i = 0; i < bytes.length; i += 65536) parts.push(bytes.subarray(i, i + 65536));
    try {
      parseLog(parts);
      throw new Error('expected an error');
    } catch (err) {
      expect(err).toBeInstanceOf(LogFormatError);
      expect((err as LogFormatError).code).toBe('line-too-long');
      expect((err as LogFormatError).line).toBe(3);
    }
  });

  it('an enormous header without a line ending is refused', () => {
    const bytes = enc('time,'.repeat(300_000));
    const parts: Uint8Array[] = [];
    for (let i = 0; i < bytes.length; i += 65536) parts.push(bytes.subarray(i, i + 65536));
    expect(() => parseLog(parts)).toThrow(LogFormatError);
  });

  it.each([
    ['empty file', ''],
    ['only a BOM', '\ufeff'],
    ['header only', 'time,motor1'],
    ['header only with line ending', 'time,motor1\r\n'],
    ['only blank lines', '\n\n\n'],
    ['stray quote in header', 'time,"motor1\n0,1\n'],
    ['quote then text in header', 'time,"motor1"x\n0,1\n'],
  ])('%s gives a LogFormatError', (_name, text) => {
    expect(() => parseLog(enc(text))).toThrow(LogFormatError);
  });
});
