import type { ParsedLog } from '../log/types';
import { inferCells } from './lipo';
import type { Ranges } from './segments';

export interface SagFit {
  /** Internal resistance, Ω (slope of V against I). */
  ohm: number;
  /** Voltage extrapolated to zero current, V. */
  openCircuitV: number;
}

/**
 * Least-squares fit V = V0 − R·I (and, when `charge` is given, − c·Q so the slow fall of a
 * discharging pack doesn't masquerade as resistance). With two points it is exactly the
 * two-step ΔV/ΔI of IEC 61960. Returns null when the current never changes.
 */
export function fitSag(
  v: ArrayLike<number>,
  i: ArrayLike<number>,
  charge?: ArrayLike<number>,
): SagFit | null {
  const n = Math.min(v.length, i.length);
  if (n < 2) return null;
  let mv = 0;
  let mi = 0;
  let mq = 0;
  for (let k = 0; k < n; k++) {
    mv += v[k]!;
    mi += i[k]!;
    if (charge) mq += charge[k]!;
  }
  mv /= n;
  mi /= n;
  mq /= n;
  let sii = 0;
  let siv = 0;
  let sqq = 0;
  let siq = 0;
  let sqv = 0;
  for (let k = 0; k < n; k++) {
    const di = i[k]! - mi;
    const dv = v[k]! - mv;
    sii += di * di;
    siv += di * dv;
    if (charge) {
      const dq = charge[k]! - mq;
      sqq += dq * dq;
      siq += di * dq;
      sqv += dq * dv;
    }
  }
  if (sii <= 1e-12 * n) return null;
  let slopeI: number;
  let slopeQ = 0;
  const det = sii * sqq - siq * siq;
  if (charge && sqq > 0 && det > 1e-9 * sii * sqq) {
    slopeI = (siv * sqq - sqv * siq) / det;
    slopeQ = (sqv * sii - siv * siq) / det;
  } else {
    slopeI = siv / sii;
  }
  const ohm = -slopeI;
  return { ohm, openCircuitV: mv - slopeI * mi - slopeQ * mq };
}

/** Charge (mAh) and energy (Wh) by the trapezoid rule over time in s, V and A. */
export function energyUsed(
  time: ArrayLike<number>,
  current: ArrayLike<number>,
  voltage?: ArrayLike<number>,
): { mAh: number; wh: number | null } {
  let as = 0;
  let ws = 0;
  for (let k = 1; k < time.length; k++) {
    const dt = time[k]! - time[k - 1]!;
    if (!(dt > 0)) continue;
    const da = 0.5 * (current[k]! + current[k - 1]!) * dt;
    // A missing sample (NaN) loses one step, not the total.
    if (Number.isFinite(da)) as += da;
    if (voltage) {
      const dw = 0.5 * (current[k]! * voltage[k]! + current[k - 1]! * voltage[k - 1]!) * dt;
      if (Number.isFinite(dw)) ws += dw;
    }
  }
  return { mAh: as / 3.6, wh: voltage ? ws / 3600 : null };
}

export interface PowerResult {
  cells: number;
  cellsInferred: boolean;
  restCellV: number;
  minCellV: number;
  /** Time of the minimum, s. */
  minAtS: number;
  sagCellV: number;
  internalResistanceOhm: number | null;
  mAh: number | null;
  wh: number | null;
}

/** Means of consecutive blocks of `block` samples within `ranges`, NaN-free. */
function blockMeans(
  col: ArrayLike<number>,
  ranges: Ranges,
  block: number,
): { at: number[]; mean: number[] } {
  const at: number[] = [];
  const mean: number[] = [];
  for (let ri = 0; ri < ranges.length; ri++) {
    const a = ranges[ri]![0];
    const b = ranges[ri]![1];
    for (let s = a; s + block <= b; s += block) {
      let sum = 0;
      let cnt = 0;
      for (let k = s; k < s + block; k++) {
        const v = col[k]!;
        if (Number.isFinite(v)) {
          sum += v;
          cnt++;
        }
      }
      if (cnt > 0) {
        at.push(s + (block >> 1));
        mean.push(sum / cnt);
      }
    }
  }
  return { at, mean };
}

/**
 * Battery figures from vbat (V) and, when logged, ibat (A). Rest is the highest 0.25 s mean in
 * the log (the least-loaded moment); the minimum is the lowest 50 ms mean while armed, so a
 * single-sample glitch doesn't count. Cells come from the airframe or are inferred from rest.
 */
export function analysePower(log: ParsedLog, armed: Ranges, cells?: number): PowerResult | null {
  const v = log.columns.vbat;
  if (!v || log.rows < 2) return null;
  const fs = log.sampleRateHz;
  const all: Ranges = [[0, log.rows]];
  const rest = blockMeans(v, all, Math.max(1, Math.round(fs * 0.25)));
  if (rest.mean.length === 0) return null;
  const restV = Math.max(...rest.mean);
  const inferred = cells === undefined;
  const n = cells ?? inferCells(restV);
  if (!n) return null;
  const load = blockMeans(v, armed.length ? armed : all, Math.max(1, Math.round(fs * 0.05)));
  let minV = restV;
  let minAt = 0;
  load.mean.forEach((m, k) => {
    if (m < minV) {
      minV = m;
      minAt = load.at[k]!;
    }
  });
  const time = log.columns.time!;
  const ibat = log.columns.ibat;
  let r: number | null = null;
  let mAh: number | null = null;
  let wh: number | null = null;
  if (ibat) {
    const used = energyUsed(time, ibat, v);
    mAh = used.mAh;
    wh = used.wh;
    // Regress on 20 ms means over armed time: averages away ESC switching noise and keeps the
    // fit to a few thousand points on a long log.
    const block = Math.max(1, Math.round(fs * 0.02));
    const vm = blockMeans(v, armed, block);
    const im = blockMeans(ibat, armed, block);
    const q = new Float64Array(vm.at.length);
    // Charge drawn so far at each block, from a running integral over the whole log.
    let acc = 0;
    let next = 0;
    for (let k = 1; k < log.rows && next < q.length; k++) {
      const da = 0.5 * (ibat[k]! + ibat[k - 1]!) * (time[k]! - time[k - 1]!);
      if (Number.isFinite(da)) acc += da;
      while (next < q.length && vm.at[next]! <= k) q[next++] = acc / 3.6;
    }
    const fit = fitSag(vm.mean, im.mean, q);
    if (fit && fit.ohm > 0) r = fit.ohm;
  }
  return {
    cells: n,
    cellsInferred: inferred,
    restCellV: restV / n,
    minCellV: minV / n,
    minAtS: time[minAt] ?? 0,
    sagCellV: (restV - minV) / n,
    internalResistanceOhm: r,
    mAh,
    wh,
  };
}
