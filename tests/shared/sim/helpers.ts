import type { ParsedLog } from '../../../shared/log/types';
import type { GroundTruth } from '../../../shared/sim/types';

/** Row ranges of the scripted steady hovers, skipping the first `settleS` of each. */
export function hoverRows(log: ParsedLog, truth: GroundTruth, settleS = 0.5): [number, number][] {
  return truth.phases
    .filter((p) => p.kind === 'hover')
    .map(
      (p) =>
        [Math.ceil((p.t0 + settleS) * log.sampleRateHz), Math.floor(p.t1 * log.sampleRateHz)] as [
          number,
          number,
        ],
    )
    .filter(([a, b]) => b > a);
}

/** Mean of f(row) over the given row ranges. */
export function meanOver(ranges: [number, number][], f: (row: number) => number): number {
  let s = 0;
  let n = 0;
  for (const [a, b] of ranges) {
    for (let i = a; i < b; i++) {
      s += f(i);
      n++;
    }
  }
  return s / n;
}

export function col(log: ParsedLog, name: string) {
  const c = log.columns[name];
  if (!c) throw new Error(`no column ${name}`);
  return c;
}

/** Mean hover output per motor. */
export function hoverOutputs(log: ParsedLog, truth: GroundTruth): number[] {
  const ranges = hoverRows(log, truth);
  return truth.airframe.motors.map((_, i) => {
    const c = col(log, `motor${i + 1}`);
    return meanOver(ranges, (r) => c[r]!);
  });
}

/** Mean hover thrust per motor from logged rpm and the true kT, N. */
export function hoverThrusts(log: ParsedLog, truth: GroundTruth): number[] {
  const ranges = hoverRows(log, truth);
  return truth.airframe.motors.map((_, i) => {
    const c = col(log, `rpm${i + 1}`);
    const k = truth.params.kT[i]!;
    return meanOver(ranges, (r) => k * c[r]! * c[r]!);
  });
}

/** Power of x at `hz` over rows [a, b) by a single-bin DFT (Goertzel form), amplitude². */
export function tonePower(
  x: ArrayLike<number>,
  a: number,
  b: number,
  hz: number,
  fs: number,
): number {
  const w = (2 * Math.PI * hz) / fs;
  let re = 0;
  let im = 0;
  for (let i = a; i < b; i++) {
    re += x[i]! * Math.cos(w * i);
    im -= x[i]! * Math.sin(w * i);
  }
  const n = b - a;
  return (4 * (re * re + im * im)) / (n * n);
}
