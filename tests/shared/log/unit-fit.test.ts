import { describe, expect, it } from 'vitest';
import { doubtMessage, doubtUnit } from '../../../shared/log/unit-fit';

// The limits under test are common practice for multirotor logs (shared/log/unit-fit.ts): a
// 0–1 output stays at or below ~1.2, an accelerometer at rest reads about 1 g, a gyro's range
// ends near 2000 deg/s, packs stay under 100 V.

const pulse = [1000, 1012, 1240, 1498, 1990];

describe('doubtUnit', () => {
  it('doubts µs motor outputs read as a 0–1 fraction and offers µs', () => {
    const d = doubtUnit('motor1', 'frac', pulse)!;
    expect(d.kind).toBe('off-scale');
    expect(d.finding).toMatch(/reaches 1990, which is 199000 % of full output/);
    expect(d.likely).toMatchObject({ unit: 'us' });
  });

  it('offers the 48–2047 digital command range for values that are not a pulse', () => {
    const d = doubtUnit('motor2', 'frac', [48, 48, 300, 1200, 2047])!;
    expect(d.likely).toMatchObject({ unit: 'raw', min: 48, max: 2047 });
  });

  it('doubts a percentage read as µs (below the 1000 µs floor) and offers %', () => {
    const d = doubtUnit('motor1', 'us', [0, 35, 52, 80])!;
    expect(d.likely?.unit).toBe('%');
  });

  it('doubts an accelerometer in g near −9.8 and offers m/s²', () => {
    const d = doubtUnit('acc_z', 'g', [-9.79, -9.81, -9.83, -9.8])!;
    expect(d.finding).toMatch(/near 9\.81 g/);
    expect(d.likely?.unit).toBe('m/s2');
  });

  it('doubts an accelerometer in m/s² that reads about 1 and offers g', () => {
    expect(doubtUnit('acc_z', 'm/s2', [-1.01, -0.99, -1])?.likely?.unit).toBe('g');
  });

  it('says a time that does not increase stands still, with no unit to offer', () => {
    expect(doubtUnit('time', 's', [5, 5, 5, 5])).toMatchObject({ kind: 'stalled', likely: null });
    expect(doubtUnit('time', 's', [4, 3, 2, 1])?.kind).toBe('stalled');
  });

  it('doubts a time step of 250 "seconds" or of 1 "µs" and offers the unit that fits', () => {
    expect(doubtUnit('time', 's', [0, 250, 500, 750])?.likely?.unit).toBe('us');
    expect(doubtUnit('time', 'us', [0, 1, 2, 3])?.likely?.unit).toBe('ms');
  });

  it('doubts deg/s values read as rad/s, mV read as V and mA read as A', () => {
    expect(doubtUnit('gyro_x', 'rad/s', [-320, 15, 410])?.likely?.unit).toBe('deg/s');
    expect(doubtUnit('vbat', 'V', [16800, 16650])?.likely?.unit).toBe('mV');
    expect(doubtUnit('vbat', 'mV', [16.8, 16.6])?.likely?.unit).toBe('V');
    expect(doubtUnit('ibat', 'A', [800, 12000])?.likely?.unit).toBe('mA');
  });

  it('keeps quiet when the values fit', () => {
    expect(doubtUnit('motor1', 'frac', [0.05, 0.4, 1.02])).toBeNull();
    expect(doubtUnit('motor1', 'us', pulse)).toBeNull();
    expect(doubtUnit('motor1', 'raw', [48, 1000, 2047], { min: 48, max: 2047 })).toBeNull();
    expect(doubtUnit('acc_z', 'g', [-1.02, -0.98])).toBeNull();
    expect(doubtUnit('acc_x', 'm/s2', [0.1, -0.2, 0.05])).toBeNull();
    expect(doubtUnit('time', 'ms', [0, 0.25, 0.5])).toBeNull();
    expect(doubtUnit('time', 's', [7])).toBeNull(); // one sample: no step to judge
    expect(doubtUnit('gyro_x', 'deg/s', [-320, 15, 410])).toBeNull();
    expect(doubtUnit('vbat', 'V', [16.8, 16.6])).toBeNull();
  });
});

describe('doubtMessage', () => {
  it('names the column, the unit read, what looks wrong and the unit to use instead', () => {
    const d = doubtUnit('motor1', 'frac', pulse)!;
    expect(doubtMessage('motor1', 'frac', d, 'stated', 'Out A')).toBe(
      'motor1 ("Out A") is read as a 0–1 fraction, but it reaches 1990, which is 199000 % of full output. ' +
        'The values 1000…1990 look like a 1000–2000 µs pulse: read it as a 1000–2000 µs pulse instead.',
    );
  });

  it('names µs on a time column as microseconds, not a pulse', () => {
    const d = doubtUnit('time', 's', [0, 250, 500, 750])!;
    expect(doubtMessage('time', 's', d, 'stated', 'stamp')).toMatch(
      /^time \("stamp"\) is read as seconds, but samples are 250 s apart.*read it as microseconds instead\.$/,
    );
  });

  it('tells an unmapped header to say its unit, and a raw range to go in a column map', () => {
    const us = doubtUnit('motor1', 'frac', pulse)!;
    expect(doubtMessage('motor1', 'frac', us, 'assumed', 'motor1')).toMatch(
      /^motor1 has no unit, so it was read as a 0–1 fraction, .* say so in the header, "motor1 \[us\]"\.$/,
    );
    const digital = doubtUnit('motor1', 'frac', [48, 2047])!;
    expect(doubtMessage('motor1', 'frac', digital, 'assumed', 'motor1')).toMatch(
      /map it as raw 48–2047 in a column map/,
    );
  });
});
