import { realFft } from './real-fft';
import { hannPeriodic, windowFigures } from './window';

export interface WelchOptions {
  /** Segment length, a power of two. */
  nperseg: number;
  /** Samples shared by neighbouring segments; default half a segment (50 % overlap). */
  noverlap?: number;
  /** Remove each segment's mean before windowing (scipy's default 'constant'). */
  detrend?: 'constant' | false;
  /** 'density': unit²/Hz (default); 'spectrum': unit², a bin-centred sine of amplitude A reads A²/2. */
  scaling?: 'density' | 'spectrum';
  /** Sample ranges [start, end) to draw segments from; default the whole signal. */
  ranges?: readonly (readonly [number, number])[];
  /** Called with each segment's own one-sided estimate (a scratch buffer: copy what you keep). */
  onSegment?: (start: number, estimate: Float64Array) => void;
  /**
   * Short-time spectra summed by group (a Campbell diagram's rows): each segment's own estimate
   * is added to `rows[rowOf(start)]`, or to none when rowOf returns −1, in the same pass that
   * sums the average.
   */
  binInto?: { rowOf: (start: number) => number; rows: readonly Float64Array[] };
}

export interface PowerSpectrum {
  /** Bin frequencies, Hz, 0…fs/2. */
  hz: Float64Array;
  /** One-sided estimate per bin in the chosen scaling. */
  psd: Float64Array;
  /** Bin spacing, Hz. */
  df: number;
  /** Segments averaged; 0 when the signal was shorter than one segment (psd is then all 0). */
  segments: number;
}

/**
 * Welch's averaged modified periodogram (Welch 1967) with a periodic Hann window, one-sided,
 * the same conventions as scipy.signal.welch: DC and Nyquist bins are not doubled, only whole
 * segments are used.
 */
export function welch(x: ArrayLike<number>, fs: number, options: WelchOptions): PowerSpectrum {
  const n = options.nperseg;
  const step = n - (options.noverlap ?? n >> 1);
  if (step <= 0) throw new RangeError('noverlap must be smaller than nperseg');
  const fft = realFft(n);
  const w = hannPeriodic(n);
  const fig = windowFigures(w);
  const density = (options.scaling ?? 'density') === 'density';
  const norm = density ? 1 / (fs * fig.sumSq) : 1 / (fig.sum * fig.sum);
  const half = n >> 1;
  const bins = half + 1;
  const acc = new Float64Array(bins);
  const seg = new Float64Array(n);
  const pow = new Float64Array(bins);
  const scale = new Float64Array(bins);
  for (let k = 0; k < bins; k++) scale[k] = k === 0 || k === half ? norm : 2 * norm;
  const detrend = (options.detrend ?? 'constant') === 'constant';
  // Removing the mean before windowing only changes the bins where the window's own DFT is
  // non-zero (bins 0 and 1 for a periodic Hann, tests/REFERENCES.md §1: [N/2, −N/4, 0, …]), so the
  // mean comes off those bins after the transform instead of off every sample before it.
  const wBins: number[] = [];
  const wRe: number[] = [];
  const wIm: number[] = [];
  if (detrend) {
    for (let k = 0; k < bins; k++) {
      let re = 0;
      let im = 0;
      for (let i = 0; i < n; i++) {
        const a = (-2 * Math.PI * k * i) / n;
        re += w[i]! * Math.cos(a);
        im += w[i]! * Math.sin(a);
      }
      if (Math.hypot(re, im) > 1e-9 * fig.sum) {
        wBins.push(k);
        wRe.push(re);
        wIm.push(im);
      }
      // Past the main lobe a window this smooth has nothing left worth correcting.
      if (k > 8 && wBins.length && k > wBins[wBins.length - 1]! + 8) break;
    }
  }
  const ranges = options.ranges ?? [[0, x.length] as const];
  const onSegment = options.onSegment;
  const binInto = options.binInto;
  const perSegment = onSegment !== undefined || binInto !== undefined;
  let count = 0;
  // Indexed range loops (here and in the other per-sample passes): a destructuring for-of
  // around a sample loop kept V8 from unboxing its doubles (measured: 2× slower, with garbage).
  for (let ri = 0; ri < ranges.length; ri++) {
    const r0 = ranges[ri]![0];
    const r1 = ranges[ri]![1];
    for (let s = Math.max(0, r0); s + n <= Math.min(r1, x.length); s += step) {
      // One read of the signal: window it and sum it.
      let sum = 0;
      for (let i = 0; i < n; i++) {
        const v = x[s + i]!;
        seg[i] = v * w[i]!;
        sum += v;
      }
      // A segment with a missing value (NaN) would poison the average: leave it out.
      if (!Number.isFinite(sum)) continue;
      const out = fft.transformInPlace(seg);
      if (detrend) {
        const mean = sum / n;
        for (let j = 0; j < wBins.length; j++) {
          const k = wBins[j]!;
          out[2 * k]! -= mean * wRe[j]!;
          out[2 * k + 1]! -= mean * wIm[j]!;
        }
      }
      if (perSegment) {
        // Each segment's own estimate is wanted: scale as we go, in one pass over the bins.
        const r = binInto ? binInto.rowOf(s) : -1;
        const row = r >= 0 ? binInto!.rows[r] : undefined;
        for (let k = 0; k < bins; k++) {
          const re = out[2 * k]!;
          const im = out[2 * k + 1]!;
          const p = (re * re + im * im) * scale[k]!;
          pow[k] = p;
          acc[k]! += p;
        }
        if (row) for (let k = 0; k < bins; k++) row[k]! += pow[k]!;
        if (onSegment) onSegment(s, pow);
      } else {
        for (let k = 0; k < bins; k++) {
          const re = out[2 * k]!;
          const im = out[2 * k + 1]!;
          acc[k]! += re * re + im * im;
        }
      }
      count++;
    }
  }
  // Segments summed raw are scaled once at the end; the others were scaled as they went.
  if (!perSegment) for (let k = 0; k < bins; k++) acc[k]! *= scale[k]!;
  if (count > 0) for (let k = 0; k < bins; k++) acc[k]! /= count;
  const hz = new Float64Array(bins);
  const df = fs / n;
  for (let k = 0; k < bins; k++) hz[k] = k * df;
  return { hz, psd: acc, df, segments: count };
}

/** 10·log10(p), floored at −300 dB so a zero bin stays finite for JSON and charts. */
export function toDb(p: number): number {
  return p > 1e-30 ? 10 * Math.log10(p) : -300;
}

/** RMS in channel units of everything in [fLo, fHi] of a one-sided density (Parseval). */
export function bandRms(spec: PowerSpectrum, fLo: number, fHi = Infinity): number {
  let s = 0;
  for (let k = 0; k < spec.psd.length; k++) {
    const f = spec.hz[k]!;
    if (f >= fLo && f <= fHi) s += spec.psd[k]!;
  }
  return Math.sqrt(s * spec.df);
}

/** Segment length giving bins of about 4 Hz (a rotor order at hover spans a few bins), within [64, 4096] and the data. */
export function chooseSegment(fs: number, available: number): number {
  let n = 64;
  while (n < 4096 && fs / n > 4 + 1e-9) n *= 2;
  while (n > 16 && n > available) n /= 2;
  return n;
}
