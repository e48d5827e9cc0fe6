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
  const out = [0, 1, 2, 3].map(() => new Float32Array(rows));
  const n = Math.min(motors.length, airframe.motors.length);
  for (let j = 0; j < 4; j++) {
    const dst = out[j]!;
    const w = e[j]!;
    for (let m = 0; m < n; m++) {
      const c = motors[m]!;
      const wm = w[m]!;
      if (wm === 0) continue;
      for (let i = 0; i < rows; i++) dst[i]! += wm * c[i]!;
    }
  }
  return { collective: out[0]!, roll: out[1]!, pitch: out[2]!, yaw: out[3]! };
}
