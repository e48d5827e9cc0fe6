import { allocationMatrix, mixerMatrix } from '../airframe/allocation';
import type { Airframe } from '../schemas/airframe';
import type { Column } from '../log/types';

export interface Effort {
  collective: Float32Array;
  roll: Float32Array;
  pitch: Float32Array;
  yaw: Float32Array;
}

/**
 * Rows mapping motor outputs to [collective, roll, pitch, yaw] effort. The mixer (n × 4) maps
 * commands to outputs; scaling each of its columns to a largest entry of 1 puts every effort in
 * output units (a roll effort of 0.1 means the most-affected motor moves by 10 %). The
 * least-squares inverse of that scaled mixer is diag(column scale) · allocation.
 */
export function effortRows(airframe: Airframe): number[][] {
  const cg = airframe.cg ?? { x: 0, y: 0 };
  const alloc = allocationMatrix(airframe.motors, cg);
  const mixer = mixerMatrix(airframe.motors, cg);
  return alloc.map((row, j) => {
    let scale = 0;
    for (const r of mixer) scale = Math.max(scale, Math.abs(r[j]!));
    return row.map((v) => v * scale);
  });
}

/** Collective / roll / pitch / yaw effort per sample from motor output columns (0–1). */
export function decomposeEffort(
  airframe: Airframe,
  motors: readonly Column[],
  rows: number,
): Effort {
  const e = effortRows(airframe);
  const n = Math.min(motors.length, airframe.motors.length);
  const out = {
    collective: new Float32Array(rows),
    roll: new Float32Array(rows),
    pitch: new Float32Array(rows),
    yaw: new Float32Array(rows),
  };
  const [w0, w1, w2, w3] = e as [number[], number[], number[], number[]];
  // One pass over the motor columns, all four parts per sample (memory bound, not maths bound).
  for (let i = 0; i < rows; i++) {
    let c = 0;
    let r = 0;
    let p = 0;
    let y = 0;
    for (let m = 0; m < n; m++) {
      const u = motors[m]![i]!;
      c += w0[m]! * u;
      r += w1[m]! * u;
      p += w2[m]! * u;
      y += w3[m]! * u;
    }
    out.collective[i] = c;
    out.roll[i] = r;
    out.pitch[i] = p;
    out.yaw[i] = y;
  }
  return out;
}
