import { describe, expect, it } from 'vitest';
import {
  channelFamily,
  conversionFor,
  convert,
  hasChannel,
  motorCount,
  normalizeUnit,
  STANDARD_GRAVITY,
  type Conversion,
  type Unit,
} from '../../../shared/log/channels';

function conv(channel: string, unit: Unit, input = {}): Conversion {
  const c = conversionFor(channel, unit, input);
  if (typeof c === 'string') throw new Error(c);
  return c;
}

describe('unit conversion to canonical units', () => {
  it('turns rad/s into deg/s with 1 rad = 180/π deg', () => {
    // SI Brochure, 9th ed. (BIPM 2019), Table 8: 1° = (π/180) rad, so 1 rad = 180/π deg.
    expect(convert(Math.PI, conv('gyro_x', 'rad/s'))).toBeCloseTo(180, 12);
    expect(convert(1, conv('sp_yaw', 'rad/s'))).toBeCloseTo(57.29577951308232, 12);
    expect(convert(-Math.PI / 2, conv('gyro_z', 'rad/s'))).toBeCloseTo(-90, 12);
  });

  it('turns m/s² into g with standard gravity g0 = 9.80665 m/s²', () => {
    // g0 = 9.80665 m/s² exactly: declared by the 3rd CGPM (1901), kept in ISO 80000-3.
    expect(STANDARD_GRAVITY).toBe(9.80665);
    expect(convert(9.80665, conv('acc_z', 'm/s2'))).toBe(1);
    expect(convert(-19.6133, conv('acc_x', 'm/s2'))).toBeCloseTo(-2, 12);
  });

  it('turns ms and µs of time into seconds (SI prefixes milli = 10⁻³, micro = 10⁻⁶)', () => {
    // SI Brochure, 9th ed., Table 7 (SI prefixes).
    expect(convert(1500, conv('time', 'ms'))).toBe(1.5);
    expect(convert(250, conv('time', 'us'))).toBe(0.00025);
    expect(convert(123456789, conv('time', 'us'))).toBeCloseTo(123.456789, 12);
    expect(convert(2.5, conv('time', 's'))).toBe(2.5);
  });

  it('normalises motor outputs from %, 1000–2000 µs pulses and a raw range to 0–1', () => {
    // 1000–2000 µs is the classic RC/ESC servo pulse range (common practice).
    expect(convert(50, conv('motor1', '%'))).toBe(0.5);
    expect(convert(1000, conv('motor2', 'us'))).toBe(0);
    expect(convert(1500, conv('motor2', 'us'))).toBe(0.5);
    expect(convert(2000, conv('motor2', 'us'))).toBe(1);
    expect(convert(48, conv('motor3', 'raw', { min: 48, max: 2047 }))).toBe(0);
    expect(convert(2047, conv('motor3', 'raw', { min: 48, max: 2047 }))).toBe(1);
    expect(convert(0.25, conv('throttle', 'frac'))).toBe(0.25);
  });

  it('turns erpm into rpm with the pole count (electrical = mechanical × poles / 2)', () => {
    // A motor with p poles has p/2 pole pairs; one turn is p/2 electrical cycles (from memory,
    // standard BLDC relation).
    expect(convert(70000, conv('rpm1', 'erpm', { poles: 14 }))).toBe(10000);
    expect(convert(200, conv('rpm2', 'Hz'))).toBe(12000);
  });

  it('turns mV and mA into V and A', () => {
    expect(convert(16800, conv('vbat', 'mV'))).toBe(16.8);
    expect(convert(2500, conv('ibat', 'mA'))).toBe(2.5);
    expect(convert(12, conv('imotor1', 'A'))).toBe(12);
  });

  it('explains what is missing or wrong instead of converting', () => {
    expect(conversionFor('rpm1', 'erpm')).toMatch(/pole count/);
    expect(conversionFor('rpm1', 'erpm', { poles: 7 })).toMatch(/even/);
    expect(conversionFor('motor1', 'raw')).toMatch(/min.*max/);
    expect(conversionFor('motor1', 'raw', { min: 5, max: 5 })).toMatch(/differ/);
    expect(conversionFor('gyro_x', 'g')).toMatch(/deg\/s, rad\/s/);
    expect(conversionFor('wind', 'g')).toMatch(/not one of our channels/);
  });
});

describe('channel registry', () => {
  it.each([
    ['time', 'time'],
    ['motor1', 'motor'],
    ['motor16', 'motor'],
    ['rpm4', 'rpm'],
    ['imotor6', 'imotor'],
    ['gyro_z', 'gyro'],
    ['sp_pitch', 'sp'],
    ['vbat', 'vbat'],
  ])('knows %s', (name, family) => {
    expect(channelFamily(name)?.id).toBe(family);
  });

  it.each(['motor0', 'motor17', 'motor', 'gyro_w', 'Time', 'rpm01'])('rejects %s', (name) => {
    expect(channelFamily(name)).toBeNull();
  });

  it('reads unit spellings', () => {
    expect(normalizeUnit('RAD/S')).toBe('rad/s');
    expect(normalizeUnit('µs')).toBe('us');
    expect(normalizeUnit('m/s^2')).toBe('m/s2');
    expect(normalizeUnit('mv')).toBe('mV');
    expect(normalizeUnit('furlongs')).toBeNull();
  });

  it('counts motors and finds channels', () => {
    const log = { channels: ['time', 'motor1', 'motor2', 'motor3', 'motor4', 'rpm1', 'imotor1'] };
    expect(motorCount(log)).toBe(4);
    expect(hasChannel(log, 'rpm1')).toBe(true);
    expect(hasChannel(log, 'vbat')).toBe(false);
    expect(motorCount({ channels: ['time'] })).toBe(0);
  });
});

describe('unit lookups', () => {
  it('do not mistake object keys for units', () => {
    expect(normalizeUnit('constructor')).toBeNull();
    expect(normalizeUnit('__proto__')).toBeNull();
  });
});
