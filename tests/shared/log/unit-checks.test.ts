import { describe, expect, it } from 'vitest';
import { parseLog } from '../../../shared/log/parse';
import { enc } from './helpers';

const suspects = (text: string) =>
  parseLog(enc(text))
    .warnings.filter((w) => w.code === 'unit-suspect')
    .map((w) => w.message);

describe('assumed units that do not fit the values', () => {
  it('warns when a time without a unit steps like microseconds', () => {
    const [m] = suspects('time,motor1\n1000000,0.5\n1000250,0.5\n1000500,0.5\n');
    expect(m).toMatch(/time has no unit.*250 s apart.*time \[us\]/);
  });

  it('warns when a motor without a unit reaches pulse-width values', () => {
    expect(suspects('time,motor1,motor2\n0,1000,0.5\n0.001,1520,0.5\n')).toEqual([
      expect.stringMatching(/motor1 has no unit.*reaches 1520.*motor1 \[us\]/),
    ]);
  });

  it('warns when vbat without a unit looks like millivolts', () => {
    expect(suspects('time,motor1,vbat\n0,0.5,16800\n0.001,0.5,16790\n')[0]).toMatch(/vbat \[mV\]/);
  });

  it('stays quiet when the unit is written or the values fit', () => {
    expect(
      suspects('time [us],motor1 [us],vbat [mV]\n1000000,1000,16800\n1000250,1520,16790\n'),
    ).toEqual([]);
    expect(suspects('time,motor1,throttle,vbat\n0,0.5,0.4,16.8\n0.001,1.02,0.4,16.7\n')).toEqual(
      [],
    );
  });
});

describe('units written in the header or a column map that do not fit the values', () => {
  it('warns about µs motor outputs mapped as fractions, offering µs', () => {
    const text = 'stamp,out_a\n0,1000\n0.002,1450\n0.004,1990\n';
    const log = parseLog(enc(text), {
      columnMap: {
        columns: { stamp: { channel: 'time' }, out_a: { channel: 'motor1', unit: 'frac' } },
      },
    });
    const w = log.warnings.filter((x) => x.code === 'unit-suspect');
    expect(w.map((x) => x.message)).toEqual([
      expect.stringMatching(
        /^motor1 \("out_a"\) is read as a 0–1 fraction, but it reaches 1990.*read it as a 1000–2000 µs pulse instead\.$/,
      ),
    ]);
  });

  it('warns about an accelerometer header in g that reads near −9.8', () => {
    const [m] = suspects('time,motor1,acc_z [g]\n0,0.5,-9.81\n0.001,0.5,-9.79\n');
    expect(m).toMatch(/acc_z \("acc_z \[g\]"\) is read as g, but it reads near 9\.8.*m\/s²/);
  });
});

describe('time from zero', () => {
  it('starts time at 0 and keeps where the logger clock started', () => {
    // Worked by hand: 81 250 ms is 81.25 s, kept as the start; the rows are 4 ms apart.
    const log = parseLog(enc('time [ms],motor1\n81250,0.5\n81254,0.5\n81258,0.5\n'));
    expect(Array.from(log.columns.time!)).toEqual(
      [0, 0.004, 0.008].map((v) => expect.closeTo(v, 12)),
    );
    expect(log.timeStartS).toBeCloseTo(81.25, 12);
    expect(log.durationS).toBeCloseTo(0.008, 12);
  });
});
