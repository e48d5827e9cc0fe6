import { describe, expect, it } from 'vitest';
import { unitFromValues } from '../../../shared/log/unit-from-values';

// Common practice for flight logs: servo-style pulses run 1000–2000 µs, digital ESC commands
// 48–2047, and an accelerometer at rest reads 1 g = 9.80665 m/s² (standard gravity, 3rd CGPM).
describe('unitFromValues', () => {
  it('reads 1000–2000 as µs, 48–2047 as the digital command range, 0–100 as %', () => {
    expect(unitFromValues('motor1', [1000, 1500, 2000])?.unit).toBe('us');
    expect(unitFromValues('motor1', [48, 900, 2047])).toMatchObject({
      unit: 'raw',
      min: 48,
      max: 2047,
    });
    expect(unitFromValues('throttle', [0, 42, 97])?.unit).toBe('%');
    expect(unitFromValues('motor1', [0.1, 0.9])?.unit).toBe('frac');
    expect(unitFromValues('motor1', [-5, 3000])).toBeNull();
  });

  it('reads ±9.8 at rest as m/s², about 1 as g, and nothing from an axis near 0', () => {
    expect(unitFromValues('acc_z', [-9.79, -9.82, -9.8])?.unit).toBe('m/s2');
    expect(unitFromValues('acc_y', [9.7, 9.9])?.unit).toBe('m/s2');
    expect(unitFromValues('acc_z', [-1.01, -0.99])?.unit).toBe('g');
    expect(unitFromValues('acc_x', [0.02, -0.03])).toBeNull();
  });

  it('reads a time step as µs, ms or s, and nothing from a time that stands still', () => {
    expect(unitFromValues('time', [1_000_000, 1_000_250, 1_000_500])?.unit).toBe('us');
    expect(unitFromValues('time', [0, 4, 8])?.unit).toBe('ms');
    expect(unitFromValues('time', [0, 0.004, 0.008])?.unit).toBe('s');
    expect(unitFromValues('time', [3, 3, 3])).toBeNull();
  });

  it('ignores empty cells', () => {
    expect(unitFromValues('motor1', [NaN, 1200, NaN, 1300])?.unit).toBe('us');
    expect(unitFromValues('motor1', [NaN])).toBeNull();
  });
});
