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
