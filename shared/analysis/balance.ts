import { allocationMatrix, expectedHoverShares, mixerMatrix } from '../airframe/allocation';
import { multiply } from '../airframe/linear-algebra';
import type { Column } from '../log/types';
import type { Airframe } from '../schemas/airframe';
import type { Ranges } from './segments';
import { powerLawCurve, type ThrustCurve } from './thrust-curve';

export interface HoverMeans {
  /** Mean output per motor over hover, 0–1. */
  output: number[];
  /** Mean of output^γ per motor. */
  outputPow: number[];
  /** Mean rpm² per motor, when every motor's rpm is logged. */
  rpmSq: number[] | null;
  /** Mean thrust of the output through a bench-run curve per motor (grams), when one is attached. */
  benchThrust?: number[];
}

/**
 * Sum, sum of output^γ and count of a column's present samples over the ranges, into `out`.
 * A top-level function with indexed loops: V8 keeps the running sums unboxed here, where a
 * closure with destructured range loops allocated a number per sample (measured).
 */
function outputSums(col: Column, ranges: Ranges, gamma: number, out: Float64Array): void {
  let s = 0;
  let sp = 0;
  let n = 0;
  for (let r = 0; r < ranges.length; r++) {
    const a = ranges[r]![0];
    const b = ranges[r]![1];
    for (let k = a; k < b; k++) {
      const v = col[k]!;
      // Missing samples (NaN) are skipped, not averaged in.
      if (v !== v) continue;
      const u = v > 0 ? v : 0;
      s += u;
      sp += gamma === 2 ? u * u : u ** gamma;
      n++;
    }
  }
  out[0] = s;
  out[1] = sp;
  out[2] = n;
}

/** Sum of squares and count of a column's present samples over the ranges, into `out`. */
function squareSums(col: Column, ranges: Ranges, out: Float64Array): void {
  let s = 0;
  let n = 0;
  for (let r = 0; r < ranges.length; r++) {
    const a = ranges[r]![0];
    const b = ranges[r]![1];
    for (let k = a; k < b; k++) {
      const w = col[k]!;
      if (w === w) {
        s += w * w;
        n++;
      }
    }
  }
  out[0] = s;
  out[1] = n;
}

/**
 * Per-motor hover means (γ = the airframe's thrust exponent, default 2; `bench` adds the mean
 * thrust through a bench-run curve, g).
 */
export function hoverMeans(
  motors: readonly Column[],
  rpms: readonly Column[] | null,
  hover: Ranges,
  gamma: number,
  bench?: ThrustCurve,
): HoverMeans {
  const output: number[] = [];
  const outputPow: number[] = [];
  const rpmSq: number[] | null = rpms ? [] : null;
  const benchThrust: number[] = [];
  const sums = new Float64Array(3);
  for (let i = 0; i < motors.length; i++) {
    const m = motors[i]!;
    outputSums(m, hover, gamma, sums);
    const n = sums[2]!;
    output.push(n ? sums[0]! / n : NaN);
    outputPow.push(n ? sums[1]! / n : NaN);
    if (bench) {
      let sb = 0;
      for (let r = 0; r < hover.length; r++) {
        for (let k = hover[r]![0]; k < hover[r]![1]; k++) {
          const v = m[k]!;
          if (v === v) sb += bench.thrust(v > 0 ? v : 0);
        }
      }
      benchThrust.push(n ? sb / n : NaN);
    }
    const r = rpms?.[i];
    if (r && rpmSq) {
      squareSums(r, hover, sums);
      rpmSq.push(sums[1]! ? sums[0]! / sums[1]! : NaN);
    }
  }
  return { output, outputPow, rpmSq, ...(bench ? { benchThrust } : {}) };
}

