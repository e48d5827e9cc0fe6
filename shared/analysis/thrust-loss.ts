import { allocationMatrix } from '../airframe/allocation';
import type { Airframe } from '../schemas/airframe';

/** One motor's thrust for its output against its neighbours', from the hover equations. */
export interface ThrustLoss {
  /** 1-based motor. */
  motor: number;
  /** Thrust it makes for its output, short of its neighbours', % (negative: it makes more). */
  lossPct: number;
  /** Share of the hover moment imbalance (all motors taken as equal) this one motor explains, 0–1. */
  explained: number;
  /** Where the moments are taken: the airframe's design CG (the loss and a CG shift trade off otherwise). */
  cg: 'design';
}

/**
 * Hover moment rows (roll, pitch, yaw) about the design CG, each scaled to unit RMS over the
 * motors so metres of arm and metres of torque ratio weigh alike in the least squares.
 */
function momentRows(airframe: Airframe): number[][] {
  const a = allocationMatrix(airframe.motors, airframe.cg ?? { x: 0, y: 0 });
  return a.slice(1).map((row) => {
    const rms = Math.sqrt(row.reduce((s, v) => s + v * v, 0) / row.length);
    return rms > 0 ? row.map((v) => v / rms) : row;
  });
}

/**
 * In a steady hover the moments about the CG vanish. Take every motor's thrust as a common
 * constant times its output thrust proxy (output^γ or a bench-run curve) except motor k, whose
 * constant is e times the others': the three moment equations then fix e by least squares,
 * e = −(a·b)/(a·a) with a = motor k's moment column times its proxy and b the others' summed
 * moments. The thrust equation only sets the common constant, so the mass need not be known;
 * the CG is held at the design point. Works for any layout with four or more motors.
 */
function fitOne(rows: number[][], proxy: readonly number[], k: number) {
  let aa = 0;
  let ab = 0;
  let bb = 0;
  let all = 0;
  for (const row of rows) {
    const a = row[k]! * proxy[k]!;
    let b = 0;
    for (let j = 0; j < proxy.length; j++) if (j !== k) b += row[j]! * proxy[j]!;
    aa += a * a;
    ab += a * b;
    bb += b * b;
    all += (a + b) ** 2;
  }
  if (!(aa > 1e-12 * Math.max(bb, 1e-300))) return null;
  const e = -ab / aa;
  const residual = Math.max(0, bb - (ab * ab) / aa);
  return { e, explained: all > 0 ? Math.max(0, 1 - residual / all) : 0 };
}

/** Thrust loss of one given motor (1-based), %, or null when the geometry cannot tell. */
export function thrustLossOf(
  airframe: Airframe,
  outputThrust: readonly number[],
  motor: number,
): ThrustLoss | null {
  if (outputThrust.length !== airframe.motors.length || !outputThrust.every(Number.isFinite))
    return null;
  const fit = fitOne(momentRows(airframe), outputThrust, motor - 1);
  return fit ? { motor, lossPct: (1 - fit.e) * 100, explained: fit.explained, cg: 'design' } : null;
}

/** The motor whose lone thrust loss explains the hover moments best, or null. */
export function estimateThrustLoss(
  airframe: Airframe,
  outputThrust: readonly number[],
): ThrustLoss | null {
  let best: ThrustLoss | null = null;
  for (let m = 1; m <= airframe.motors.length; m++) {
    const f = thrustLossOf(airframe, outputThrust, m);
    if (f && f.lossPct > 0 && (!best || f.explained > best.explained)) best = f;
  }
  return best;
}
