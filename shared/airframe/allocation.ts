import type { Airframe, Motor } from '../schemas/airframe';
import { invert, multiply, multiplyVector, transpose, type Matrix } from './linear-algebra';

/** Standard gravity, m/s² (CGPM 1901, 3rd General Conference on Weights and Measures). */
export const G0 = 9.80665;

/** Reaction torque per unit thrust, in metres, when nothing better is known (illustrative). */
export const DEFAULT_YAW_K = 0.016;

export interface Point {
  /** mm, forward */
  x: number;
  /** mm, right */
  y: number;
}

const ORIGIN: Point = { x: 0, y: 0 };

/** +1 for a clockwise prop (its reaction pushes the frame ccw, a negative yaw moment). */
export function spinSign(spin: Motor['spin']): 1 | -1 {
  return spin === 'cw' ? 1 : -1;
}

/**
 * Allocation matrix, 4 × n: rows are total thrust (N), roll L, pitch M and yaw N moments (N·m)
 * per newton of each motor's thrust, about the CG. Motor and CG positions in mm, yawK in m.
 * Signs per shared/README.md §4: L = −Σ(y_i−y_c)T_i, M = Σ(x_i−x_c)T_i, N = −Σ s_i k T_i, s = +1 cw.
 */
export function allocationMatrix(
  motors: readonly Motor[],
  cg: Point = ORIGIN,
  yawK: number = DEFAULT_YAW_K,
): Matrix {
  const thrust: number[] = [];
  const roll: number[] = [];
  const pitch: number[] = [];
  const yaw: number[] = [];
  for (const m of motors) {
    thrust.push(1);
    roll.push(-(m.y - cg.y) / 1000);
    pitch.push((m.x - cg.x) / 1000);
    yaw.push(-spinSign(m.spin) * yawK);
  }
  return [thrust, roll, pitch, yaw];
}

/**
 * Mixer, n × 4: motor thrusts (N) for a wanted [thrust N, L, M, N N·m] about the CG.
 * The exact inverse for a quad, the minimum-norm right inverse Aᵀ(AAᵀ)⁻¹ for 6 or 8 motors.
 * Throws when the geometry cannot control all four axes (e.g. all props spin one way).
 */
export function mixerMatrix(
  motors: readonly Motor[],
  cg: Point = ORIGIN,
  yawK: number = DEFAULT_YAW_K,
): Matrix {
  if (motors.length < 4) {
    throw new RangeError(`a mixer needs at least 4 motors to control thrust, roll, pitch and yaw`);
  }
  const a = allocationMatrix(motors, cg, yawK);
  const at = transpose(a);
  let gramInv: Matrix;
  try {
    gramInv = invert(multiply(a, at));
  } catch {
    throw new RangeError(
      'this motor layout cannot control roll, pitch and yaw independently (check positions and spins)',
    );
  }
  return multiply(at, gramInv);
}

function designCg(airframe: Airframe): Point {
  return airframe.cg ?? ORIGIN;
}

/**
 * Hover thrust of each motor in N: the minimum-norm T with ΣT = m·g0 and L = M = N = 0 about
 * `cg` (mm; defaults to the airframe's design CG).
 */
export function hoverThrustsN(airframe: Airframe, cg: Point = designCg(airframe)): number[] {
  const weight = (airframe.massG / 1000) * G0;
  return multiplyVector(mixerMatrix(airframe.motors, cg), [weight, 0, 0, 0]);
}

/**
 * Expected share of the total hover thrust per motor (sums to 1) about the design CG. The yaw
 * row has a zero target, so its scale (k) does not change the answer.
 */
export function expectedHoverShares(airframe: Airframe): number[] {
  const t = hoverThrustsN(airframe);
  const total = t.reduce((s, v) => s + v, 0);
  return t.map((v) => v / total);
}
