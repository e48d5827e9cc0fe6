import { toDb, type PowerSpectrum } from './welch';

/** Offset in bins and height of the parabola through three dB values (J. O. Smith, quadratic interpolation). */
export function parabolicPeak(
  alpha: number,
  beta: number,
  gamma: number,
): { p: number; height: number } {
  const den = alpha - 2 * beta + gamma;
  if (den >= 0 || !Number.isFinite(den)) return { p: 0, height: beta };
  const p = (0.5 * (alpha - gamma)) / den;
  return { p, height: beta - 0.25 * (alpha - gamma) * p };
}

export interface SpectralPeak {
  /** Interpolated frequency, Hz. */
  hz: number;
  /** Interpolated height, dB of the spectrum's own unit. */
  db: number;
  /** Bin of the raw local maximum. */
  bin: number;
  /** Height above the local floor (median of the neighbourhood), dB. */
  prominenceDb: number;
}

export interface PeakOptions {
  /** Lowest frequency searched, Hz. */
  minHz?: number;
  /** Minimum height above the neighbourhood median, dB. */
  minProminenceDb?: number;
  /** Keep at most this many, loudest first. */
  max?: number;
  /** Half-width of the neighbourhood used for the floor, bins. */
  floorHalfWidth?: number;
  /** Absolute floor on the raw (linear) bin value, to ignore numerical dust. */
  minValue?: number;
}

/**
 * Local maxima of a spectrum, interpolated on the dB scale, loudest first. A peak must stand
 * `minProminenceDb` above the median of its neighbourhood so broadband hills don't count.
 */
export function findPeaks(spec: PowerSpectrum, options: PeakOptions = {}): SpectralPeak[] {
  const { minHz = 0, minProminenceDb = 6, max = 8, floorHalfWidth = 16, minValue = 0 } = options;
  const p = spec.psd;
  const n = p.length;
  const db = new Float64Array(n);
  for (let k = 0; k < n; k++) db[k] = toDb(p[k]!);
  const found: SpectralPeak[] = [];
  const scratch: number[] = [];
  for (let k = 1; k < n - 1; k++) {
    if (spec.hz[k]! < minHz) continue;
    const v = p[k]!;
    if (v <= minValue || !(v > p[k - 1]!) || !(v >= p[k + 1]!)) continue;
    scratch.length = 0;
    for (let j = Math.max(1, k - floorHalfWidth); j <= Math.min(n - 1, k + floorHalfWidth); j++) {
      if (Math.abs(j - k) > 2) scratch.push(db[j]!);
    }
    scratch.sort((a, b) => a - b);
    const floor = scratch.length ? scratch[scratch.length >> 1]! : -300;
    const prominence = db[k]! - floor;
    if (prominence < minProminenceDb) continue;
    const { p: off, height } = parabolicPeak(db[k - 1]!, db[k]!, db[k + 1]!);
    found.push({ hz: (k + off) * spec.df, db: height, bin: k, prominenceDb: prominence });
  }
  found.sort((a, b) => b.db - a.db);
  return found.slice(0, max);
}

/** Amplitude of a sine that would give this density peak: √(2·PSD·ENBW), ENBW = 1.5 bins for Hann. */
export function toneAmplitude(db: number, df: number, enbwBins = 1.5): number {
  return Math.sqrt(2 * 10 ** (db / 10) * enbwBins * df);
}
