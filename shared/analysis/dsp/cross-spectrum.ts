import { RealFft, realFft } from './real-fft';
import { hannPeriodic } from './window';

/**
 * Welch-averaged auto- and cross-spectra of an input x and an output y (Hann window, 50 %
 * overlap, each segment's mean removed), kept up to `maxHz`. Sums are left unscaled: the
 * frequency response and coherence built from them are ratios, and the scale cancels.
 */
export interface CrossSpectra {
  hz: Float64Array;
  /** Σ |X|², Σ |Y|² and Σ conj(X)·Y over segments, per bin. */
  gxx: Float64Array;
  gyy: Float64Array;
  gxyRe: Float64Array;
  gxyIm: Float64Array;
  df: number;
  segments: number;
}

export function crossSpectra(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  fs: number,
  nperseg: number,
  ranges: readonly (readonly [number, number])[],
  maxHz: number,
): CrossSpectra {
  const n = nperseg;
  const step = n >> 1;
  const df = fs / n;
  const bins = Math.min(n >> 1, Math.floor(maxHz / df)) + 1;
  const w = hannPeriodic(n);
  const fx = realFft(n);
  // A second instance: the cached one's output buffer still holds X when Y is transformed.
  const fy = new RealFft(n);
  const sx = new Float64Array(n);
  const sy = new Float64Array(n);
  const gxx = new Float64Array(bins);
  const gyy = new Float64Array(bins);
  const gxyRe = new Float64Array(bins);
  const gxyIm = new Float64Array(bins);
  let segments = 0;
  for (let ri = 0; ri < ranges.length; ri++) {
    const r0 = Math.max(0, ranges[ri]![0]);
    const r1 = Math.min(ranges[ri]![1], x.length, y.length);
    for (let s = r0; s + n <= r1; s += step) {
      let mx = 0;
      let my = 0;
      for (let i = 0; i < n; i++) {
        mx += x[s + i]!;
        my += y[s + i]!;
      }
      // A segment with a missing value (NaN) would poison the average: leave it out.
      if (!Number.isFinite(mx + my)) continue;
      mx /= n;
      my /= n;
      for (let i = 0; i < n; i++) {
        sx[i] = (x[s + i]! - mx) * w[i]!;
        sy[i] = (y[s + i]! - my) * w[i]!;
      }
      const X = fx.transformInPlace(sx);
      const Y = fy.transformInPlace(sy);
      for (let k = 0; k < bins; k++) {
        const xr = X[2 * k]!;
        const xi = X[2 * k + 1]!;
        const yr = Y[2 * k]!;
        const yi = Y[2 * k + 1]!;
        gxx[k]! += xr * xr + xi * xi;
        gyy[k]! += yr * yr + yi * yi;
        gxyRe[k]! += xr * yr + xi * yi;
        gxyIm[k]! += xr * yi - xi * yr;
      }
      segments++;
    }
  }
  const hz = Float64Array.from({ length: bins }, (_, k) => k * df);
  return { hz, gxx, gyy, gxyRe, gxyIm, df, segments };
}
