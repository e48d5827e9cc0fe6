import { parabolicPeak } from './peaks';

export interface LagEstimate {
  /** Lag in samples at which Σ y[n]·x[n−lag] peaks, interpolated; positive when y trails x. */
  lag: number;
  /** Correlation at the integer peak divided by √(Σx²·Σy²) over the overlap, −1…1. */
  normalised: number;
}

/**
 * Time-delay estimate from the cross-correlation peak (Knapp & Carter 1976), searched over
 * |lag| ≤ maxLag by direct sums (cheap for short lag ranges on long signals). Sub-sample
 * interpolation fits a parabola through ln r at the peak and its neighbours (exact for
 * Gaussian-shaped correlations), or through r itself when those are not all positive.
 */
export function crossCorrelationLag(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  maxLag: number,
  interpolation: 'log' | 'linear' = 'log',
): LagEstimate | null {
  const n = Math.min(x.length, y.length);
  if (n < 3) return null;
  const m = Math.min(maxLag, n - 2);
  const r = new Float64Array(2 * m + 1);
  for (let lag = -m; lag <= m; lag++) {
    let s = 0;
    const i0 = Math.max(0, lag);
    const i1 = Math.min(n, n + lag);
    for (let i = i0; i < i1; i++) s += y[i]! * x[i - lag]!;
    r[lag + m] = s;
  }
  let best = 0;
  for (let k = 1; k < r.length; k++) if (r[k]! > r[best]!) best = k;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += x[i]! * x[i]!;
    sy += y[i]! * y[i]!;
  }
  const normalised = sx > 0 && sy > 0 ? r[best]! / Math.sqrt(sx * sy) : 0;
  let lag = best - m;
  if (best > 0 && best < r.length - 1) {
    const a = r[best - 1]!;
    const b = r[best]!;
    const c = r[best + 1]!;
    const fit =
      interpolation === 'log' && a > 0 && b > 0 && c > 0
        ? parabolicPeak(Math.log(a), Math.log(b), Math.log(c))
        : parabolicPeak(a, b, c);
    lag += fit.p;
  }
  return { lag, normalised };
}
