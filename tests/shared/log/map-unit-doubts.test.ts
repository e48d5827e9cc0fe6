import { describe, expect, it } from 'vitest';
import { inspectHeader } from '../../../shared/log/header';
import { doubtsAboutMap } from '../../../shared/log/map-unit-doubts';
import { enc } from './helpers';

const file = [
  'stamp;out_a;out_b;acc_up;vbat',
  '0;1000;1010;-9,81;16,8',
  '250;1200;1210;-9,79;16,7',
  '500;1500;1490;-9,80;16,7',
].join('\n');

describe('doubtsAboutMap (before anything is read)', () => {
  const preview = inspectHeader(enc(file + '\n'));

  it('flags µs motors mapped as fractions, an accelerometer in g near −9.8 and a µs time as s', () => {
    const doubts = doubtsAboutMap(
      {
        columns: {
          stamp: { channel: 'time', unit: 's' },
          out_a: { channel: 'motor1', unit: 'frac' },
          out_b: { channel: 'motor2' },
          acc_up: { channel: 'acc_z', unit: 'g' },
        },
      },
      preview,
    );
    expect(doubts.map((d) => [d.header, d.column, d.likely?.unit])).toEqual([
      ['stamp', 1, 'us'],
      ['out_a', 2, 'us'],
      ['out_b', 3, 'us'],
      ['acc_up', 4, 'm/s2'],
    ]);
    expect(doubts[1]!.message).toMatch(
      /^motor1 \("out_a"\) is read as a 0–1 fraction, but it reaches 1500/,
    );
    expect(doubts[3]!.message).toMatch(/read it as m\/s² instead\.$/);
  });

  it('checks our own headers the map leaves out (vbat in V here: fits) and is quiet on a good map', () => {
    expect(
      doubtsAboutMap(
        {
          columns: {
            stamp: { channel: 'time', unit: 'us' },
            out_a: { channel: 'motor1', unit: 'us' },
            out_b: { channel: 'motor2', unit: 'raw', min: 1000, max: 2000 },
            acc_up: { channel: 'acc_z', unit: 'm/s2' },
          },
        },
        preview,
      ),
    ).toEqual([]);
  });

  it('says a time column that stands still does not increase', () => {
    const still = inspectHeader(enc('t,m\n5,0.1\n5,0.2\n5,0.3\n'));
    const [d] = doubtsAboutMap(
      { columns: { t: { channel: 'time', unit: 's' }, m: { channel: 'motor1' } } },
      still,
    );
    expect(d!.message).toMatch(/does not increase.*Check that this column is the sample time/);
    expect(d!.likely).toBeNull();
  });
});
