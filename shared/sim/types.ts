import type { Airframe, Spin } from '../schemas/airframe';

/** Faults the synthesiser can inject; any number combine in one flight. Motors are 1-based. */
export type Fault =
  /** Thrust per command² reduced to `efficiency` (0.88 = 12 % less). 'motor': worn motor, same rpm
   *  needs more command; 'prop': damaged prop, more rpm for the same thrust. */
  | { kind: 'weak-motor'; motor: number; efficiency: number; cause?: 'motor' | 'prop' }
  /** The true CG sits this far (mm) from the airframe's design CG. */
  | { kind: 'cg-offset'; dxMm: number; dyMm: number }
  /** Reaction torque coefficient of one spin set scaled (mismatched props, wrong pitch). */
  | { kind: 'spin-mismatch'; spin: Spin; torqueScale: number }
  /** Motor tilted about its arm: a tangential thrust part, positive deg = nose-right yaw. */
  | { kind: 'tilted-motor'; motor: number; deg: number }
  /** Rotor unbalance (g·mm) replacing the build's baseline for that motor. */
  | { kind: 'rotor-imbalance'; motor: number; unbalanceGmm: number }
  /** Fixed-frequency structural mode excited by the rotors; rms in deg/s on the gyro at hover,
   *  on the roll and pitch axes (default) or one of them. */
  | {
      kind: 'frame-resonance';
      hz: number;
      q?: number;
      rmsDegS?: number;
      axis?: 'roll' | 'pitch' | 'both';
    }
  /** Pack internal resistance scaled up and capacity down (aged or puffed cells). */
  | { kind: 'tired-battery'; resistanceScale: number; capacityScale?: number }
  /** ESCs rated below what the build draws in a punch-out. */
  | { kind: 'esc-overcurrent'; escMaxA: number }
  /** Maximum thrust scaled (e.g. low-kV motors or too few cells); hover needs much more output. */
  | { kind: 'underpowered'; maxThrustScale: number }
  /** Latency between the pilot's setpoint and what the controller acts on. */
  | { kind: 'tracking-delay'; delayMs: number }
  /** A soft tune: rate-loop gains and feedforward scaled by `gainScale` (0.4 = 40 % of the design). */
  | { kind: 'slow-loop'; gainScale: number };

export type FaultKind = Fault['kind'];

/** Physical build figures; everything has a default derived from the airframe. */
export interface BuildParams {
  /** Maximum total thrust ÷ weight of the healthy build. */
  thrustToWeight: number;
  /** Propeller thrust and power coefficients, C_T = T/(ρn²D⁴), C_P = P/(ρn³D⁵). */
  ct: number;
  cp: number;
  /** Air density, kg/m³ (ISA sea level 1.225). */
  rho: number;
  /** Motor speed first-order time constant, s. */
  motorTauS: number;
  /** Electrical → shaft efficiency of motor and ESC together. */
  driveEfficiency: number;
  batteryMah: number;
  /** DC internal resistance per cell, Ω. */
  cellResistanceOhm: number;
  /** State of charge at arming, 0–1. */
  startCharge: number;
  /** Residual unbalance of a healthy rotor, g·mm. */
  unbalanceGmm: number;
  /** Frame amplification of rotor forces reaching the gyro (dimensionless). */
  mountGain: number;
  gyroNoiseDegS: number;
  accNoiseG: number;
  /** Motor output floor while armed, 0–1. */
  idle: number;
  /** Height of the rotor plane above the CG, mm (lever of in-plane rotor forces). */
  rotorHeightMm: number;
}

export interface Scenario {
  name: string;
  describe: string;
  airframe: Airframe;
  faults: Fault[];
  build?: Partial<BuildParams>;
  /** Log per-ESC currents (imotor1…N) as some flight controllers do. */
  logMotorCurrent?: boolean;
  /** Suggested length and rate when the caller gives none. */
  seconds?: number;
  rateHz?: number;
}

export interface SimOptions {
  /** Flight length, s (default scenario.seconds ?? 60). */
  seconds?: number;
  /** Log rate, Hz (default scenario.rateHz ?? 1000). */
  rateHz?: number;
  /** Noise seed (default 1). */
  seed?: number;
}

export type PhaseKind =
  'idle' | 'take-off' | 'hover' | 'roll' | 'pitch' | 'yaw' | 'punch-out' | 'recover' | 'landing';

export interface Phase {
  kind: PhaseKind;
  /** s */
  t0: number;
  /** s */
  t1: number;
}

/** What really happened, so tests and the demo can check the analysis against it. */
export interface GroundTruth {
  scenario: string;
  seed: number;
  seconds: number;
  rateHz: number;
  /** The airframe as flown (an ESC fault shows in escMaxA). */
  airframe: Airframe;
  faults: Fault[];
  /** mm, airframe frame */
  trueCg: { x: number; y: number };
  /** The pilot's script; 'hover' phases are the steady stretches. */
  phases: Phase[];
  params: {
    massKg: number;
    g0: number;
    /** kg·m², diagonal */
    inertiaKgM2: [number, number, number];
    /** Thrust per rpm² per motor, N/rpm² (T = kT·rpm²). */
    kT: number[];
    /** Reaction torque per rpm² per motor, N·m/rpm². */
    kQ: number[];
    /** Rotor speed at output 1 on a full pack, rpm. */
    rpmMax: number[];
    /** Thrust per output² relative to a healthy motor (1 = healthy). */
    thrustEfficiency: number[];
    motorTauS: number;
    unbalanceGmm: number[];
    blades: number;
    frameResonanceHz: number | null;
    frameResonanceQ: number | null;
    cells: number;
    batteryMah: number;
    /** Pack DC internal resistance, Ω. */
    batteryResistanceOhm: number;
    escMaxA: number | null;
    /** Injected setpoint-to-controller latency, ms (the controller adds its own lag on top). */
    delayMs: number;
    /** Scale on the rate loop's gains and feedforward (1 = the design tune). */
    loopGainScale: number;
    idle: number;
    /** Minimum-norm hover thrusts about the design CG (what the airframe predicts), N. */
    expectedHoverThrustN: number[];
    /** Hover thrusts the physics needs about the true CG with the faults, N. */
    trueHoverThrustN: number[];
    /** Highest per-ESC current in the flight, A. */
    peakMotorCurrentA: number[];
    /** Time any ESC spent above escMaxA, s. */
    escOverS: number;
    /** Time any motor output spent ≥ 0.98, s. */
    saturationS: number;
    /** Charge drawn, mAh. */
    mAhUsed: number;
  };
}
