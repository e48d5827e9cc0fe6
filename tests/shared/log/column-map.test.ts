import { describe, expect, it } from 'vitest';
import { ColumnMap } from '../../../shared/log/column-map';

describe('ColumnMap schema (shared with the server for import presets)', () => {
  it('accepts a valid preset', () => {
    const preset = {
      columns: {
        t_ms: { channel: 'time', unit: 'ms' },
        'out A': { channel: 'motor1', unit: 'raw', min: 48, max: 2047 },
        'gyro roll': { channel: 'gyro_x', scale: 0.1 },
      },
    };
    expect(ColumnMap.parse(preset)).toEqual(preset);
  });

  it.each([
    [{ columns: { a: { channel: 'motor0' } } }, /not one of our channels/],
    [{ columns: { a: { channel: 'motor1', unit: 'furlongs' } } }, /unknown unit/],
    [{ columns: { a: { channel: 'gyro_x', unit: 'g' } } }, /deg\/s, rad\/s/],
    [{ columns: { a: { channel: 'motor1', unit: 'raw' } } }, /min/],
    [{ columns: { a: { channel: 'vbat', scale: 0 } } }, /scale/],
    [{ columns: { a: { channel: 'vbat', offset: Infinity } } }, /.+/],
  ])('rejects %j', (input, message) => {
    const r = ColumnMap.safeParse(input);
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.message).join(' ')).toMatch(message);
  });
});
