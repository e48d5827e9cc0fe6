import { describe, expect, it } from 'vitest';
import { welch } from '../../../../shared/analysis/dsp/welch';
import { findPeaks, parabolicPeak } from '../../../../shared/analysis/dsp/peaks';

const fs = 1000;
const signal = (n: number, f: (t: number) => number) =>
  Float64Array.from({ length: n }, (_, i) => f(i / fs));
const welch256 = (
  x: Float64Array,
  scaling: 'density' | 'spectrum' = 'density',
  detrend: 'constant' | false = 'constant',
) => welch(x, fs, { nperseg: 256, noverlap: 128, scaling, detrend });

describe('peaks and harmonic interpolation (tests/REFERENCES.md §3; J. O. Smith, SASP)', () => {
  const harmonics = (f0: number) =>
    signal(
      4096,
      (t) =>
        Math.sin(2 * Math.PI * f0 * t) +
        0.5 * Math.sin(2 * Math.PI * 2 * f0 * t) +
        0.2 * Math.sin(2 * Math.PI * 3 * f0 * t),
    );

  it('P1: finds bin-centred harmonics at 97.66, 195.31, 292.97 Hz with heights 0.5, 0.125, 0.02', () => {
    const peaks = findPeaks(welch256(harmonics(97.65625), 'spectrum'), { minValue: 0.01 });
    expect(peaks.map((p) => p.bin)).toEqual([25, 50, 75]);
    peaks.forEach((p, i) => expect(p.hz / 97.65625).toBeCloseTo(i + 1, 9));
    expect(peaks.map((p) => 10 ** (p.db / 10))).toEqual([
      expect.closeTo(0.5, 9),
      expect.closeTo(0.125, 9),
      expect.closeTo(0.02, 9),
    ]);
  });

  it('P2: interpolates a 100 Hz rotor and its harmonics to scipy-derived frequencies and heights', () => {
    const peaks = findPeaks(welch256(harmonics(100), 'spectrum'), { minValue: 0.01 });
    expect(peaks.map((p) => p.bin)).toEqual([26, 51, 77]);
    const hz = [99.95258, 200.05418, 299.94582];
    const h = [0.52544, 0.12665, 0.02026];
    peaks.forEach((p, i) => {
      expect(Math.abs(p.hz / hz[i]! - 1)).toBeLessThan(1e-6);
      // heights printed to 5 decimals
      expect(Math.abs(10 ** (p.db / 10) - h[i]!)).toBeLessThan(1e-5);
      expect(Math.abs(p.hz / 100 - (i + 1))).toBeLessThan(0.01);
    });
  });

  it('parabola offset is ½(α−γ)/(α−2β+γ) and zero for a symmetric triple', () => {
    expect(parabolicPeak(-3, 0, -3).p).toBeCloseTo(0, 15);
    expect(parabolicPeak(-1, 0, -3).p).toBeCloseTo(-0.25, 12);
  });

  it('ignores a flat spectrum', () => {
    const flat = {
      hz: Float64Array.from({ length: 64 }, (_, i) => i),
      psd: new Float64Array(64).fill(1),
      df: 1,
      segments: 1,
    };
    expect(findPeaks(flat)).toEqual([]);
  });
});
