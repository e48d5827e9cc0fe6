import { G0 } from '../airframe/allocation';
import { invert, multiply, multiplyVector, transpose } from '../airframe/linear-algebra';
import type { Airframe } from '../schemas/airframe';
import type { FaultEffects } from './faults';
import type { BuildParams } from './types';

/** Sign of a rotor's reaction yaw moment: a clockwise prop pushes the frame ccw (Newton's third law). */
export function reactionYawSign(spin: 'cw' | 'ccw'): 1 | -1 {
  return spin === 'cw' ? -1 : 1;
}

/** The physical aircraft as flown: rotors (faults included), arms about the true CG, inertia, pack. */
export interface Plant {
  massKg: number;
  /** N */
  weight: number;
  cells: number;
  /** Full-pack voltage, V. */
  vFull: number;
  blades: number;
  /** Healthy rotor thrust and torque per rpm², and full-output rpm on a full pack. */
  kT0: number;
  kQ0: number;
  rpmMax0: number;
  designCg: { x: number; y: number };
  trueCg: { x: number; y: number };
  kT: Float64Array;
  kQ: Float64Array;
  rpmMax: Float64Array;
  /** Reaction yaw sign per rotor. */
  spinSign: Float64Array;
  /** Rotor position from the true CG, m, and its distance. */
  armX: Float64Array;
  armY: Float64Array;
  armR: Float64Array;
  cosTilt: Float64Array;
  sinTilt: Float64Array;
  /** Diagonal inertia, kg·m². */
  jxx: number;
  jyy: number;
  jzz: number;
  /** Quadratic vertical drag coefficient, 1/m. */
  dragZ: number;
  capacityMah: number;
  /** Pack DC resistance, Ω. */
  packR: number;
}

export function buildPlant(airframe: Airframe, build: BuildParams, fx: FaultEffects): Plant {
  const motors = airframe.motors;
  const n = motors.length;
  const massKg = airframe.massG / 1000;
  const weight = massKg * G0;
  const cells = airframe.cells ?? 4;
  const vFull = 4.2 * cells;
  const dM = airframe.prop.diameterIn * 0.0254;
  // Propeller law (shared/README.md §4; tests/REFERENCES.md §6): T = C_T·ρ·n²·D⁴, P = C_P·ρ·n³·D⁵, n in rev/s.
  const kT0 = (build.ct * build.rho * dM ** 4) / 3600; // N per rpm²
  const kQ0 = (build.cp * build.rho * dM ** 5) / (2 * Math.PI) / 3600; // N·m per rpm²
  const rpmMax0 =
    60 * Math.sqrt((build.thrustToWeight * weight) / n / (build.ct * build.rho * dM ** 4));
  const designCg = airframe.cg ?? { x: 0, y: 0 };
  const trueCg = { x: designCg.x + fx.cgOffset.x, y: designCg.y + fx.cgOffset.y };

  const kT = new Float64Array(n);
  const kQ = new Float64Array(n);
  const rpmMax = new Float64Array(n);
  const spinSign = new Float64Array(n);
  const armX = new Float64Array(n);
  const armY = new Float64Array(n);
  const armR = new Float64Array(n);
  const cosTilt = new Float64Array(n);
  const sinTilt = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const m = motors[i]!;
    const eff = fx.efficiency[i]!;
    const prop = fx.cause[i] === 'prop';
    kT[i] = kT0 * (prop ? eff : 1);
    kQ[i] = kQ0 * (prop ? eff : 1) * fx.torqueScale[i]!;
    rpmMax[i] = rpmMax0 * (prop ? 1 : Math.sqrt(eff)) * Math.sqrt(fx.maxThrustScale);
    spinSign[i] = reactionYawSign(m.spin);
    armX[i] = (m.x - trueCg.x) / 1000;
    armY[i] = (m.y - trueCg.y) / 1000;
    armR[i] = Math.hypot(armX[i]!, armY[i]!);
    cosTilt[i] = Math.cos(fx.tiltRad[i]!);
    sinTilt[i] = Math.sin(fx.tiltRad[i]!);
  }

  // Inertia: arms and motors as point masses at the rotors, the core as a compact block.
  let sx2 = 0;
  let sy2 = 0;
  let rAvg = 0;
  for (const m of motors) {
    sx2 += (m.x / 1000) ** 2;
    sy2 += (m.y / 1000) ** 2;
    rAvg += Math.hypot(m.x, m.y) / 1000 / n;
  }
  const armShare = (0.35 * massKg) / n;
  return {
    massKg,
    weight,
    cells,
    vFull,
    blades: airframe.prop.blades,
    kT0,
    kQ0,
    rpmMax0,
    designCg,
    trueCg,
    kT,
    kQ,
    rpmMax,
    spinSign,
    armX,
    armY,
    armR,
    cosTilt,
    sinTilt,
    jxx: armShare * sy2 + 0.04 * massKg * rAvg * rAvg,
    jyy: armShare * sx2 + 0.04 * massKg * rAvg * rAvg,
    jzz: armShare * (sx2 + sy2) + 0.06 * massKg * rAvg * rAvg,
    // Quadratic vertical drag sized so a full-power climb tops out near 30 m/s.
    dragZ: ((build.thrustToWeight - 1) * G0) / 900,
    capacityMah: build.batteryMah * fx.capacityScale,
    packR: build.cellResistanceOhm * cells * fx.resistanceScale,
  };
}

/**
 * Minimum-norm hover thrusts (N) the physics asks for: vertical thrust = weight, and no roll,
 * pitch or yaw moment about the true CG with each rotor's own torque ratio and tilt.
 */
export function physicalHoverThrusts(p: Plant): number[] {
  const n = p.kT.length;
  const a: number[][] = [[], [], [], []];
  for (let i = 0; i < n; i++) {
    a[0]!.push(p.cosTilt[i]!);
    a[1]!.push(-p.armY[i]! * p.cosTilt[i]!);
    a[2]!.push(p.armX[i]! * p.cosTilt[i]!);
    a[3]!.push((p.spinSign[i]! * p.kQ[i]!) / p.kT[i]! + p.armR[i]! * p.sinTilt[i]!);
  }
  const at = transpose(a);
  return multiplyVector(multiply(at, invert(multiply(a, at))), [p.weight, 0, 0, 0]);
}
