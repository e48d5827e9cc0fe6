import { allocationMatrix, G0, hoverThrustsN, mixerMatrix } from '../airframe/allocation';
import { invert, multiply, multiplyVector, transpose } from '../airframe/linear-algebra';
import type { LogWarning, ParsedLog } from '../log/types';
import type { Airframe } from '../schemas/airframe';
import { cellOpenCircuitV, terminalVoltage } from './battery';
import { defaultBuild } from './build';
import { buildPhases } from './pilot-script';
import { streamFor } from './prng';
import type { BuildParams, Fault, GroundTruth, Phase, Scenario, SimOptions } from './types';

const DEG = 180 / Math.PI;
const RAD = Math.PI / 180;
const RPM_TO_RAD_S = (2 * Math.PI) / 60;
/** Longest integration step, s; the step is also never longer than the log step. */
const MAX_STEP_S = 0.001;
const CRUISE_ALT_M = 3;
/** Radio link frame period, s (250 Hz, a common rate for a low-latency link). */
const RADIO_FRAME_S = 0.004;
/** Constant draw of flight controller, receiver and video, A. */
const AVIONICS_A = 0.6;

/** Sign of a rotor's reaction yaw moment: a clockwise prop pushes the frame ccw (Newton's third law). */
export function reactionYawSign(spin: 'cw' | 'ccw'): 1 | -1 {
  return spin === 'cw' ? -1 : 1;
}

interface FaultEffects {
  efficiency: number[];
  cause: ('motor' | 'prop')[];
  torqueScale: number[];
  tiltRad: number[];
  unbalanceGmm: number[];
  cgOffset: { x: number; y: number };
  resonance: { hz: number; q: number; rmsDegS: number } | null;
  resistanceScale: number;
  capacityScale: number;
  escMaxA: number | null;
  maxThrustScale: number;
  delayMs: number;
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

function applyFaults(
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
        fx.resonance = { hz: f.hz, q: f.q ?? 12, rmsDegS: f.rmsDegS ?? 4 };
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
      default: {
        const never: never = f;
        throw new RangeError(`unknown fault ${JSON.stringify(never)}`);
      }
    }
  }
  return fx;
}

/**
 * Minimum-norm hover thrusts (N) the physics asks for: vertical thrust = weight, and no roll,
 * pitch or yaw moment about the true CG with each rotor's own torque ratio and tilt.
 */
function physicalHoverThrusts(
  kT: Float64Array,
  kQ: Float64Array,
  spinSign: Float64Array,
  armX: Float64Array,
  armY: Float64Array,
  armR: Float64Array,
  cosTilt: Float64Array,
  sinTilt: Float64Array,
  weight: number,
): number[] {
  const n = kT.length;
  const a: number[][] = [[], [], [], []];
  for (let i = 0; i < n; i++) {
    a[0]!.push(cosTilt[i]!);
    a[1]!.push(-armY[i]! * cosTilt[i]!);
    a[2]!.push(armX[i]! * cosTilt[i]!);
    a[3]!.push((spinSign[i]! * kQ[i]!) / kT[i]! + armR[i]! * sinTilt[i]!);
  }
  const at = transpose(a);
  return multiplyVector(multiply(at, invert(multiply(a, at))), [weight, 0, 0, 0]);
}

/** Smooth 0→1 ramp on [0, 1] with zero slope at both ends. */
function smoothstep(x: number): number {
  const c = x <= 0 ? 0 : x >= 1 ? 1 : x;
  return c * c * (3 - 2 * c);
}

/** Gain of an idealised sensor anti-alias filter: flat to 0.4·fs, cosine roll-off to 0 at Nyquist. */
function antiAlias(hz: number, fs: number): number {
  const lo = 0.4 * fs;
  if (hz <= lo) return 1;
  if (hz >= 0.5 * fs) return 0;
  return 0.5 * (1 + Math.cos((Math.PI * (hz - lo)) / (0.1 * fs)));
}

