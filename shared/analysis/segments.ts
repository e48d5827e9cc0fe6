import type { ParsedLog } from '../log/types';
import type { Thresholds } from '../schemas/thresholds';

/** Sample-index ranges [start, end), end exclusive, sorted and disjoint. */
export type Ranges = [number, number][];

export interface Segments {
  armed: Ranges;
  hover: Ranges;
  manoeuvre: Ranges;
  idle: Ranges;
  hoverS: number;
  armedS: number;
  /** Output floor each motor sits at while armed (its 1st percentile), 0–1. */
  floor: number[];
}

/** Columns motor1…motorN present in the log, in motor order. */
export function motorColumns(log: ParsedLog, prefix = 'motor'): Float32Array[] | Float64Array[] {
  const out: (Float32Array | Float64Array)[] = [];
  for (let i = 1; ; i++) {
    const c = log.columns[`${prefix}${i}`];
    if (!c) break;
    out.push(c);
  }
  return out as Float32Array[];
}

function runs(flags: Uint8Array, block: number, rows: number, minBlocks = 1): Ranges {
  const out: Ranges = [];
  let start = -1;
  for (let b = 0; b <= flags.length; b++) {
    const on = b < flags.length && flags[b] === 1;
    if (on && start < 0) start = b;
    if (!on && start >= 0) {
      if (b - start >= minBlocks) out.push([start * block, Math.min(rows, b * block)]);
      start = -1;
    }
  }
  return out;
}

/** Total samples in a set of ranges. */
export function rangeLength(r: Ranges): number {
  return r.reduce((s, [a, b]) => s + (b - a), 0);
}

/**
 * Splits the flight into armed / idle / hover / manoeuvre on 50 ms blocks (long enough to
 * average out rotor vibration on the gyro, short enough to follow a flip). Hover = armed, off
 * the idle floor, low body rates, and collective within a band of its mean over the half
 * second before or after, for at least `hoverMinS`. The thresholds' reasons are in thresholds.ts.
 */
export function findSegments(log: ParsedLog, th: Thresholds): Segments {
  const fs = log.sampleRateHz > 0 ? log.sampleRateHz : 1;
  const rows = log.rows;
  const block = Math.max(1, Math.round(fs * 0.05));
  const nb = Math.floor(rows / block);
  const motors = motorColumns(log);
  const gyro = ['gyro_x', 'gyro_y', 'gyro_z'].map((c) => log.columns[c]);
  const collective = new Float64Array(nb);
  const maxOut = new Float64Array(nb);
  const rates = [new Float64Array(nb), new Float64Array(nb), new Float64Array(nb)];
  for (let b = 0; b < nb; b++) {
    const s = b * block;
    let sum = 0;
    let mx = 0;
    for (const m of motors) {
      let ms = 0;
      for (let k = s; k < s + block; k++) ms += m[k]!;
      ms /= block;
      sum += ms;
      if (ms > mx) mx = ms;
    }
    collective[b] = motors.length ? sum / motors.length : 0;
    maxOut[b] = mx;
    gyro.forEach((g, a) => {
      if (!g) return;
      let gs = 0;
      for (let k = s; k < s + block; k++) gs += g[k]!;
      rates[a]![b] = gs / block;
    });
  }
  const armedFlag = new Uint8Array(nb);
  for (let b = 0; b < nb; b++) armedFlag[b] = maxOut[b]! >= th.armedMinOutput ? 1 : 0;

  // Idle floor per motor: its low percentile while armed (what the ESC idles at).
  const floor = motors.map(() => 0);
  const armedCollective: number[] = [];
  for (let b = 0; b < nb; b++) if (armedFlag[b]) armedCollective.push(collective[b]!);
  armedCollective.sort((a, b) => a - b);
  const idleLevel = armedCollective.length
    ? armedCollective[Math.floor(armedCollective.length * 0.01)]!
    : 0;
  motors.forEach((m, i) => {
    const vals: number[] = [];
    for (let b = 0; b < nb; b += 1) if (armedFlag[b]) vals.push(m[b * block]!);
    vals.sort((a, b) => a - b);
    floor[i] = vals.length ? vals[Math.floor(vals.length * 0.01)]! : 0;
  });

  const half = Math.max(1, Math.round(0.5 / (block / fs)));
  const prefix = new Float64Array(nb + 1);
  for (let b = 0; b < nb; b++) prefix[b + 1] = prefix[b]! + collective[b]!;
  const hoverFlag = new Uint8Array(nb);
  const idleFlag = new Uint8Array(nb);
  for (let b = 0; b < nb; b++) {
    if (!armedFlag[b]) {
      idleFlag[b] = 1;
      continue;
    }
    if (collective[b]! < idleLevel + th.hoverAboveIdle) {
      idleFlag[b] = 1;
      continue;
    }
    // Steady against the half second before or the half second after, so the first and
    // last blocks of a hold count even though a climb or descent sits on one side.
    const lo = Math.max(0, b - half);
    const hi = Math.min(nb, b + half + 1);
    const back = (prefix[b + 1]! - prefix[lo]!) / (b + 1 - lo);
    const fwd = (prefix[hi]! - prefix[b]!) / (hi - b);
    const c = collective[b]!;
    const steady =
      Math.abs(c - back) <= th.hoverCollectiveBand || Math.abs(c - fwd) <= th.hoverCollectiveBand;
    const calm =
      Math.abs(rates[0]![b]!) <= th.hoverRateDegS &&
      Math.abs(rates[1]![b]!) <= th.hoverRateDegS &&
      Math.abs(rates[2]![b]!) <= th.hoverYawRateDegS;
    if (steady && calm) hoverFlag[b] = 1;
  }
  const minBlocks = Math.ceil((th.hoverMinS * fs) / block);
  const hover = runs(hoverFlag, block, rows, minBlocks);
  // Short calm stretches that don't make a hover count as manoeuvre.
  const hoverBlocks = new Uint8Array(nb);
  for (const [a, b] of hover) for (let k = a / block; k < b / block; k++) hoverBlocks[k] = 1;
  const manFlag = new Uint8Array(nb);
  for (let b = 0; b < nb; b++) manFlag[b] = armedFlag[b] && !idleFlag[b] && !hoverBlocks[b] ? 1 : 0;
  const armed = runs(armedFlag, block, rows);
  const hoverN = rangeLength(hover);
  return {
    armed,
    hover,
    manoeuvre: runs(manFlag, block, rows),
    idle: runs(idleFlag, block, rows),
    hoverS: hoverN / fs,
    armedS: rangeLength(armed) / fs,
    floor,
  };
}
