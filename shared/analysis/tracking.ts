import type { ParsedLog } from '../log/types';
import { crossCorrelationLag } from './dsp/xcorr';
import type { Ranges } from './segments';

export interface AxisTrackingResult {
  rmsDegS: number;
  /** Gyro behind setpoint, ms; null when the setpoint barely moved or the two don't correlate. */
  lagMs: number | null;
  /** Time of the largest error, s. */
  worstAtS: number;
}

export type TrackingResult = Record<'roll' | 'pitch' | 'yaw', AxisTrackingResult>;

const AXES = [
  ['roll', 'sp_roll', 'gyro_x'],
  ['pitch', 'sp_pitch', 'gyro_y'],
  ['yaw', 'sp_yaw', 'gyro_z'],
] as const;

/** Rate the lag search runs at, Hz: sub-sample interpolation keeps 1 ms resolution, and block means filter out rotor noise. */
const LAG_RATE_HZ = 500;
const MAX_LAG_S = 0.25;

/**
 * Setpoint-following per axis over armed time: RMS of setpoint − gyro (deg/s) and the lag at
 * which the cross-correlation of the two peaks (Knapp & Carter 1976), on block means at about
 * 500 Hz with the means removed.
 */
export function analyseTracking(log: ParsedLog, armed: Ranges): TrackingResult | null {
  const fs = log.sampleRateHz;
  const time = log.columns.time!;
  if (!AXES.every(([, sp, g]) => log.columns[sp] && log.columns[g])) return null;
  const decim = Math.max(1, Math.floor(fs / LAG_RATE_HZ));
  const rate = fs / decim;
  const out: Partial<TrackingResult> = {};
  for (const [axis, spName, gName] of AXES) {
    const sp = log.columns[spName]!;
    const g = log.columns[gName]!;
    let se = 0;
    let n = 0;
    let worst = 0;
    let worstAt = 0;
    const xs: number[] = [];
    const ys: number[] = [];
    let lagWeighted = 0;
    let lagWeight = 0;
    for (const [a, b] of armed) {
      for (let i = a; i < b; i++) {
        const e = sp[i]! - g[i]!;
        se += e * e;
        n++;
        if (Math.abs(e) > worst) {
          worst = Math.abs(e);
          worstAt = i;
        }
      }
      xs.length = 0;
      ys.length = 0;
      for (let s = a; s + decim <= b; s += decim) {
        let x = 0;
        let y = 0;
        for (let i = s; i < s + decim; i++) {
          x += sp[i]!;
          y += g[i]!;
        }
        xs.push(x / decim);
        ys.push(y / decim);
      }
      const maxLag = Math.round(MAX_LAG_S * rate);
      if (xs.length < 4 * maxLag) continue;
      const mx = xs.reduce((p, v) => p + v, 0) / xs.length;
      const my = ys.reduce((p, v) => p + v, 0) / ys.length;
      let varX = 0;
      for (let i = 0; i < xs.length; i++) {
        xs[i] = xs[i]! - mx;
        ys[i] = ys[i]! - my;
        varX += xs[i]! * xs[i]!;
      }
      // A setpoint that hardly moves (< 2 deg/s RMS) has no timing to measure.
      if (varX / xs.length < 4) continue;
      const est = crossCorrelationLag(xs, ys, maxLag);
      if (!est || est.normalised < 0.5) continue;
      lagWeighted += est.lag * varX;
      lagWeight += varX;
    }
    out[axis] = {
      rmsDegS: n ? Math.sqrt(se / n) : 0,
      lagMs: lagWeight > 0 ? (lagWeighted / lagWeight / rate) * 1000 : null,
      worstAtS: time[worstAt] ?? 0,
    };
  }
  return out as TrackingResult;
}