/**
 * Fly a scenario and log it: rigid-body roll/pitch/yaw with diagonal inertia and vertical
 * translation, motors with first-order lag, T = kT·rpm², Q = kQ·rpm², a rate PID mixing through
 * the airframe's geometry, a scripted pilot, battery sag and sensor vibration. Columns are in
 * canonical units (s, frac, rpm, deg/s, g, V, A). Deterministic for a given seed.
 */
export function simulate(
  scenario: Scenario,
  opts: SimOptions = {},
): { log: ParsedLog; truth: GroundTruth } {
  const seconds = opts.seconds ?? scenario.seconds ?? 60;
  const rateHz = opts.rateHz ?? scenario.rateHz ?? 1000;
  const seed = opts.seed ?? 1;
  if (!(rateHz >= 50 && rateHz <= 20_000))
    throw new RangeError(`rate must be within 50–20000 Hz, got ${rateHz}`);
  if (!Number.isInteger(seed)) throw new RangeError(`seed must be an integer, got ${seed}`);
  const phases = buildPhases(seconds);

  const airframe = scenario.airframe;
  const motors = airframe.motors;
  const n = motors.length;
  const build: BuildParams = { ...defaultBuild(airframe), ...scenario.build };
  const fx = applyFaults(airframe, build, scenario.faults);

  // --- Physical constants of this build -------------------------------------------------
  const massKg = airframe.massG / 1000;
  const weight = massKg * G0;
  const cells = airframe.cells ?? 4;
  const vFull = 4.2 * cells;
  const dM = airframe.prop.diameterIn * 0.0254;
  const blades = airframe.prop.blades;
  // Propeller law (REFERENCES.md §6): T = C_T·ρ·n²·D⁴, P = C_P·ρ·n³·D⁵, n in rev/s.
  const kT0 = (build.ct * build.rho * dM ** 4) / 3600; // N per rpm²
  const kQ0 = (build.cp * build.rho * dM ** 5) / (2 * Math.PI) / 3600; // N·m per rpm²
  const rpmMax0 =
    60 * Math.sqrt((build.thrustToWeight * weight) / n / (build.ct * build.rho * dM ** 4));
  const designCg = airframe.cg ?? { x: 0, y: 0 };
  const trueCg = { x: designCg.x + fx.cgOffset.x, y: designCg.y + fx.cgOffset.y };

  const kT = new Float64Array(n);
  const kQ = new Float64Array(n);
  const rpmMax = new Float64Array(n);
  const spinSign = new Float64Array(n); // reaction yaw sign
  const armX = new Float64Array(n); // m, from the true CG
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
  const jxx = armShare * sy2 + 0.04 * massKg * rAvg * rAvg;
  const jyy = armShare * sx2 + 0.04 * massKg * rAvg * rAvg;
  const jzz = armShare * (sx2 + sy2) + 0.06 * massKg * rAvg * rAvg;
  // Quadratic vertical drag sized so a full-power climb tops out near 30 m/s.
  const dragZ = ((build.thrustToWeight - 1) * G0) / 900;

  // --- Battery ----------------------------------------------------------------------------
  const capacityMah = build.batteryMah * fx.capacityScale;
  const packR = build.cellResistanceOhm * cells * fx.resistanceScale;

  // --- Controller, designed on the healthy nominal build about the design CG ----------------
  const yawKDesign = kQ0 / kT0;
  const mixer = mixerMatrix(motors, designCg, yawKDesign);
  const designA = allocationMatrix(motors, designCg, yawKDesign);
  const expectedHover = hoverThrustsN(airframe, designCg);
  const maxHover = Math.max(...expectedHover);
  const collective = new Float64Array(n); // output per unit throttle, thrust-linearised
  for (let i = 0; i < n; i++) collective[i] = Math.sqrt(expectedHover[i]! / maxHover);
  const ctl = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];
  for (let a = 0; a < 3; a++) {
    let peak = 0;
    for (let i = 0; i < n; i++) peak = Math.max(peak, Math.abs(mixer[i]![a + 1]!));
    for (let i = 0; i < n; i++) ctl[a]![i] = mixer[i]![a + 1]! / peak;
  }
  const vHoverGuess = 3.85 * cells;
  const rpmHoverScale = rpmMax0 * (vHoverGuess / vFull);
  const uHover = expectedHover.map((t) => Math.sqrt(t / kT0) / rpmHoverScale);
  const inertia = [jxx, jyy, jzz];
  const gains = [0, 1, 2].map((a) => {
    // Moment per unit controller output at the hover operating point.
    let b = 0;
    for (let i = 0; i < n; i++) {
      const dTdu = 2 * kT0 * rpmHoverScale * rpmHoverScale * uHover[i]!;
      const lever = a < 2 ? designA[a + 1]![i]! : reactionYawSign(motors[i]!.spin) * (kQ0 / kT0);
      b += lever * dTdu * ctl[a]![i]!;
    }
    const wc = (a < 2 ? 0.5 : 0.25) / build.motorTauS; // crossover, rad/s
    const kp = (wc * inertia[a]!) / b;
    return { kp, ki: (kp * wc) / 4 };
  });
  const kpR = gains[0]!.kp;
  const kiR = gains[0]!.ki;
  const kpP = gains[1]!.kp;
  const kiP = gains[1]!.ki;
  const kpY = gains[2]!.kp;
  const kiY = gains[2]!.ki;

  // The pilot knows how this machine hovers (faults included) and flies around that throttle.
  const trueHover = physicalHoverThrusts(
    kT,
    kQ,
    spinSign,
    armX,
    armY,
    armR,
    cosTilt,
    sinTilt,
    weight,
  );
  let pilotHover = 0;
  for (let i = 0; i < n; i++) {
    const u = Math.sqrt(trueHover[i]! / kT[i]!) / (rpmMax[i]! * (vHoverGuess / vFull));
    pilotHover = Math.max(pilotHover, u / collective[i]!);
  }
  pilotHover = Math.min(0.95, pilotHover);
  // A punch-out asks for a climb acceleration (2 g on a small quad, 0.8 g on a heavy rig); with
  // thrust ∝ output² that is hover output × √(1 + a/g), capped at full.
  const punchG = airframe.prop.diameterIn <= 7 ? 2 : 0.8;
  const punchThrottle = Math.min(1, pilotHover * Math.sqrt(1 + punchG));

  // --- Steps and output ---------------------------------------------------------------------
  const rows = Math.round(seconds * rateHz) + 1;
  const logDt = 1 / rateHz;
  const sub = Math.max(1, Math.ceil(logDt / MAX_STEP_S - 1e-9));
  const dt = logDt / sub;
  const motorAlpha = 1 - Math.exp(-dt / build.motorTauS);
  const idle = build.idle;

  const time = new Float64Array(rows);
  const motorCols = Array.from({ length: n }, () => new Float32Array(rows));
  const rpmCols = Array.from({ length: n }, () => new Float32Array(rows));
  const imotorCols = scenario.logMotorCurrent
    ? Array.from({ length: n }, () => new Float32Array(rows))
    : null;
  const gyroX = new Float32Array(rows);
  const gyroY = new Float32Array(rows);
  const gyroZ = new Float32Array(rows);
  const accX = new Float32Array(rows);
  const accY = new Float32Array(rows);
  const accZ = new Float32Array(rows);
  const spRoll = new Float32Array(rows);
  const spPitch = new Float32Array(rows);
  const spYaw = new Float32Array(rows);
  const throttleCol = new Float32Array(rows);
  const vbatCol = new Float32Array(rows);
  const ibatCol = new Float32Array(rows);

  const sensorRng = streamFor(seed, 1);
  const loopRng = streamFor(seed, 2);
  const pilotRng = streamFor(seed, 3);
  const resonanceRng = streamFor(seed, 4);
  const phaseRng = streamFor(seed, 5);

  // Pilot thumbs: five slow incommensurate sinusoids per axis, deg/s.
  const WOBBLES = 5;
  const wobbleW = new Float64Array(3 * WOBBLES);
  const wobbleAmp = new Float64Array(3 * WOBBLES);
  const wobblePhase = new Float64Array(3 * WOBBLES);
  for (let k = 0; k < 3 * WOBBLES; k++) {
    wobbleW[k] = 2 * Math.PI * (0.2 + 2.3 * pilotRng.uniform());
    wobbleAmp[k] = 0.6 + 0.8 * pilotRng.uniform();
    wobblePhase[k] = 2 * Math.PI * pilotRng.uniform();
  }
  const wobbleAt = (axis: number, t: number) => {
    let s = 0;
    for (let k = axis * WOBBLES; k < (axis + 1) * WOBBLES; k++) {
      s += wobbleAmp[k]! * Math.sin(wobbleW[k]! * t + wobblePhase[k]!);
    }
    return s;
  };

  // Rotor phases start scattered so the rotors' 1× lines do not add coherently at t = 0.
  const rotorPhase = new Float64Array(n);
  for (let i = 0; i < n; i++) rotorPhase[i] = 2 * Math.PI * phaseRng.uniform();

  // Setpoint latency ring buffer (controller steps).
  const delaySteps = Math.round(fx.delayMs / 1000 / dt);
  const ringLen = delaySteps + 1;
  const ringR = new Float64Array(ringLen);
  const ringP = new Float64Array(ringLen);
  const ringY = new Float64Array(ringLen);
  let ringPos = 0;

  // Frame resonance: two AR(2) resonators (roll and pitch axes) at the log rate, normalised to
  // unit rms from the AR(2) variance formula, then scaled by the excitation.
  const res = fx.resonance && fx.resonance.hz < 0.45 * rateHz ? fx.resonance : null;
  let resA1 = 0;
  let resA2 = 0;
  let resNorm = 0;
  if (res) {
    const w = (2 * Math.PI * res.hz) / rateHz;
    const r = Math.exp((-Math.PI * (res.hz / res.q)) / rateHz);
    resA1 = 2 * r * Math.cos(w);
    resA2 = -r * r;
    const var0 = (1 - resA2) / ((1 + resA2) * ((1 - resA2) ** 2 - resA1 * resA1));
    resNorm = 1 / Math.sqrt(var0);
  }
  let rx1 = 0;
  let rx2 = 0;
  let ry1 = 0;
  let ry2 = 0;

  // --- State --------------------------------------------------------------------------------
  // Armed at idle from the first sample.
  const rpm = new Float64Array(n);
  const u = new Float64Array(n).fill(idle);
  for (let i = 0; i < n; i++) rpm[i] = idle * rpmMax[i]!;
  const thrust = new Float64Array(n);
  const motorA = new Float64Array(n);
  const peakMotorA = new Float64Array(n);
  let p = 0;
  let q = 0;
  let r = 0;
  let roll = 0;
  let pitch = 0;
  let alt = 0;
  let climb = 0;
  let airborne = false;
  let iR = 0;
  let iP = 0;
  let iY = 0;
  let altI = 0;
  let chargeMah = 0;
  let vbat = cellOpenCircuitV(build.startCharge) * cells;
  let ibat = AVIONICS_A;
  let saturated = false;
  let saturationS = 0;
  let escOverS = 0;
  let phaseIdx = 0;
  let phaseStartAlt = 0;
  let lastPhaseIdx = -1;
  let throttle = 0;
  let stickR = 0;
  let stickP = 0;
  let stickY = 0;
  let nextRadioT = 0;

  for (let row = 0; row < rows; row++) {
    for (let s = 0; s < (row === 0 ? 0 : sub); s++) {
      const t = (row - 1) * logDt + (s + 1) * dt;
      while (phaseIdx < phases.length - 1 && t >= phases[phaseIdx]!.t1) phaseIdx++;
      const ph = phases[phaseIdx]!;
      if (phaseIdx !== lastPhaseIdx) {
        phaseStartAlt = alt;
        lastPhaseIdx = phaseIdx;
      }
      const x = (t - ph.t0) / (ph.t1 - ph.t0);

      // --- Pilot --------------------------------------------------------------------------
      let hT = CRUISE_ALT_M;
      let vT = 0;
      let throttleOverride = -1;
      let thumbs = 1;
      let spR = 0;
      let spP = 0;
      let spY = 0;
      const span = ph.t1 - ph.t0;
      switch (ph.kind) {
        case 'idle':
          throttleOverride = 0;
          thumbs = 0;
          break;
        case 'take-off':
          hT = CRUISE_ALT_M * smoothstep(x);
          vT = (CRUISE_ALT_M * 6 * x * (1 - x)) / span;
          thumbs = smoothstep(x);
          break;
        case 'roll':
          spR = 45 * Math.sin(2 * Math.PI * x);
          break;
        case 'pitch':
          spP = 45 * Math.sin(2 * Math.PI * x);
          break;
        case 'yaw':
          spY = 90 * Math.sin(Math.PI * x) ** 2;
          break;
        case 'punch-out':
          throttleOverride = punchThrottle;
          break;
        case 'recover':
          hT = phaseStartAlt + (CRUISE_ALT_M - phaseStartAlt) * smoothstep(x);
          vT = ((CRUISE_ALT_M - phaseStartAlt) * 6 * x * (1 - x)) / span;
          break;
        case 'landing':
          hT = phaseStartAlt + (-0.5 - phaseStartAlt) * smoothstep(x);
          vT = ((-0.5 - phaseStartAlt) * 6 * x * (1 - x)) / span;
          thumbs = 1 - smoothstep(x);
          break;
        case 'hover':
          break;
      }
      // Sticks reach the controller once per radio frame. The pilot levels the aircraft by feel
      // (deg/s per deg) and wiggles a little.
      if (t >= nextRadioT) {
        nextRadioT += RADIO_FRAME_S;
        stickR = spR + thumbs * (wobbleAt(0, t) - 3 * roll * DEG);
        stickP = spP + thumbs * (wobbleAt(1, t) - 3 * pitch * DEG);
        stickY = spY + thumbs * wobbleAt(2, t);
      }
      if (throttleOverride >= 0) {
        throttle = throttleOverride;
        altI = 0;
      } else {
        const e = hT - alt;
        altI = Math.max(-3, Math.min(3, altI + 0.8 * e * dt));
        let aCmd = 4 * e + 4 * (vT - climb) + altI;
        aCmd = Math.max(-0.85 * G0, Math.min(G0, aCmd));
        const tilt = Math.max(0.5, Math.cos(roll) * Math.cos(pitch));
        throttle = Math.min(1, pilotHover * Math.sqrt(Math.max(0, (G0 + aCmd) / G0 / tilt)));
        if (ph.kind === 'landing' && !airborne && x > 0.5) throttle = 0;
      }

      // --- Rate controller (sees the setpoint after the link latency) ----------------------
      ringR[ringPos] = stickR;
      ringP[ringPos] = stickP;
      ringY[ringPos] = stickY;
      const back = (ringPos + 1) % ringLen;
      const cR = ringR[back]! * RAD;
      const cP = ringP[back]! * RAD;
      const cY = ringY[back]! * RAD;
      ringPos = back;
      const gyroNoise = 0.2 * RAD;
      const eR = cR - (p + gyroNoise * loopRng.normal());
      const eP = cP - (q + gyroNoise * loopRng.normal());
      const eY = cY - (r + gyroNoise * loopRng.normal());
      let oR = 0;
      let oP = 0;
      let oY = 0;
      if (throttle < 0.05 && !airborne) {
        iR = 0;
        iP = 0;
        iY = 0;
      } else {
        if (!saturated) {
          iR += kiR * eR * dt;
          iP += kiP * eP * dt;
          iY += kiY * eY * dt;
        }
        // The integrators hold trim as a share of the collective. A steady offset (CG, a weak
        // motor) needs a moment in proportion to thrust (∝ output²) while each unit of
        // differential output buys moment in proportion to output, so the output that holds
        // it grows with throttle; a fixed additive trim would be wrong after every throttle step
        // (a punch-out, the drop that follows) until the integrator caught up again.
        const trim = Math.max(0.25, throttle / pilotHover);
        oR = kpR * eR + iR * trim;
        oP = kpP * eP + iP * trim;
        oY = kpY * eY + iY * trim;
      }

      // --- Mixer with desaturation (attitude before collective) ----------------------------
      let lo = Infinity;
      let hi = -Infinity;
      const c0 = ctl[0]!;
      const c1 = ctl[1]!;
      const c2 = ctl[2]!;
      for (let i = 0; i < n; i++) {
        const v = oR * c0[i]! + oP * c1[i]! + oY * c2[i]!;
        u[i] = v;
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
      const room = 1 - idle;
      let scale = 1;
      if (hi - lo > room) scale = room / (hi - lo);
      saturated = scale < 1;
      let uLo = Infinity;
      let uHi = -Infinity;
      for (let i = 0; i < n; i++) {
        const v = throttle * collective[i]! + scale * u[i]!;
        u[i] = v;
        if (v < uLo) uLo = v;
        if (v > uHi) uHi = v;
      }
      let shift = 0;
      if (uHi > 1) shift = 1 - uHi;
      else if (uLo < idle) shift = idle - uLo;
      if (uHi > 1 + 1e-9 || (throttle > 0.05 && uLo < idle - 1e-9 && uHi + shift > 1))
        saturated = true;
      let uMax = 0;
      for (let i = 0; i < n; i++) {
        let v = u[i]! + shift;
        v = v < idle ? idle : v > 1 ? 1 : v;
        u[i] = v;
        if (v > uMax) uMax = v;
      }
      if (uMax >= 0.98) saturationS += dt;

      // --- Motors, forces and moments about the true CG -----------------------------------
      const vRatio = vbat / vFull;
      let tz = 0;
      let mL = 0;
      let mM = 0;
      let mN = 0;
      let powerW = 0;
      let escOver = false;
      for (let i = 0; i < n; i++) {
        const target = u[i]! * rpmMax[i]! * vRatio;
        const w = rpm[i]! + (target - rpm[i]!) * motorAlpha;
        rpm[i] = w;
        const w2 = w * w;
        const ti = kT[i]! * w2;
        const qi = kQ[i]! * w2;
        thrust[i] = ti;
        const tv = ti * cosTilt[i]!;
        tz += tv;
        mL -= armY[i]! * tv;
        mM += armX[i]! * tv;
        mN += spinSign[i]! * qi + armR[i]! * ti * sinTilt[i]!;
        const omega = w * RPM_TO_RAD_S;
        const pe = (qi * omega) / build.driveEfficiency;
        powerW += pe;
        const ia = pe / vbat;
        motorA[i] = ia;
        if (ia > peakMotorA[i]!) peakMotorA[i] = ia;
        if (fx.escMaxA !== null && ia > fx.escMaxA) escOver = true;
        rotorPhase[i] = (rotorPhase[i]! + omega * dt) % (2 * Math.PI);
      }
      if (escOver) escOverS += dt;

      // --- Battery ------------------------------------------------------------------------
      const charge = build.startCharge - chargeMah / capacityMah;
      const ocv = cellOpenCircuitV(charge) * cells;
      vbat = terminalVoltage(ocv, packR, powerW, AVIONICS_A);
      ibat = powerW / vbat + AVIONICS_A;
      chargeMah += (ibat * dt * 1000) / 3600;

      // --- Rigid body ---------------------------------------------------------------------
      const lift = tz * Math.cos(roll) * Math.cos(pitch);
      if (!airborne && lift > weight * 1.0001) airborne = true;
      if (airborne) {
        const pd = (mL + (jyy - jzz) * q * r) / jxx;
        const qd = (mM + (jzz - jxx) * p * r) / jyy;
        const rd = (mN + (jxx - jyy) * p * q) / jzz;
        p += pd * dt;
        q += qd * dt;
        r += rd * dt;
        const sr = Math.sin(roll);
        const cr = Math.cos(roll);
        roll += (p + Math.tan(pitch) * (q * sr + r * cr)) * dt;
        pitch += (q * cr - r * sr) * dt;
        const az = lift / massKg - G0 - dragZ * climb * Math.abs(climb);
        climb += az * dt;
        alt += climb * dt;
        if (alt <= 0 && climb <= 0) {
          // Touch-down: the ground takes the weight and levels the frame.
          alt = 0;
          climb = 0;
          airborne = false;
          p = q = r = 0;
          roll = pitch = 0;
        }
      }
    }

    // --- Sensors at the log rate ------------------------------------------------------------
    const t = row * logDt;
    time[row] = t;
    let ax = 0;
    let ay = 0;
    let azVib = 0;
    let gx = 0;
    let gy = 0;
    let gz = 0;
    const h = build.rotorHeightMm / 1000;
    let meanU = 0;
    for (let i = 0; i < n; i++) {
      const w = rpm[i]!;
      const omega = w * RPM_TO_RAD_S;
      const f1 = w / 60;
      const psi = rotorPhase[i]!;
      // Rotor 1×: rotating in-plane force U·Ω² (ISO 21940 unbalance, U in g·mm → kg·m).
      const g1 = antiAlias(f1, rateHz);
      if (g1 > 0 && omega > 1) {
        const force = fx.unbalanceGmm[i]! * 1e-6 * omega * omega * build.mountGain * g1;
        const fxs = force * Math.cos(psi);
        const fys = force * Math.sin(psi);
        ax += fxs / massKg;
        ay += fys / massKg;
        // Moment of the in-plane force at the rotor (above the CG), as a rate at Ω.
        gx += (h * fys) / jxx / omega;
        gy -= (h * fxs) / jyy / omega;
        gz += (0.25 * (armX[i]! * fys - armY[i]! * fxs)) / jzz / omega;
      }
      // Blade-pass: thrust ripple at blades × Ω.
      const fb = blades * f1;
      const gb = antiAlias(fb, rateHz);
      if (gb > 0 && omega > 1) {
        const ripple = 0.04 * thrust[i]! * build.mountGain * gb * Math.cos(blades * psi);
        azVib -= ripple / massKg;
        gx -= (armY[i]! * ripple) / jxx / (blades * omega);
        gy += (armX[i]! * ripple) / jyy / (blades * omega);
      }
      meanU += u[i]! / n;
      motorCols[i]![row] = u[i]!;
      const rpmNoise = 8 * sensorRng.normal();
      rpmCols[i]![row] = w + rpmNoise > 0 ? w + rpmNoise : 0;
      if (imotorCols) imotorCols[i]![row] = motorA[i]! + 0.05 * sensorRng.normal();
    }
    // Frame resonance, excited in proportion to rotor thrust.
    let resX = 0;
    let resY = 0;
    if (res) {
      const x0 = resonanceRng.normal();
      const y0 = resonanceRng.normal();
      const rx = resA1 * rx1 + resA2 * rx2 + x0 * resNorm;
      const ry = resA1 * ry1 + resA2 * ry2 + y0 * resNorm;
      rx2 = rx1;
      rx1 = rx;
      ry2 = ry1;
      ry1 = ry;
      const excite = (res.rmsDegS * (meanU * meanU)) / (pilotHover * pilotHover);
      resX = rx * excite;
      resY = ry * excite;
    }
    const gn = build.gyroNoiseDegS;
    const an = build.accNoiseG;
    gyroX[row] = p * DEG + gx * DEG + resX + gn * sensorRng.normal();
    gyroY[row] = q * DEG + gy * DEG + resY + gn * sensorRng.normal();
    gyroZ[row] = r * DEG + gz * DEG + gn * sensorRng.normal();
    let tzNow = 0;
    for (let i = 0; i < n; i++) tzNow += thrust[i]! * cosTilt[i]!;
    const fz = airborne ? -tzNow / massKg : -G0;
    accX[row] = ax / G0 + an * sensorRng.normal();
    accY[row] = ay / G0 + an * sensorRng.normal();
    accZ[row] = (fz + azVib) / G0 + an * sensorRng.normal();
    spRoll[row] = stickR;
    spPitch[row] = stickP;
    spYaw[row] = stickY;
    throttleCol[row] = throttle;
    vbatCol[row] = vbat + 0.01 * sensorRng.normal();
    ibatCol[row] = ibat + 0.1 * sensorRng.normal();
  }

  // --- Assemble ---------------------------------------------------------------------------
  const channels: string[] = ['time'];
  const columns: ParsedLog['columns'] = { time };
  for (let i = 0; i < n; i++) {
    channels.push(`motor${i + 1}`);
    columns[`motor${i + 1}`] = motorCols[i]!;
  }
  for (let i = 0; i < n; i++) {
    channels.push(`rpm${i + 1}`);
    columns[`rpm${i + 1}`] = rpmCols[i]!;
  }
  const rest: [string, Float32Array][] = [
    ['gyro_x', gyroX],
    ['gyro_y', gyroY],
    ['gyro_z', gyroZ],
    ['acc_x', accX],
    ['acc_y', accY],
    ['acc_z', accZ],
    ['sp_roll', spRoll],
    ['sp_pitch', spPitch],
    ['sp_yaw', spYaw],
    ['throttle', throttleCol],
    ['vbat', vbatCol],
    ['ibat', ibatCol],
  ];
  for (const [name, col] of rest) {
    channels.push(name);
    columns[name] = col;
  }
  if (imotorCols) {
    for (let i = 0; i < n; i++) {
      channels.push(`imotor${i + 1}`);
      columns[`imotor${i + 1}`] = imotorCols[i]!;
    }
  }

  const flownAirframe: Airframe = {
    ...airframe,
    ...(fx.escMaxA !== null ? { escMaxA: fx.escMaxA } : {}),
  };
  const warnings: LogWarning[] = [];
  const log: ParsedLog = {
    channels,
    columns,
    rows,
    sampleRateHz: rateHz,
    durationS: (rows - 1) / rateHz,
    metadata: {
      source: 'hoverprint synth',
      scenario: scenario.name,
      seed: String(seed),
      airframe: airframe.name,
      motors: String(n),
      cells: String(cells),
      blades: String(blades),
    },
    warnings,
  };
  const truth: GroundTruth = {
    scenario: scenario.name,
    seed,
    seconds,
    rateHz,
    airframe: flownAirframe,
    faults: scenario.faults.map((f) => ({ ...f })),
    trueCg,
    phases: phases.map((ph: Phase) => ({ ...ph })),
    params: {
      massKg,
      g0: G0,
      inertiaKgM2: [jxx, jyy, jzz],
      kT: Array.from(kT),
      kQ: Array.from(kQ),
      rpmMax: Array.from(rpmMax),
      thrustEfficiency: [...fx.efficiency],
      motorTauS: build.motorTauS,
      unbalanceGmm: [...fx.unbalanceGmm],
      blades,
      frameResonanceHz: fx.resonance?.hz ?? null,
      frameResonanceQ: fx.resonance?.q ?? null,
      cells,
      batteryMah: capacityMah,
      batteryResistanceOhm: packR,
      escMaxA: fx.escMaxA,
      delayMs: fx.delayMs,
      idle,
      expectedHoverThrustN: expectedHover,
      trueHoverThrustN: trueHover,
      peakMotorCurrentA: Array.from(peakMotorA),
      escOverS,
      saturationS,
      mAhUsed: chargeMah,
    },
  };
  return { log, truth };
}
