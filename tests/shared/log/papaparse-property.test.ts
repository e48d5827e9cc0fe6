import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { parseLog } from '../../../shared/log/parse';
import { enc } from './helpers';

/**
 * Our reader against papaparse (the reference CSV reader, dynamicTyping on) on random numeric
 * CSVs: both must read the same numbers. Every column but time is Float32, so papaparse's
 * double is rounded the same way (Math.fround) before comparing.
 */

const digits = (min: number, max: number) =>
  fc
    .array(fc.constantFrom('0', '1', '2', '3', '4', '5', '6', '7', '8', '9'), {
      minLength: min,
      maxLength: max,
    })
    .map((a) => a.join(''));

const numberText = fc.oneof(
  {
    weight: 5,
    arbitrary: fc
      .tuple(fc.boolean(), digits(1, 6), digits(0, 8))
      .map(([neg, i, f]) => `${neg ? '-' : ''}${i}${f ? `.${f}` : ''}`),
  },
  {
    weight: 2,
    arbitrary: fc
      .tuple(
        fc.boolean(),
        digits(1, 3),
        digits(0, 4),
        fc.constantFrom('e', 'E'),
        fc.constantFrom('', '-', '+'),
        digits(1, 2),
      )
      .map(([neg, i, f, e, s, x]) => `${neg ? '-' : ''}${i}${f ? `.${f}` : ''}${e}${s}${x}`),
  },
  { weight: 1, arbitrary: fc.constantFrom('-0', '0', '-0.0', '0.000', '') },
  {
    weight: 1,
    arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }).map(String),
  },
  { weight: 1, arbitrary: digits(16, 22) },
);

const csvCase = fc.record({
  delimiter: fc.constantFrom(',', ';', '\t'),
  eol: fc.constantFrom('\n', '\r\n'),
  motors: fc.integer({ min: 1, max: 4 }),
  rows: fc.integer({ min: 1, max: 25 }),
  finalEol: fc.boolean(),
  seed: fc.array(numberText, { minLength: 200, maxLength: 200 }),
});

/** papaparse keeps numbers beyond ±2^53 (and every blank) as strings; read those the JS way. */
function reference(cell: unknown): number {
  if (typeof cell === 'number') return cell;
  if (cell === null || cell === '') return NaN;
  return Number(cell);
}

describe('our reader and papaparse read the same numbers', () => {
  it('on random numeric CSVs', () => {
    fc.assert(
      fc.property(csvCase, ({ delimiter, eol, motors, rows, finalEol, seed }) => {
        const headers = [
          'time',
          ...Array.from({ length: motors }, (_, i) => `motor${i + 1}`),
          'gyro_x',
        ];
        const lines = [headers.join(delimiter)];
        let k = 0;
        for (let r = 0; r < rows; r++) {
          const cells = headers.map((_, c) =>
            c === 0 ? String(r / 1000) : seed[k++ % seed.length]!,
          );
          lines.push(cells.join(delimiter));
        }
        const text = lines.join(eol) + (finalEol ? eol : '');
        const ours = parseLog(enc(text));
        const ref = Papa.parse<unknown[]>(text, {
          dynamicTyping: true,
          delimiter,
          skipEmptyLines: true,
        });
        expect(ref.errors).toEqual([]);
        const data = ref.data.slice(1);
        expect(ours.rows).toBe(data.length);
        headers.forEach((h, c) => {
          const col = ours.columns[h]!;
          for (let r = 0; r < data.length; r++) {
            const want = reference(data[r]![c]);
            const expected = h === 'time' ? want : Math.fround(want);
            expect(
              Object.is(col[r], expected),
              `${h} row ${r}: ${String(data[r]![c])} → ${col[r]}`,
            ).toBe(true);
          }
        });
      }),
      { numRuns: 300 },
    );
  });
});
