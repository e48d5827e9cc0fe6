import type { Column, ParsedLog } from '../log/types';
import type { Peak } from '../schemas/report';
import type { CampbellMatrix, Spectrum } from './review-detail';
import { findPeaks, type SpectralPeak } from './dsp/peaks';
import { bandRms, chooseSegment, toDb, welch, type PowerSpectrum } from './dsp/welch';
import type { Ranges } from './segments';
import { attributeOrder } from './order-tracking';
import { labelPeak } from './peak-labels';

export const VIBRATION_CHANNELS = [
  'gyro_x',
  'gyro_y',
  'gyro_z',
  'acc_x',
  'acc_y',
  'acc_z',
] as const;
const GYRO = new Set(['gyro_x', 'gyro_y', 'gyro_z']);
/** Lowest frequency searched for peaks, Hz: below this is the flying itself, not vibration. */
const MIN_PEAK_HZ = 20;
/** Band RMS starts here (shared/README.md §7). */
const BAND_LO_HZ = 50;
const CAMPBELL_ROWS = 20;

export interface ChannelVibration {
  bandRms: number;
  peaks: (Peak & { prominenceDb: number; amplitude: number })[];
  spectrum: PowerSpectrum;
}

export interface VibrationResult {
  channels: Record<string, ChannelVibration>;
  campbell: CampbellMatrix | null;
  /** Typical rotor rotation frequency during the analysed stretch, Hz (null without rpm). */
  rotorHz: number | null;
  /** Welch bin spacing, Hz. */
  df: number;
}

export interface VibrationInput {
  log: ParsedLog;
  /** Where to look: armed time (vibration of a stopped aircraft is just sensor noise). */
  ranges: Ranges;
  /** rpm per motor, when logged. */
  rpms: readonly Column[] | null;
  /** Mean motor output per sample, the throttle stand-in when neither rpm nor throttle is logged. */
  collective: ArrayLike<number> | null;
  blades: number;
  /** Magnet poles of the motors, when known. */
  poles?: number;
  prominenceDb: number;
}

/**
 * Mean of some columns over every Welch segment (length n, hop n/2) of the ranges, in the order
 * Welch visits them, from sums over half-segment chunks: one pass over the data, no per-sample
 * arrays. Missing values (NaN) are left out of the mean.
 */
function segmentMeans(cols: readonly ArrayLike<number>[], ranges: Ranges, n: number): Float64Array {
  const step = n >> 1;
  const out: number[] = [];
  for (let ri = 0; ri < ranges.length; ri++) {
    const a = ranges[ri]![0];
    const b = ranges[ri]![1];
    const chunks = Math.floor((b - a) / step);
    const sum = new Float64Array(chunks);
    const cnt = new Float64Array(chunks);
    for (let j = 0; j < chunks; j++) {
      let s = 0;
      let c = 0;
      for (const col of cols) {
        for (let i = a + j * step, end = i + step; i < end; i++) {
          const v = col[i]!;
          if (v === v) {
            s += v;
            c++;
          }
        }
      }
      sum[j] = s;
      cnt[j] = c;
    }
    for (let j = 0; a + j * step + n <= b; j++) {
      const c = cnt[j]! + cnt[j + 1]!;
      out.push(c > 0 ? (sum[j]! + sum[j + 1]!) / c : NaN);
    }
  }
  return Float64Array.from(out);
}

/** Quantile of a copy of the values (q in 0–1). */
function quantile(values: ArrayLike<number>, q: number): number {
  const s = Float64Array.from(values)
    .filter((v) => v === v)
    .sort();
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))]! : NaN;
}

/**
 * Welch spectra, band RMS and labelled peaks per gyro and accelerometer axis, plus the Campbell
 * matrix from the same short-time spectra (no extra FFTs): each Welch segment of the gyro adds
 * its spectrum to the row of its mean rotor speed (or throttle).
 */
