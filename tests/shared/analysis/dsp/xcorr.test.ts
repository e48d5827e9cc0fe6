import { describe, expect, it } from 'vitest';
import { crossCorrelationLag } from '../../../../shared/analysis/dsp/xcorr';
import { parkMiller } from '../park-miller';

describe('cross-correlation lag (Knapp & Carter 1976; scipy correlate convention, tests/REFERENCES.md §11)', () => {
  it('X1: finds the 37-sample delay of a Park–Miller sequence, peak 75.68664602', () => {
    const r = parkMiller(1);
    const x = Float64Array.from({ length: 1000 }, () => r() / 2147483647 - 0.5);
    const y = Float64Array.from({ length: 1000 }, (_, n) => (n < 37 ? 0 : x[n - 37]!));
    const est = crossCorrelationLag(x, y, 200, 'linear')!;
    expect(Math.round(est.lag)).toBe(37);
    expect(Math.abs(est.lag - 37)).toBeLessThan(0.5);
    const back = crossCorrelationLag(y, x, 200, 'linear')!;
    expect(Math.round(back.lag)).toBe(-37);
    let peak = 0;
    for (let n = 0; n <= 962; n++) peak += x[n]! * x[n]!;
    expect(peak).toBeCloseTo(75.68664602, 7);
    // at fs = 500 Hz that is 74 ms
    expect((Math.round(est.lag) / 500) * 1000).toBe(74);
  });

  it('X2: interpolates a Gaussian delay of 10.3 samples exactly through ln r, 10.29925 linearly', () => {
    const x = Float64Array.from({ length: 256 }, (_, n) => Math.exp(-(((n - 100) / 8) ** 2)));
    const y = Float64Array.from({ length: 256 }, (_, n) => Math.exp(-(((n - 110.3) / 8) ** 2)));
    expect(Math.abs(crossCorrelationLag(x, y, 40, 'log')!.lag - 10.3)).toBeLessThan(1e-9);
    expect(Math.abs(crossCorrelationLag(x, y, 40, 'linear')!.lag - 10.29925)).toBeLessThan(1e-5);
  });

  it('returns null for too short a signal', () => {
    expect(crossCorrelationLag([1], [1], 5)).toBeNull();
  });
});
