import { allocationMatrix, hoverThrustsN, mixerMatrix } from '../airframe/allocation';
import type { Airframe } from '../schemas/airframe';
import { physicalHoverThrusts, reactionYawSign, type Plant } from './plant';
import type { BuildParams } from './types';

/** Share of the plant inverse the feedforward supplies (roll and pitch; yaw). */
const FF_SHARE = 0.85;
const FF_SHARE_YAW = 0;

/** A rate PI per axis, proportional and integral gains in output per rad/s (and per rad). */
export interface AxisGains {
  kp: number;
  ki: number;
  /** Feedforward, output per rad/s² of commanded angular acceleration at hover. */
  ff: number;
}

/** The flight controller and the pilot's feel for this aircraft, fixed before take-off. */
export interface ControllerDesign {
  /** Output per unit throttle per motor, thrust-linearised. */
  collective: Float64Array;
  /** Mixer columns for roll, pitch and yaw, each scaled so its largest entry is 1. */
  ctl: [Float64Array, Float64Array, Float64Array];
  roll: AxisGains;
  pitch: AxisGains;
  yaw: AxisGains;
  /** Minimum-norm hover thrusts about the design CG (what the airframe predicts), N. */
  expectedHover: number[];
  /** Hover thrusts the physics needs about the true CG with the faults, N. */
  trueHover: number[];
  /** Throttle the pilot hovers at, 0–1. */
  pilotHover: number;
  /** Throttle of a punch-out, 0–1. */
  punchThrottle: number;
}

/**
 * The controller is designed on the healthy nominal build about the design CG, as a tuner would
 * before knowing the faults: crossover at half (roll, pitch) or a quarter (yaw) of the motor's
 * own bandwidth, integral corner a quarter of that.
 */
export function designController(
  airframe: Airframe,
  build: BuildParams,
  plant: Plant,
): ControllerDesign {
  const motors = airframe.motors;
  const n = motors.length;
  const { kT0, kQ0, rpmMax0, designCg, cells, vFull } = plant;
  const yawKDesign = kQ0 / kT0;
  const mixer = mixerMatrix(motors, designCg, yawKDesign);
  const designA = allocationMatrix(motors, designCg, yawKDesign);
  const expectedHover = hoverThrustsN(airframe, designCg);
  const maxHover = Math.max(...expectedHover);
  const collective = new Float64Array(n);
  for (let i = 0; i < n; i++) collective[i] = Math.sqrt(expectedHover[i]! / maxHover);
  const ctl: [Float64Array, Float64Array, Float64Array] = [
    new Float64Array(n),
    new Float64Array(n),
    new Float64Array(n),
  ];
  for (let a = 0; a < 3; a++) {
    let peak = 0;
    for (let i = 0; i < n; i++) peak = Math.max(peak, Math.abs(mixer[i]![a + 1]!));
    for (let i = 0; i < n; i++) ctl[a]![i] = mixer[i]![a + 1]! / peak;
  }
  const vHoverGuess = 3.85 * cells;
  const rpmHoverScale = rpmMax0 * (vHoverGuess / vFull);
  const uHover = expectedHover.map((t) => Math.sqrt(t / kT0) / rpmHoverScale);
  const inertia = [plant.jxx, plant.jyy, plant.jzz];
  const gains = [0, 1, 2].map((a): AxisGains => {
    // Moment per unit controller output at the hover operating point.
    let b = 0;
    for (let i = 0; i < n; i++) {
      const dTdu = 2 * kT0 * rpmHoverScale * rpmHoverScale * uHover[i]!;
      const lever = a < 2 ? designA[a + 1]![i]! : reactionYawSign(motors[i]!.spin) * (kQ0 / kT0);
      b += lever * dTdu * ctl[a]![i]!;
    }
    const wc = (a < 2 ? 0.5 : 0.25) / build.motorTauS; // crossover, rad/s
    const kp = (wc * inertia[a]!) / b;
    // Feedforward short of the full plant inverse, less on yaw, whose authority is small: a
    // tune that asks for every bit of a stick move saturates the motors (common practice).
    return { kp, ki: (kp * wc) / 4, ff: ((a < 2 ? FF_SHARE : FF_SHARE_YAW) * inertia[a]!) / b };
  });

  // The pilot knows how this machine hovers (faults included) and flies around that throttle.
  const trueHover = physicalHoverThrusts(plant);
  let pilotHover = 0;
  for (let i = 0; i < n; i++) {
    const u = Math.sqrt(trueHover[i]! / plant.kT[i]!) / (plant.rpmMax[i]! * (vHoverGuess / vFull));
    pilotHover = Math.max(pilotHover, u / collective[i]!);
  }
  pilotHover = Math.min(0.95, pilotHover);
  // A punch-out asks for a climb acceleration (2 g on a small quad, 0.8 g on a heavy rig); with
  // thrust ∝ output² that is hover output × √(1 + a/g), capped at full.
  const punchG = airframe.prop.diameterIn <= 7 ? 2 : 0.8;
  return {
    collective,
    ctl,
    roll: gains[0]!,
    pitch: gains[1]!,
    yaw: gains[2]!,
    expectedHover,
    trueHover,
    pilotHover,
    punchThrottle: Math.min(1, pilotHover * Math.sqrt(1 + punchG)),
  };
}
