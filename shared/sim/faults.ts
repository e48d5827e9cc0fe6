import type { Airframe } from '../schemas/airframe';
import type { BuildParams, Fault } from './types';

const RAD = Math.PI / 180;

/** What the injected faults change in the build, per motor where it is per motor. */
export interface FaultEffects {
  efficiency: number[];
  cause: ('motor' | 'prop')[];
  torqueScale: number[];
  tiltRad: number[];
  unbalanceGmm: number[];
  cgOffset: { x: number; y: number };
  resonance: { hz: number; q: number; rmsDegS: number; axis: 'roll' | 'pitch' | 'both' } | null;
  resistanceScale: number;
  capacityScale: number;
  escMaxA: number | null;
  maxThrustScale: number;
  delayMs: number;
  /** Scale on the rate loop's gains and feedforward. */
  loopGainScale: number;
}

function checkMotor(fault: Fault & { motor: number }, n: number) {
  if (!Number.isInteger(fault.motor) || fault.motor < 1 || fault.motor > n) {
    throw new RangeError(
      `${fault.kind}: motor ${fault.motor} does not exist on a ${n}-motor airframe`,
    );
  }
}

function positive(value: number, what: string) {
  if (!(value > 0) || !Number.isFinite(value))
    throw new RangeError(`${what} must be a positive number`);
}

/** Checks every fault against the airframe and folds them into one set of effects. */
export function applyFaults(
  airframe: Airframe,
  build: BuildParams,
  faults: readonly Fault[],
): FaultEffects {
  const n = airframe.motors.length;
  const fx: FaultEffects = {
    efficiency: new Array<number>(n).fill(1),
    cause: new Array<'motor' | 'prop'>(n).fill('motor'),
    torqueScale: new Array<number>(n).fill(1),
    tiltRad: new Array<number>(n).fill(0),
    unbalanceGmm: new Array<number>(n).fill(build.unbalanceGmm),
    cgOffset: { x: 0, y: 0 },
    resonance: null,
    resistanceScale: 1,
    capacityScale: 1,
    escMaxA: airframe.escMaxA ?? null,
    maxThrustScale: 1,
    delayMs: 0,
    loopGainScale: 1,
  };
  for (const f of faults) {
    switch (f.kind) {
      case 'weak-motor':
        checkMotor(f, n);
        if (!(f.efficiency > 0 && f.efficiency <= 1.5))
          throw new RangeError('weak-motor: efficiency must be in (0, 1.5]');
        fx.efficiency[f.motor - 1]! *= f.efficiency;
        fx.cause[f.motor - 1] = f.cause ?? 'motor';
        break;
      case 'cg-offset':
        if (!Number.isFinite(f.dxMm) || !Number.isFinite(f.dyMm))
          throw new RangeError('cg-offset: dxMm and dyMm must be numbers');
        fx.cgOffset = { x: fx.cgOffset.x + f.dxMm, y: fx.cgOffset.y + f.dyMm };
        break;
      case 'spin-mismatch':
        positive(f.torqueScale, 'spin-mismatch: torqueScale');
        airframe.motors.forEach((m, i) => {
          if (m.spin === f.spin) fx.torqueScale[i]! *= f.torqueScale;
        });
        break;
      case 'tilted-motor':
        checkMotor(f, n);
        if (!(Math.abs(f.deg) <= 30)) throw new RangeError('tilted-motor: deg must be within ±30');
        fx.tiltRad[f.motor - 1] = f.deg * RAD;
        break;
      case 'rotor-imbalance':
        checkMotor(f, n);
        if (!(f.unbalanceGmm >= 0))
          throw new RangeError('rotor-imbalance: unbalanceGmm must be ≥ 0');
        fx.unbalanceGmm[f.motor - 1] = f.unbalanceGmm;
        break;
      case 'frame-resonance':
        positive(f.hz, 'frame-resonance: hz');
        fx.resonance = { hz: f.hz, q: f.q ?? 12, rmsDegS: f.rmsDegS ?? 4, axis: f.axis ?? 'both' };
        positive(fx.resonance.q, 'frame-resonance: q');
        break;
      case 'tired-battery':
        positive(f.resistanceScale, 'tired-battery: resistanceScale');
        fx.resistanceScale *= f.resistanceScale;
        fx.capacityScale *= f.capacityScale ?? 1;
        break;
      case 'esc-overcurrent':
        positive(f.escMaxA, 'esc-overcurrent: escMaxA');
        fx.escMaxA = f.escMaxA;
        break;
      case 'underpowered':
        if (!(f.maxThrustScale > 0 && f.maxThrustScale <= 1))
          throw new RangeError('underpowered: maxThrustScale must be in (0, 1]');
        fx.maxThrustScale *= f.maxThrustScale;
        break;
      case 'tracking-delay':
        if (!(f.delayMs >= 0 && f.delayMs <= 1000))
          throw new RangeError('tracking-delay: delayMs must be within 0–1000');
        fx.delayMs += f.delayMs;
        break;
      case 'slow-loop':
        if (!(f.gainScale > 0 && f.gainScale <= 1))
          throw new RangeError('slow-loop: gainScale must be in (0, 1]');
        fx.loopGainScale *= f.gainScale;
        break;
      default: {
        const never: never = f;
        throw new RangeError(`unknown fault ${JSON.stringify(never)}`);
      }
    }
  }
  return fx;
}
