import type { Plant } from './plant';
import type { ParkMiller } from './prng';

const RPM_TO_RAD_S = (2 * Math.PI) / 60;

/** Gain of an idealised sensor anti-alias filter: flat to 0.4·fs, cosine roll-off to 0 at Nyquist. */
export function antiAlias(hz: number, fs: number): number {
  const lo = 0.4 * fs;
  if (hz <= lo) return 1;
  if (hz >= 0.5 * fs) return 0;
  return 0.5 * (1 + Math.cos((Math.PI * (hz - lo)) / (0.1 * fs)));
}

const WOBBLES = 5;

/**
 * The pilot's thumbs: five slow incommensurate sinusoids per axis (0.2–2.5 Hz, about 1 deg/s
 * each), drawn once from the pilot's noise stream. Returns the wobble of an axis at time t, deg/s.
 */
export function pilotWobble(rng: ParkMiller): (axis: number, t: number) => number {
  const w = new Float64Array(3 * WOBBLES);
  const amp = new Float64Array(3 * WOBBLES);
  const phase = new Float64Array(3 * WOBBLES);
  for (let k = 0; k < 3 * WOBBLES; k++) {
    w[k] = 2 * Math.PI * (0.2 + 2.3 * rng.uniform());
    amp[k] = 0.6 + 0.8 * rng.uniform();
    phase[k] = 2 * Math.PI * rng.uniform();
  }
  return (axis, t) => {
    let s = 0;
    for (let k = axis * WOBBLES; k < (axis + 1) * WOBBLES; k++) {
      s += amp[k]! * Math.sin(w[k]! * t + phase[k]!);
    }
    return s;
  };
}

/**
 * A structural frame mode: two AR(2) resonators (roll and pitch axes) at the log rate driven by
 * white noise, normalised to unit rms from the AR(2) variance formula. `next()` advances one
 * log sample and leaves the two outputs in `x` and `y`.
 */
export class FrameMode {
  x = 0;
  y = 0;
  private readonly a1: number;
  private readonly a2: number;
  private readonly norm: number;
  private x1 = 0;
  private x2 = 0;
  private y1 = 0;
  private y2 = 0;

  constructor(
    hz: number,
    q: number,
    rateHz: number,
    private readonly rng: ParkMiller,
  ) {
    const w = (2 * Math.PI * hz) / rateHz;
    const r = Math.exp((-Math.PI * (hz / q)) / rateHz);
    this.a1 = 2 * r * Math.cos(w);
    this.a2 = -r * r;
    const var0 = (1 - this.a2) / ((1 + this.a2) * ((1 - this.a2) ** 2 - this.a1 * this.a1));
    this.norm = 1 / Math.sqrt(var0);
  }

  next(): void {
    const x0 = this.rng.normal();
    const y0 = this.rng.normal();
    const rx = this.a1 * this.x1 + this.a2 * this.x2 + x0 * this.norm;
    const ry = this.a1 * this.y1 + this.a2 * this.y2 + y0 * this.norm;
    this.x2 = this.x1;
    this.x1 = rx;
    this.y2 = this.y1;
    this.y1 = ry;
    this.x = rx;
    this.y = ry;
  }
}

/** Rotor vibration summed over the rotors at the sensors: specific force, m/s², and rates, rad/s. */
export interface SensorVibration {
  ax: number;
  ay: number;
  az: number;
  gx: number;
  gy: number;
  gz: number;
}

/**
 * Adds rotor i's vibration: its 1× line, a rotating in-plane force U·Ω² (ISO 21940-11 residual
 * unbalance, U in g·mm → kg·m) acting at the rotor plane above the CG, and its blade-pass line,
 * a thrust ripple at blades × Ω. Both pass the sensors' anti-alias roll-off.
 */
export function addRotorVibration(
  sum: SensorVibration,
  plant: Plant,
  i: number,
  rpm: number,
  psi: number,
  thrust: number,
  unbalanceGmm: number,
  mountGain: number,
  rotorHeightM: number,
  rateHz: number,
): void {
  const omega = rpm * RPM_TO_RAD_S;
  const f1 = rpm / 60;
  const { massKg, jxx, jyy, jzz, blades } = plant;
  const armX = plant.armX[i]!;
  const armY = plant.armY[i]!;
  const g1 = antiAlias(f1, rateHz);
  if (g1 > 0 && omega > 1) {
    const force = unbalanceGmm * 1e-6 * omega * omega * mountGain * g1;
    const fxs = force * Math.cos(psi);
    const fys = force * Math.sin(psi);
    sum.ax += fxs / massKg;
    sum.ay += fys / massKg;
    // Moment of the in-plane force at the rotor (above the CG), as a rate at Ω.
    sum.gx += (rotorHeightM * fys) / jxx / omega;
    sum.gy -= (rotorHeightM * fxs) / jyy / omega;
    sum.gz += (0.25 * (armX * fys - armY * fxs)) / jzz / omega;
  }
  const fb = blades * f1;
  const gb = antiAlias(fb, rateHz);
  if (gb > 0 && omega > 1) {
    const ripple = 0.04 * thrust * mountGain * gb * Math.cos(blades * psi);
    sum.az -= ripple / massKg;
    sum.gx -= (armY * ripple) / jxx / (blades * omega);
    sum.gy += (armX * ripple) / jyy / (blades * omega);
  }
}