function median(v: number[]): number {
  const s = v.filter((x) => Number.isFinite(x)).sort((a, b) => a - b);
  if (!s.length) return NaN;
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

const normalise = (v: number[]) => {
  const s = v.reduce((a, b) => a + b, 0);
  return v.map((x) => (s > 0 ? x / s : NaN));
};

export interface BalanceResult {
  expectedShare: number[];
  measuredShare: number[];
  deviationPct: number[];
  /** Shares of hover output^γ, or of bench-run thrust (what the diagnosis reads: a weak motor shows in its output). */
  outputShare: number[];
  proxy: 'rpm' | 'bench-run' | 'output';
  cwShare: number;
  ccwShare: number;
  asymmetryPct: number;
  /** cw − ccw of the expected shares, % (0 for a symmetric frame). */
  expectedAsymmetryPct: number;
  cg: { xMm: number; yMm: number };
}

/**
 * Balance, torque split and CG from hover means (definitions in shared/README.md §7). Measured shares
 * use rpm² when logged (propeller law), else the bench-run curve when one is attached, else
 * output^γ. Deviation compares each motor's mean output with the output that delivers its
 * expected share of the measured total through the same curve. With rpm logged the total is the
 * rpm² sum, put into output terms by the median motor's thrust per output — so one worn motor,
 * which needs more output for the same rpm, cannot inflate the yardstick it is judged by.
 */
export function analyseBalance(
  airframe: Airframe,
  means: HoverMeans,
  bench?: ThrustCurve,
): BalanceResult {
  const curve = bench ?? powerLawCurve(airframe.thrustExponent ?? 2);
  const expectedShare = expectedHoverShares(airframe);
  const outputThrust = bench && means.benchThrust ? means.benchThrust : means.outputPow;
  const proxyValues = means.rpmSq ?? outputThrust;
  const measuredShare = normalise(proxyValues);
  const outputShare = normalise(outputThrust);
  // Thrust of each motor's mean output held steady: the same averaging as the output it is
  // compared with, so control jitter does not bias every motor low.
  const steady = means.output.map((u) => curve.thrust(u));
  let total = steady.reduce((a, b) => a + b, 0);
  if (means.rpmSq) {
    const perOutput = median(means.rpmSq.map((r, i) => r / steady[i]!));
    if (perOutput > 0) total = means.rpmSq.reduce((a, b) => a + b, 0) / perOutput;
  }
  const deviationPct = means.output.map((u, i) => {
    const expectedOut = curve.output(expectedShare[i]! * total);
    return (u / expectedOut - 1) * 100;
  });
  let cw = 0;
  let ccw = 0;
  let ecw = 0;
  let eccw = 0;
  let x = 0;
  let y = 0;
  airframe.motors.forEach((m, i) => {
    const s = measuredShare[i] ?? 0;
    if (m.spin === 'cw') {
      cw += s;
      ecw += expectedShare[i]!;
    } else {
      ccw += s;
      eccw += expectedShare[i]!;
    }
    x += m.x * s;
    y += m.y * s;
  });
  return {
    expectedShare,
    measuredShare,
    deviationPct,
    outputShare,
    proxy: means.rpmSq ? 'rpm' : bench && means.benchThrust ? 'bench-run' : 'output',
    cwShare: cw,
    ccwShare: ccw,
    asymmetryPct: (cw - ccw) * 100,
    expectedAsymmetryPct: (ecw - eccw) * 100,
    cg: { xMm: x, yMm: y },
  };
}

export type Pattern = 'cg-offset' | 'weak-motor' | 'spin-set';

export interface PatternFit {
  pattern: Pattern;
  /** 1-based motor for weak-motor. */
  motor?: number;
  /** Share of the deviation the pattern explains, 0–1. */
  explained: number;
}

/** Removes the part of v along s (keeps the shares summing to 1) — changes of shares sum to 0. */
function toShareChange(v: number[], s: number[]): number[] {
  const sum = v.reduce((a, b) => a + b, 0);
  return v.map((x, i) => x - sum * s[i]!);
}

const dot = (a: number[], b: number[]) => a.reduce((s, x, i) => s + x * b[i]!, 0);

/** Fraction of |d|² explained by projecting d onto span(basis) (Gram–Schmidt), and the coefficient along the first basis vector. */
function explainedBy(d: number[], basis: number[][]): { r2: number; coef: number } {
  const ortho: number[][] = [];
  for (const b of basis) {
    let v = b.slice();
    for (const o of ortho) {
      const c = dot(v, o);
      v = v.map((x, i) => x - c * o[i]!);
    }
    const n = Math.sqrt(dot(v, v));
    if (n > 1e-12) ortho.push(v.map((x) => x / n));
  }
  const dd = dot(d, d);
  if (dd <= 0) return { r2: 0, coef: 0 };
  let p = 0;
  for (const o of ortho) p += dot(d, o) ** 2;
  const first = basis[0]!;
  const coef = dot(d, first) / Math.max(1e-300, dot(first, first));
  return { r2: p / dd, coef };
}

/**
 * Which hover pattern explains the motors' output shares best (shared/README.md §6): a CG offset
 * loads a side through the mixer's roll and pitch columns with no yaw part; a weak motor loads
 * one motor (the mixer's projection of that motor alone, which carries a yaw part); a spin-set
 * mismatch or tilted motor loads one spin set (the yaw column). Returns every candidate with
 * the share of the deviation it explains, best first.
 */
export function fitPatterns(
  airframe: Airframe,
  outputShare: number[],
  expectedShare: number[],
): PatternFit[] {
  const cg = airframe.cg ?? { x: 0, y: 0 };
  const mixer = mixerMatrix(airframe.motors, cg);
  const alloc = allocationMatrix(airframe.motors, cg);
  const n = airframe.motors.length;
  const column = (j: number) => mixer.map((r) => r[j]!);
  const d = outputShare.map((v, i) => v - expectedShare[i]!);
  const fits: PatternFit[] = [];
  const cgFit = explainedBy(d, [
    toShareChange(column(1), expectedShare),
    toShareChange(column(2), expectedShare),
  ]);
  fits.push({ pattern: 'cg-offset', explained: cgFit.r2 });
  const yaw = explainedBy(d, [toShareChange(column(3), expectedShare)]);
  fits.push({ pattern: 'spin-set', explained: yaw.r2 });
  // The mixer's response to one motor losing thrust: projection P = mixer·allocation.
  const proj = multiply(mixer, alloc);
  let bestMotor: PatternFit | null = null;
  for (let i = 0; i < n; i++) {
    const ei = proj.map((r) => r[i]!);
    const f = explainedBy(d, [toShareChange(ei, expectedShare)]);
    // A weak motor works harder, so only a positive load on it fits.
    if (f.coef > 0 && (!bestMotor || f.r2 > bestMotor.explained)) {
      bestMotor = { pattern: 'weak-motor', motor: i + 1, explained: f.r2 };
    }
  }
  if (bestMotor) fits.push(bestMotor);
  fits.sort((a, b) => b.explained - a.explained);
  return fits;
}
