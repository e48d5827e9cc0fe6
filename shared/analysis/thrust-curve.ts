import type { BenchRow } from '../schemas/aircraft';

/** A bench-run table (the `BenchRow` shape): command 0–1 → static thrust in grams. */
export interface BenchRunTable {
  rows: readonly Pick<BenchRow, 'throttle' | 'thrustG'>[];
}

/** Output → thrust proxy and back, for balance, torque split and CG when rpm is not logged. */
export interface ThrustCurve {
  /** Thrust proxy of a steady output (0–1); grams for a bench run, output^γ otherwise. */
  thrust(output: number): number;
  /** The output (0–1) that gives this thrust proxy. */
  output(thrust: number): number;
  source: 'bench-run' | 'power-law';
}

/** shared/README.md §4: thrust ∝ output^γ (γ = 2 is the propeller law with rpm ∝ output). */
export function powerLawCurve(gamma: number): ThrustCurve {
  if (!(gamma > 0) || !Number.isFinite(gamma))
    throw new RangeError(`thrust exponent must be a positive number, got ${gamma}`);
  return {
    thrust: (u) => (u > 0 ? (gamma === 2 ? u * u : u ** gamma) : 0),
    output: (t) => (t > 0 ? t ** (1 / gamma) : 0),
    source: 'power-law',
  };
}

/**
 * A bench run as a thrust curve: linear between readings, held at the end readings outside
 * them. Throws a RangeError naming the first bad reading: commands must rise strictly within
 * 0–1, thrust must be finite and never fall as the command rises, and the curve must rise
 * somewhere.
 */
export function benchRunCurve(bench: BenchRunTable): ThrustCurve {
  const rows = bench.rows;
  if (rows.length < 2) throw new RangeError('A bench run needs at least two readings.');
  const x = new Float64Array(rows.length);
  const y = new Float64Array(rows.length);
  rows.forEach((r, i) => {
    if (!(r.throttle >= 0 && r.throttle <= 1))
      throw new RangeError(`Bench reading ${i + 1}: throttle must be within 0–1.`);
    if (!Number.isFinite(r.thrustG))
      throw new RangeError(`Bench reading ${i + 1}: thrust must be a number of grams.`);
    if (i > 0 && !(r.throttle > x[i - 1]!))
      throw new RangeError(
        `Bench reading ${i + 1}: throttle must go up from one reading to the next.`,
      );
    if (i > 0 && r.thrustG < y[i - 1]!)
      throw new RangeError(`Bench reading ${i + 1}: thrust falls as the throttle rises.`);
    x[i] = r.throttle;
    y[i] = r.thrustG;
  });
  if (!(y[y.length - 1]! > y[0]!))
    throw new RangeError('The bench run never gains thrust: it cannot map output to thrust.');
  const last = x.length - 1;
  const interp = (v: number, from: Float64Array, to: Float64Array) => {
    if (!(v > from[0]!)) return to[0]!;
    if (v >= from[last]!) return to[last]!;
    // Binary search for the reading at or below v.
    let lo = 0;
    let hi = last;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (from[mid]! <= v) lo = mid;
      else hi = mid;
    }
    const span = from[hi]! - from[lo]!;
    return span > 0 ? to[lo]! + ((v - from[lo]!) / span) * (to[hi]! - to[lo]!) : to[lo]!;
  };
  return {
    thrust: (u) => interp(u, x, y),
    output: (t) => interp(t, y, x),
    source: 'bench-run',
  };
}
