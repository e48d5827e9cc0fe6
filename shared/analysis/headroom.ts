import type { Column, ParsedLog } from '../log/types';
import type { Ranges } from './segments';

export interface SaturationEvent {
  t0: number;
  t1: number;
  /** 1-based. */
  motor: number;
}

export interface HeadroomResult {
  saturationS: number;
  saturationEvents: SaturationEvent[];
  /** Highest 100 ms mean per-ESC current, A (null when no current is logged). */
  escPeakA: number | null;
  /** Motor that drew it, 1-based. */
  escPeakMotor: number | null;
  escPeakAtS: number | null;
  /** Time any ESC spent above its rating, s. */
  escOverS: number;
  /** 'motor' when imotorN is logged, 'shared' when pack current is split by the thrust proxy. */
  currentSource: 'motor' | 'shared' | null;
}

/** Per-ESC current summed over rows [s, e) from logged per-motor current, into `current`. */
function motorCurrentSums(
  perMotor: readonly Column[],
  s: number,
  e: number,
  current: Float64Array,
) {
  for (let m = 0; m < perMotor.length; m++) {
    const c = perMotor[m]!;
    let sum = 0;
    for (let i = s; i < e; i++) {
      const v = c[i]!;
      if (v === v) sum += v;
    }
    current[m]! += sum;
  }
}

/**
 * Per-ESC current summed over rows [s, e) from the pack current split in proportion to each
 * motor's output^γ at that instant, into `current` (`weight` is scratch, one per motor).
 */
function sharedCurrentSums(
  motors: readonly Column[],
  ibat: Column,
  s: number,
  e: number,
  gamma: number,
  current: Float64Array,
  weight: Float64Array,
) {
  const n = motors.length;
  for (let i = s; i < e; i++) {
    let tot = 0;
    for (let m = 0; m < n; m++) {
      const u = motors[m]![i]!;
      const w = u > 0 ? (gamma === 2 ? u * u : u ** gamma) : 0; // NaN > 0 is false
      weight[m] = w;
      tot += w;
    }
    if (tot <= 0) continue;
    const share = ibat[i]! / tot;
    if (share !== share) continue;
    for (let m = 0; m < n; m++) current[m]! += share * weight[m]!;
  }
}

/** Events closer than this are one event, s: a motor chattering at its limit is one push. */
const MERGE_GAP_S = 0.05;
const MAX_EVENTS = 200;

/**
 * Time at saturation (any motor ≥ `level`, or pinned at its idle floor while the collective is
 * well above idle — the mixer has run out of room at the bottom) and per-ESC current against
 * the rating. ESC current is per motor when logged, else the pack current split in proportion
 * to each motor's share of output^γ at that instant.
 */
export function analyseHeadroom(
  log: ParsedLog,
  motors: readonly Column[],
  armed: Ranges,
  floor: number[],
  level: number,
  escMaxA: number | undefined,
  gamma: number,
): HeadroomResult {
  const time = log.columns.time!;
  const fs = log.sampleRateHz;
  const n = motors.length;
  const events: SaturationEvent[] = [];
  const open: (number | null)[] = motors.map(() => null);
  const last: number[] = motors.map(() => -1);
  let satSamples = 0;
  const gap = Math.max(1, Math.round(MERGE_GAP_S * fs));
  const close = (m: number) => {
    if (open[m] !== null && events.length < MAX_EVENTS) {
      events.push({ t0: time[open[m]!]!, t1: time[last[m]!]!, motor: m + 1 });
    }
    open[m] = null;
  };
  const floors = Float64Array.from(motors, (_, m) => floor[m] ?? 0);
  let floorTop = -Infinity;
  for (let m = 0; m < n; m++) floorTop = Math.max(floorTop, floors[m]! + 0.002);
  for (let ri = 0; ri < armed.length; ri++) {
    const a = armed[ri]![0];
    const b = armed[ri]![1];
    for (let i = a; i < b; i++) {
      let any = false;
      let mean = 0;
      let hi = -Infinity;
      let lo = Infinity;
      for (let m = 0; m < n; m++) {
        const u = motors[m]![i]!;
        mean += u;
        if (u > hi) hi = u;
        if (u < lo) lo = u;
      }
      // Most samples are nowhere near either limit: one look at the extremes settles them.
      // (A missing value fails both tests, as it does below.)
      if (!(hi >= level) && !(lo <= floorTop)) continue;
      mean /= n || 1;
      for (let m = 0; m < n; m++) {
        const u = motors[m]![i]!;
        const f = floors[m]!;
        const sat = u >= level || (u <= f + 0.002 && mean > f + 0.15);
        if (sat) {
          any = true;
          if (open[m] === null || i - last[m]! > gap) {
            close(m);
            open[m] = i;
          }
          last[m] = i;
        }
      }
      if (any) satSamples++;
    }
    for (let m = 0; m < n; m++) close(m);
  }
  events.sort((x, y) => x.t0 - y.t0);

  // ESC current, averaged over 100 ms so switching spikes don't read as overcurrent.
  const perMotor = motors.map((_, m) => log.columns[`imotor${m + 1}`]);
  const haveMotor = perMotor.every((c) => c !== undefined) && n > 0;
  const ibat = log.columns.ibat;
  const source: HeadroomResult['currentSource'] = haveMotor ? 'motor' : ibat ? 'shared' : null;
  let escPeakA: number | null = null;
  let escPeakMotor: number | null = null;
  let escPeakAtS: number | null = null;
  let overSamples = 0;
  if (source) {
    const block = Math.max(1, Math.round(fs * 0.1));
    const current = new Float64Array(n);
    const weight = new Float64Array(n);
    for (let ri = 0; ri < armed.length; ri++) {
      const a = armed[ri]![0];
      const b = armed[ri]![1];
      for (let s = a; s + block <= b; s += block) {
        current.fill(0);
        if (source === 'motor') motorCurrentSums(perMotor as Column[], s, s + block, current);
        else sharedCurrentSums(motors, ibat!, s, s + block, gamma, current, weight);
        let over = false;
        for (let m = 0; m < n; m++) {
          const c = current[m]! / block;
          if (!Number.isFinite(c)) continue;
          if (escPeakA === null || c > escPeakA) {
            escPeakA = c;
            escPeakMotor = m + 1;
            escPeakAtS = time[s + (block >> 1)]!;
          }
          if (escMaxA !== undefined && c > escMaxA) over = true;
        }
        if (over) overSamples += block;
      }
    }
  }
  return {
    saturationS: satSamples / fs,
    saturationEvents: events,
    escPeakA,
    escPeakMotor,
    escPeakAtS,
    escOverS: overSamples / fs,
    currentSource: source,
  };
}
