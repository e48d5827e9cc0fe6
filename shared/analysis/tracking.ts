import type { ParsedLog } from '../log/types';
import { crossCorrelationLag } from './dsp/xcorr';
import type { Ranges } from './segments';
import { stickResponse, type StickResponse } from './stick-response';

export interface AxisTrackingResult {
  rmsDegS: number;
  /** Gyro behind setpoint, ms; null when the setpoint barely moved or the two don't correlate. */
  lagMs: number | null;
  /** Time of the largest error, s. */
  worstAtS: number;
  /** Stick response (H1 estimate from setpoint to gyro), null when the sticks said too little. */
  response: StickResponse | null;
  /** Why the stick response, or its bandwidth, could not be read. */
  responseNote?: string;
}

export type TrackingResult = Record<'roll' | 'pitch' | 'yaw', AxisTrackingResult>;

const AXES = [
  ['roll', 'sp_roll', 'gyro_x'],
  ['pitch', 'sp_pitch', 'gyro_y'],
  ['yaw', 'sp_yaw', 'gyro_z'],
] as const;

/**
 * Rate the lag search runs at, Hz: stick moves and the aircraft's response live well below
 * 50 Hz, block means filter out rotor noise, and sub-sample interpolation keeps about 1 ms
 * resolution on the 4 ms grid.
 */
const LAG_RATE_HZ = 250;
const MAX_LAG_S = 0.2;

/**
 * The ranges without the stretches where a motor sat at its limit (padded by `padS` each side):
 * there the aircraft could not follow whatever the tune, and that is headroom's finding, not a lag.
 */
export function withoutSaturation(
  ranges: Ranges,
  events: readonly { t0: number; t1: number }[],
  time: ArrayLike<number>,
  fs: number,
  padS = 0.25,
): Ranges {
  if (!events.length) return ranges;
  const t0 = time[0] ?? 0;
  const cuts = events
    .map((e) => [Math.floor((e.t0 - padS - t0) * fs), Math.ceil((e.t1 + padS - t0) * fs)] as const)
    .sort((a, b) => a[0] - b[0]);
  const out: Ranges = [];
  for (const [a, b] of ranges) {
    let start = a;
    for (const [c0, c1] of cuts) {
      if (c1 <= start || c0 >= b) continue;
      if (c0 > start) out.push([start, c0]);
      start = Math.max(start, c1);
    }
    if (start < b) out.push([start, b]);
  }
  return out;
}

/**
 * Setpoint-following per axis over armed time: RMS of setpoint − gyro (deg/s) and the lag at
 * which the cross-correlation of the two peaks (Knapp & Carter 1976), on block means at about
 * 250 Hz with the means removed.
 */
export function analyseTracking(log: ParsedLog, armed: Ranges): TrackingResult | null {
  const fs = log.sampleRateHz;
  const time = log.columns.time!;
  if (!AXES.every(([, sp, g]) => log.columns[sp] && log.columns[g])) return null;
  const decim = Math.max(1, Math.floor(fs / LAG_RATE_HZ));
  const rate = fs / decim;
  const out: Partial<TrackingResult> = {};
  for (let ai = 0; ai < AXES.length; ai++) {
    const [axis, spName, gName] = AXES[ai]!;
    const sp = log.columns[spName]!;
    const g = log.columns[gName]!;
    let se = 0;
    let n = 0;
    let worst = 0;
    let worstAt = 0;
    let lagWeighted = 0;
    let lagWeight = 0;
    const maxLag = Math.round(MAX_LAG_S * rate);
    for (let ri = 0; ri < armed.length; ri++) {
      const a = armed[ri]![0];
      const b = armed[ri]![1];
      const blocks = Math.floor((b - a) / decim);
      const xs = new Float64Array(blocks);
      const ys = new Float64Array(blocks);
      let mx = 0;
      let my = 0;
      for (let j = 0; j < blocks; j++) {
        let x = 0;
        let y = 0;
        let c = 0;
        for (let i = a + j * decim, end = i + decim; i < end; i++) {
          const s = sp[i]!;
          const gv = g[i]!;
          const e = s - gv;
          // Missing samples (NaN) are skipped.
          if (e !== e) continue;
          se += e * e;
          n++;
          if (e > worst || -e > worst) {
            worst = Math.abs(e);
            worstAt = i;
          }
          x += s;
          y += gv;
          c++;
        }
        xs[j] = c ? x / c : j > 0 ? xs[j - 1]! : 0;
        ys[j] = c ? y / c : j > 0 ? ys[j - 1]! : 0;
        mx += xs[j]!;
        my += ys[j]!;
      }
      if (blocks < 4 * maxLag) continue;
      mx /= blocks;
      my /= blocks;
      let varX = 0;
      for (let j = 0; j < blocks; j++) {
        xs[j] = xs[j]! - mx;
        ys[j] = ys[j]! - my;
        varX += xs[j]! * xs[j]!;
      }
      // A setpoint that hardly moves (< 2 deg/s RMS) has no timing to measure.
      if (varX / blocks < 4) continue;
      const est = crossCorrelationLag(xs, ys, maxLag);
      if (!est || est.normalised < 0.5) continue;
      lagWeighted += est.lag * varX;
      lagWeight += varX;
    }
    const sr = stickResponse(sp, g, fs, armed);
    out[axis] = {
      rmsDegS: n ? Math.sqrt(se / n) : 0,
      lagMs: lagWeight > 0 ? (lagWeighted / lagWeight / rate) * 1000 : null,
      worstAtS: time[worstAt] ?? 0,
      response: sr.response,
      ...(sr.reason ? { responseNote: sr.reason } : {}),
    };
  }
  return out as TrackingResult;
}
