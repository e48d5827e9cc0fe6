import { describe, expect, it } from 'vitest';
import { RealFft } from '../../../../shared/analysis/dsp/real-fft';
import { hannPeriodic } from '../../../../shared/analysis/dsp/window';
import { parkMiller } from '../park-miller';

describe('fft.js wrapper', () => {
  it('matches a direct DFT on small sizes', () => {
    for (const n of [2, 4, 8, 16, 32, 64]) {
      const rand = parkMiller(7);
      const x = Float64Array.from({ length: n }, () => rand() / 2147483647 - 0.5);
      const { re, im } = new RealFft(n).spectrum(x);
      for (let k = 0; k <= n / 2; k++) {
        let dr = 0;
        let di = 0;
        for (let j = 0; j < n; j++) {
          dr += x[j]! * Math.cos((-2 * Math.PI * k * j) / n);
          di += x[j]! * Math.sin((-2 * Math.PI * k * j) / n);
        }
        expect(re[k]).toBeCloseTo(dr, 12);
        expect(im[k]).toBeCloseTo(di, 12);
      }
    }
  });

  it('rejects sizes that are not a power of two', () => {
    expect(() => new RealFft(12)).toThrow(RangeError);
    expect(() => new RealFft(1)).toThrow(RangeError);
  });

  it('gives |X| = 64, 32, 32 for a Hann-windowed bin-25 sine, N = 256 (tests/REFERENCES.md §1, computed)', () => {
    const w = hannPeriodic(256);
    const x = Float64Array.from(w, (v, n) => v * Math.sin((2 * Math.PI * 25 * n) / 256));
    const p = new Float64Array(129);
    new RealFft(256).powerSpectrum(x, p);
    expect(Math.sqrt(p[25]!)).toBeCloseTo(64, 10);
    expect(Math.sqrt(p[24]!)).toBeCloseTo(32, 10);
    expect(Math.sqrt(p[26]!)).toBeCloseTo(32, 10);
    for (let k = 0; k < 129; k++)
      if (k < 24 || k > 26) expect(Math.sqrt(p[k]!)).toBeLessThan(1e-10);
  });
});
