import type { Column, ParsedLog } from '../log/types';
import type { Peak, PeakLabel } from './report-schema';
import type { CampbellMatrix, Spectrum } from './review-detail';
import { findPeaks, type SpectralPeak } from './dsp/peaks';
import { bandRms, chooseSegment, toDb, welch, type PowerSpectrum } from './dsp/welch';
import type { Ranges } from './segments';

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
/** Band RMS starts here (PRODUCT.md §7). */
const BAND_LO_HZ = 50;
const CAMPBELL_ROWS = 20;

export interface ChannelVibration {
  bandRms: number;
  peaks: (Peak & { prominenceDb: number })[];
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
  prominenceDb: number;
}

/** Prefix sums of a per-sample value, so any segment's mean is O(1). */
function prefixSums(rows: number, value: (i: number) => number): Float64Array {
  const p = new Float64Array(rows + 1);
  for (let i = 0; i < rows; i++) p[i + 1] = p[i]! + value(i);
  return p;
}

/** Quantile of a copy of the values (q in 0–1). */
function quantile(values: ArrayLike<number>, q: number): number {
  const s = Float64Array.from(values).sort();
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))]! : NaN;
}

/** Height of bin k above the median of its ±12-bin neighbourhood (excluding ±2), dB. */
function prominenceAt(db: ArrayLike<number>, k: number): number {
  const vals: number[] = [];
  for (let j = Math.max(1, k - 12); j <= Math.min(db.length - 1, k + 12); j++) {
    if (Math.abs(j - k) > 2 && Number.isFinite(db[j]!)) vals.push(db[j]!);
  }
  if (!vals.length) return 0;
  vals.sort((a, b) => a - b);
  let top = -Infinity;
  for (let j = Math.max(0, k - 1); j <= Math.min(db.length - 1, k + 1); j++)
    top = Math.max(top, db[j]!);
  return top - vals[vals.length >> 1]!;
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
  const rowSource: ((i: number) => number) | null =
    by === 'rpm'
      ? (i) => {
          let s = 0;
          for (const r of rpms!) s += r[i]!;
          return s / rpms!.length;
        }
      : throttle
        ? (i) => throttle[i]!
        : input.collective
          ? (i) => input.collective![i]!
          : null;
  const rowPrefix = rowSource ? prefixSums(log.rows, rowSource) : null;
  const motorPrefix = rpms ? rpms.map((r) => prefixSums(log.rows, (i) => r[i]!)) : null;
  const segValue = (s: number) =>
    rowPrefix ? (rowPrefix[s + nperseg]! - rowPrefix[s]!) / nperseg : NaN;

  // First pass: the row variable of every segment, to set the Campbell rows.
  const step = nperseg >> 1;
  const values: number[] = [];
  for (const [a, b] of ranges)
    for (let s = a; s + nperseg <= b; s += step) values.push(segValue(s));
  const lo = quantile(values, 0.02);
  const hi = quantile(values, 0.98);
  const rowsOk = rowPrefix && Number.isFinite(lo) && hi > lo;
  const rowWidth = rowsOk ? (hi - lo) / CAMPBELL_ROWS : 1;
  const bins = (nperseg >> 1) + 1;
  const campAcc = rowsOk
    ? Array.from({ length: CAMPBELL_ROWS }, () => new Float64Array(bins))
    : null;
  const campCount = new Float64Array(CAMPBELL_ROWS);
  const rowOf = (v: number) =>
    Math.min(CAMPBELL_ROWS - 1, Math.max(0, Math.floor((v - lo) / rowWidth)));
  // Order tracking per motor: gyro power at each motor's own 1× and 2× line, summed over segments.
  const orderEnergy = rpms ? rpms.map(() => [0, 0]) : null;
  const df = fs / nperseg;

  for (const name of VIBRATION_CHANNELS) {
    const col = log.columns[name];
    if (!col) continue;
    const isGyro = GYRO.has(name);
    const first = name === 'gyro_x' || (!log.columns.gyro_x && isGyro);
    const spectrum = welch(col, fs, {
      nperseg,
      ranges,
      onSegment:
        isGyro && (campAcc || orderEnergy)
          ? (s, est) => {
              if (campAcc) {
                const v = segValue(s);
                if (v >= lo && v <= hi) {
                  const r = rowOf(v);
                  const acc = campAcc[r]!;
                  for (let k = 0; k < bins; k++) acc[k]! += est[k]!;
                  if (first) campCount[r]!++;
                }
              }
              if (orderEnergy && motorPrefix) {
                motorPrefix.forEach((p, m) => {
                  const f = (p[s + nperseg]! - p[s]!) / nperseg / 60;
                  for (let h = 1; h <= 2; h++) {
                    const k = Math.round((h * f) / df);
                    if (k > 0 && k < bins) orderEnergy[m]![h - 1]! += est[k]!;
                  }
                });
              }
            }
          : undefined,
    });
    const raw = findPeaks(spectrum, {
      minHz: MIN_PEAK_HZ,
      minProminenceDb: input.prominenceDb,
      max: 8,
    });
    channels[name] = {
      bandRms: bandRms(spectrum, BAND_LO_HZ),
      spectrum,
      peaks: raw.map((p) => ({ hz: p.hz, db: p.db, label: null, prominenceDb: p.prominenceDb })),
    };
  }

  let campbell: CampbellMatrix | null = null;
  let rowDb: Float64Array[] = [];
  let rowCentres: number[] = [];
  if (campAcc) {
    rowCentres = Array.from({ length: CAMPBELL_ROWS }, (_, r) => lo + (r + 0.5) * rowWidth);
    rowDb = campAcc.map((acc, r) => {
      const c = campCount[r]!;
      return Float64Array.from(acc, (v) => (c > 0 ? toDb(v / c) : NaN));
    });
    const hz = Array.from({ length: bins }, (_, k) => k * df);
    campbell = {
      by,
      rows: rowCentres,
      hz,
      db: rowDb.map((r) => Array.from(r)),
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

  const rotorHz = by === 'rpm' && values.length ? quantile(values, 0.5) / 60 : null;
  const counted = Array.from(campCount, (c, r) => (c > 0 ? r : -1)).filter((r) => r >= 0);
  for (const ch of Object.values(channels)) {
    for (const peak of ch.peaks) {
      const verdict = labelPeak(peak.hz, {
        rotorHz,
        blades,
        df,
        rows: counted.map((r) => ({ value: rowCentres[r]!, db: rowDb[r]! })),
        by,
      });
      peak.label = verdict;
      if (orderEnergy && (verdict === 'rotor-1x' || verdict === 'rotor-2x')) {
        const h = verdict === 'rotor-1x' ? 0 : 1;
        const e = orderEnergy.map((o) => o[h]!);
        const order = e.map((v, i) => [v, i] as const).sort((a, b) => b[0] - a[0]);
        const rest = e.filter((_, i) => i !== order[0]![1]);
        const restMean = rest.reduce((a, b) => a + b, 0) / Math.max(1, rest.length);
        // Attribute only when one motor's own order line clearly carries the energy.
        if (order[0] && order[0][0] > 2 * restMean) peak.motor = order[0][1] + 1;
      }
    }
  }
  return { channels, campbell, rotorHz, df };
}

interface LabelContext {
  rotorHz: number | null;
  blades: number;
  df: number;
  rows: { value: number; db: Float64Array }[];
  by: 'rpm' | 'throttle';
}

/**
 * rotor-1x / blade-pass / rotor-2x when the peak sits on that order of the typical rotor
 * speed and, where the flight covered other speeds, the energy moved with the rotor; `frame`
 * when the peak holds its frequency across rows of different rotor speed or throttle.
 */
export function labelPeak(hz: number, ctx: LabelContext): PeakLabel {
  const { rotorHz, blades, df, rows, by } = ctx;
  const tol = (h: number) => Math.max(1.5 * df, 0.04 * h * (rotorHz ?? 0));
  const orders: [Exclude<PeakLabel, null | 'frame'>, number][] = [
    ['rotor-1x', 1],
    ['blade-pass', blades],
    ['rotor-2x', 2],
  ];
  const match = rotorHz ? orders.find(([, h]) => Math.abs(hz - h * rotorHz) <= tol(h)) : undefined;
  const k = Math.round(hz / df);
  // Rows whose own order line is well away from this frequency test rotor vs frame.
  let frameVotes = 0;
  let rotorVotes = 0;
  let far = 0;
  for (const row of rows) {
    if (k <= 0 || k >= row.db.length) continue;
    if (match && by === 'rpm') {
      const kOrder = Math.round((match[1] * row.value) / 60 / df);
      if (Math.abs(kOrder - k) <= 3 || kOrder <= 0 || kOrder >= row.db.length) continue;
      far++;
      if (prominenceAt(row.db, kOrder) >= 6) rotorVotes++;
      if (prominenceAt(row.db, k) >= 6) frameVotes++;
    } else {
      far++;
      if (prominenceAt(row.db, k) >= 6) frameVotes++;
    }
  }
  if (match) {
    if (far >= 2 && frameVotes > rotorVotes && frameVotes >= Math.max(2, far / 2)) return 'frame';
    return match[0];
  }
  if (far >= 3 && frameVotes >= Math.max(3, 0.6 * far)) return 'frame';
  return null;
}

/** Spectrum in the ReviewDetail shape (plain arrays, dB). */
export function toReviewSpectrum(spec: PowerSpectrum): Spectrum {
  return { hz: Array.from(spec.hz), db: Array.from(spec.psd, (p) => toDb(p)) };
}

export type { SpectralPeak };
