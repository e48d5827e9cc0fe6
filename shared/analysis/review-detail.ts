import type { Airframe } from '../schemas/airframe';

/**
 * What the review screens draw beyond the flight report: downsampled traces, spectra and the
 * Campbell matrix. Produced by the analysis engine in the worker (or on the server for stored
 * flights), consumed by the charts. Plain arrays of numbers so it survives JSON and
 * structured clone; traces are already downsampled to at most a few thousand points.
 */
export interface Trace {
  /** Seconds from the start of the log. */
  t: number[];
  /** One series per name, same length as `t`. */
  series: Record<string, number[]>;
}

export interface Spectrum {
  /** Bin centre frequencies, Hz. */
  hz: number[];
  /** 10·log10 of the one-sided PSD, (channel unit)²/Hz. */
  db: number[];
}

export interface ResponseCurve {
  hz: number[];
  gainDb: number[];
  phaseDeg: number[];
  /** Magnitude-squared coherence, 0–1. */
  coherence: number[];
}

export interface CampbellMatrix {
  /** What the rows are binned by. */
  by: 'rpm' | 'throttle';
  /** Row centres: mean rotor speed in rpm, or throttle as a 0–1 fraction. */
  rows: number[];
  /** Column centres, Hz. */
  hz: number[];
  /** db[row][col], NaN where no data fell into the row. */
  db: number[][];
  /** Rotor 1× and blade-pass lines to draw over it, as [row value, Hz] pairs. */
  orders: { label: 'rotor-1x' | 'rotor-2x' | 'blade-pass'; points: [number, number][] }[];
}

export interface ReviewDetail {
  /** time, throttle, collective, effort_roll, effort_pitch, effort_yaw, motor1…N. */
  effort: Trace;
  /**
   * Throttle and collective thinned for the flight strip (at most STRIP_POINTS points), added
   * by the analysis worker so the page never thins on the main thread. Absent in flights
   * stored by earlier versions.
   */
  strip?: Trace;
  /**
   * The geometry the analysis judged the flight against: the aircraft's own, or the preset it
   * assumed (then `report.airframe.assumed`). Absent in flights stored by earlier versions.
   */
  airframe?: Airframe;
  /** gyro_x/y/z and sp_roll/pitch/yaw when logged. */
  tracking: Trace | null;
  /** vbat, cell_v, ibat when logged. */
  power: Trace | null;
  /** Spectrum per vibration channel (gyro_x, …, acc_z). */
  spectra: Record<string, Spectrum>;
  campbell: CampbellMatrix | null;
  /**
   * Stick response per axis: gain (dB) and phase (deg) of the setpoint-to-gyro response and the
   * coherence behind each bin, about 0.25 Hz apart up to 100 Hz; null for an axis whose sticks
   * said too little. Absent in flights stored by earlier versions.
   */
  stickResponse?: Record<'roll' | 'pitch' | 'yaw', ResponseCurve | null> | null;
  /** Pattern diagnosis behind the balance numbers, in words, with a confidence 0–1. */
  diagnosis: {
    pattern: 'healthy' | 'cg-offset' | 'weak-motor' | 'spin-set' | 'too-little-hover';
    motor?: number;
    confidence: number;
    text: string;
  };
}

/**
 * The detail's bulky parts (~100 000 numbers for a long flight). The analysis worker hands them
 * to the page one message each: the page reads a message in one task, and all of them in one
 * message made one of its longest tasks.
 */
export const DETAIL_PARTS = ['effort', 'tracking', 'power', 'campbell', 'spectra'] as const;
export type DetailPart = (typeof DETAIL_PARTS)[number];
/** The detail without its bulky parts. */
export type DetailHead = Omit<ReviewDetail, DetailPart>;
export type DetailParts = Pick<ReviewDetail, DetailPart>;

/** Points per series the flight strip draws: about two per pixel of a wide screen. */
export const STRIP_POINTS = 2000;

/**
 * Largest-Triangle-Three-Buckets (Steinarsson 2013, "Downsampling Time Series for Visual
 * Representation", ch. 4) over several series at once: each bucket keeps the one index whose
 * triangles, summed over the series (each scaled by its own range), are largest, so all series
 * keep sharing one time axis. First and last points are always kept. NaN values never win a
 * bucket unless the whole bucket is NaN. Returns indices in ascending order.
 */
export function lttbIndices(
  t: ArrayLike<number>,
  series: readonly ArrayLike<number>[],
  maxPoints: number,
): number[] {
  const n = t.length;
  if (maxPoints >= n || n <= 2) return Array.from({ length: n }, (_, i) => i);
  const m = Math.max(3, Math.floor(maxPoints));
  const scale = series.map((y) => {
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i < n; i++) {
      const v = y[i]!;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    return hi > lo ? 1 / (hi - lo) : 1;
  });
  const out = [0];
  const every = (n - 2) / (m - 2);
  let a = 0;
  for (let b = 0; b < m - 2; b++) {
    // The next bucket's mean is the third corner of every candidate triangle.
    const n0 = Math.floor((b + 1) * every) + 1;
    const n1 = Math.min(n, Math.floor((b + 2) * every) + 1);
    let tMean = 0;
    for (let i = n0; i < n1; i++) tMean += t[i]!;
    tMean /= n1 - n0;
    const yMean = series.map((y) => {
      let s = 0;
      let c = 0;
      for (let i = n0; i < n1; i++) {
        const v = y[i]!;
        if (Number.isFinite(v)) {
          s += v;
          c++;
        }
      }
      return c > 0 ? s / c : NaN;
    });
    const c0 = Math.floor(b * every) + 1;
    const c1 = Math.floor((b + 1) * every) + 1;
    let best = c0;
    let bestArea = -1;
    const ta = t[a]!;
    for (let i = c0; i < c1; i++) {
      let area = 0;
      for (let k = 0; k < series.length; k++) {
        const y = series[k]!;
        const ya = y[a]!;
        const yi = y[i]!;
        const ym = yMean[k]!;
        const tri = Math.abs((ta - tMean) * (yi - ya) - (ta - t[i]!) * (ym - ya));
        if (Number.isFinite(tri)) area += tri * scale[k]!;
        else if (!Number.isFinite(yi)) area -= 1e-12; // a missing value loses to any real one
      }
      if (area > bestArea) {
        bestArea = area;
        best = i;
      }
    }
    out.push(best);
    a = best;
  }
  out.push(n - 1);
  return out;
}

/** Throttle and collective of the effort trace, thinned to at most `maxPoints` for the strip. */
export function stripTrace(effort: Trace, maxPoints = STRIP_POINTS): Trace {
  const names = ['throttle', 'collective'].filter((k) => effort.series[k] !== undefined);
  const idx = lttbIndices(
    effort.t,
    names.map((k) => effort.series[k]!),
    maxPoints,
  );
  return {
    t: idx.map((i) => effort.t[i]!),
    series: Object.fromEntries(names.map((k) => [k, idx.map((i) => effort.series[k]![i]!)])),
  };
}