export function analyseVibration(input: VibrationInput): VibrationResult {
  const { log, rpms, blades } = input;
  const fs = log.sampleRateHz;
  const longest = input.ranges.reduce((m, [a, b]) => Math.max(m, b - a), 0);
  const nperseg = chooseSegment(fs, longest);
  const ranges = input.ranges.filter(([a, b]) => b - a >= nperseg);
  const channels: Record<string, ChannelVibration> = {};
  if (nperseg < 16 || ranges.length === 0 || !(fs > 0)) {
    return { channels, campbell: null, rotorHz: null, df: fs / Math.max(1, nperseg) };
  }

  // Row variable per segment: mean rpm over motors, else throttle, else collective.
  const throttle = log.columns.throttle;
  const by: 'rpm' | 'throttle' = rpms && rpms.length ? 'rpm' : 'throttle';
  const rowSource: readonly ArrayLike<number>[] | null =
    by === 'rpm' ? rpms! : throttle ? [throttle] : input.collective ? [input.collective] : null;
  const step = nperseg >> 1;
  const segIndex = new Map<number, number>();
  for (const [a, b] of ranges)
    for (let s = a; s + nperseg <= b; s += step) segIndex.set(s, segIndex.size);
  const motorSeg = rpms ? rpms.map((r) => segmentMeans([r], ranges, nperseg)) : null;
  // The row variable of every segment, to set the Campbell rows (rpm: mean of the motors').
  const values: Float64Array =
    by === 'rpm' && motorSeg
      ? Float64Array.from(
          motorSeg[0]!,
          (_, j) => motorSeg.reduce((t, m) => t + m[j]!, 0) / motorSeg.length,
        )
      : rowSource
        ? segmentMeans(rowSource, ranges, nperseg)
        : new Float64Array(segIndex.size).fill(NaN);
  // Rows span every segment's value: a short punch-out at the top speed still gets its row, so
  // a line it alone excites can be traced to the rotors.
  const lo = quantile(values, 0);
  const hi = quantile(values, 1);
  const rowsOk = rowSource !== null && Number.isFinite(lo) && hi > lo;
  const rowWidth = rowsOk ? (hi - lo) / CAMPBELL_ROWS : 1;
  const bins = (nperseg >> 1) + 1;
  const rowOf = (v: number) =>
    Math.min(CAMPBELL_ROWS - 1, Math.max(0, Math.floor((v - lo) / rowWidth)));
  const df = fs / nperseg;
  // Short-time spectra binned by the row variable, kept per channel so each channel's peaks are
  // judged on its own rows; the Campbell matrix drawn is the sum over the gyro axes.
  const rowAcc: Record<string, Float64Array[]> = {};
  const rowCount = new Float64Array(CAMPBELL_ROWS);
  const rowValueSum = new Float64Array(CAMPBELL_ROWS);

  // Each segment's Campbell row, counted once (the channels share the segment grid).
  const segRow = new Int32Array(segIndex.size).fill(-1);
  if (rowsOk) {
    for (const j of segIndex.values()) {
      const v = values[j]!;
      if (!(v >= lo && v <= hi)) continue;
      const r = rowOf(v);
      segRow[j] = r;
      rowCount[r]!++;
      rowValueSum[r]! += v;
    }
  }
  const rowOfSegment = (s: number) => segRow[segIndex.get(s) ?? -1] ?? -1;

  for (const name of VIBRATION_CHANNELS) {
    const col = log.columns[name];
    if (!col) continue;
    const acc = rowsOk ? Array.from({ length: CAMPBELL_ROWS }, () => new Float64Array(bins)) : null;
    if (acc) rowAcc[name] = acc;
    const spectrum = welch(col, fs, {
      nperseg,
      ranges,
      ...(acc ? { binInto: { rowOf: rowOfSegment, rows: acc } } : {}),
    });
    const raw = findPeaks(spectrum, {
      minHz: MIN_PEAK_HZ,
      minProminenceDb: input.prominenceDb,
      max: 8,
    });
    channels[name] = {
      bandRms: bandRms(spectrum, BAND_LO_HZ),
      spectrum,
      peaks: raw.map((p) => ({
        hz: p.hz,
        db: p.db,
        label: null,
        prominenceDb: p.prominenceDb,
        amplitude: peakAmplitude(spectrum, p.bin),
      })),
    };
  }

  const rowCentres = Array.from({ length: CAMPBELL_ROWS }, (_, r) => lo + (r + 0.5) * rowWidth);
  const counted = Array.from(rowCount, (c, r) => (c > 0 ? r : -1)).filter((r) => r >= 0);
  const rowMean = (acc: Float64Array[]) =>
    acc.map((row, r) => {
      const c = rowCount[r]!;
      return Float64Array.from(row, (v) => (c > 0 ? v / c : NaN));
    });
  const rowDb = (acc: Float64Array[]) =>
    rowMean(acc).map((row) => Float64Array.from(row, (v) => (v === v ? toDb(v) : NaN)));
  let campbell: CampbellMatrix | null = null;
  const gyroRows = Object.entries(rowAcc).filter(([n]) => GYRO.has(n));
  if (rowsOk && gyroRows.length) {
    const total = Array.from({ length: CAMPBELL_ROWS }, () => new Float64Array(bins));
    for (const [, acc] of gyroRows)
      acc.forEach((row, r) => row.forEach((v, k) => (total[r]![k]! += v)));
    campbell = {
      by,
      rows: rowCentres,
      hz: Array.from({ length: bins }, (_, k) => k * df),
      db: rowDb(total).map((r) => Array.from(r)),
      orders:
        by === 'rpm'
          ? (
              [
                ['rotor-1x', 1],
                ['rotor-2x', 2],
                ['blade-pass', blades],
              ] as const
            ).map(([label, h]) => ({
              label,
              points: [lo, hi].map((rpm) => [rpm, (h * rpm) / 60] as [number, number]),
            }))
          : [],
    };
  }

  // Each motor's typical rotation frequency over the analysed stretch (median of segment means).
  const motorHz: number[] = [];
  if (motorSeg) for (const m of motorSeg) motorHz.push(quantile(m, 0.5) / 60);
  const rotorHz = motorHz.length ? motorHz.reduce((a, b) => a + b, 0) / motorHz.length : null;
  const attribution = new Map<number, ReturnType<typeof attributeOrder> | null>();
  for (const [name, ch] of Object.entries(channels)) {
    const powRows = rowAcc[name] ? rowMean(rowAcc[name]) : [];
    const dbRows = powRows.map((row) => Float64Array.from(row, (v) => (v === v ? toDb(v) : NaN)));
    for (const peak of ch.peaks) {
      const verdict = labelPeak(peak.hz, {
        motorHz,
        ...(motorSeg ? { motorSegHz: motorSeg.map((m) => m.map((v) => v / 60)) } : {}),
        blades,
        df,
        fs,
        ...(input.poles ? { poles: input.poles } : {}),
        rows: counted.map((r) => ({
          value: rowValueSum[r]! / rowCount[r]!,
          db: dbRows[r]!,
          power: powRows[r]!,
          count: rowCount[r]!,
        })),
        rowWidth,
        by,
      });
      peak.label = verdict.label;
      if (verdict.aliasOfHz !== undefined) peak.aliasOfHz = verdict.aliasOfHz;
      if (verdict.motor) peak.motor = verdict.motor;
      else if (
        rpms &&
        rpms.length > 1 &&
        (verdict.label === 'rotor-1x' || verdict.label === 'rotor-2x')
      ) {
        const h = verdict.label === 'rotor-1x' ? 1 : 2;
        let a = attribution.get(h);
        if (a === undefined) {
          const gyro = ['gyro_x', 'gyro_y', 'gyro_z'].flatMap((c) =>
            log.columns[c] ? [log.columns[c]!] : [],
          );
          a = gyro.length ? attributeOrder(gyro, rpms, ranges, fs, h) : null;
          attribution.set(h, a);
        }
        if (a?.motor) peak.motor = a.motor;
        else if (a?.candidates.length) peak.candidates = a.candidates;
      }
    }
  }
  return { channels, campbell, rotorHz, df };
}

/**
 * Amplitude of the vibration under a peak in channel units: √(2·Σ PSD·Δf) over the peak's bin
 * ±3 (the Hann main lobe and a little more). For a pure tone that is its amplitude (Parseval);
 * for a resonance with some width it counts the whole hump, not just the top bin.
 */
export function peakAmplitude(spec: PowerSpectrum, bin: number): number {
  let s = 0;
  for (let k = Math.max(1, bin - 3); k <= Math.min(spec.psd.length - 1, bin + 3); k++)
    s += spec.psd[k]!;
  return Math.sqrt(2 * s * spec.df);
}

/** Spectrum in the ReviewDetail shape (plain arrays, dB). */
export function toReviewSpectrum(spec: PowerSpectrum): Spectrum {
  return { hz: Array.from(spec.hz), db: Array.from(spec.psd, (p) => toDb(p)) };
}

export type { SpectralPeak };
