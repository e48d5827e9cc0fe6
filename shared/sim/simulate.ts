import { G0 } from '../airframe/allocation';
import type { ParsedLog } from '../log/types';
import type { Airframe } from '../schemas/airframe';
import { cellOpenCircuitV, terminalVoltage } from './battery';
import { defaultBuild } from './build';
import { designController, type AxisGains } from './controller-design';
import { addRotorVibration, FrameMode, pilotWobble, type SensorVibration } from './disturbances';
import { applyFaults } from './faults';
import { Mixer } from './mixer';
import { allocateColumns, assembleLog } from './log-columns';
import { pilotCommand, type PilotCommand } from './pilot';
import { buildPhases } from './pilot-script';
import { buildPlant } from './plant';
import { RateAxis } from './rate-loop';
import { streamFor } from './prng';
import type { BuildParams, GroundTruth, Phase, Scenario, SimOptions } from './types';

export { reactionYawSign } from './plant';

const DEG = 180 / Math.PI;
const RAD = Math.PI / 180;
const RPM_TO_RAD_S = (2 * Math.PI) / 60;
/** Longest integration step, s; the step is also never longer than the log step. */
const MAX_STEP_S = 0.001;
/** Radio link frame period, s (250 Hz, a common rate for a low-latency link). */
const RADIO_FRAME_S = 0.004;
/** Constant draw of flight controller, receiver and video, A. */
const AVIONICS_A = 0.6;

/**
 * Fly a scenario and log it: rigid-body roll/pitch/yaw with diagonal inertia and vertical
 * translation, motors with first-order lag, T = kT·rpm², Q = kQ·rpm², a rate PID mixing through
 * the airframe's geometry, a scripted pilot, battery sag and sensor vibration. Columns are in
 * canonical units (s, frac, rpm, deg/s, g, V, A). Deterministic for a given seed.
 *
 * The parts live beside this file: the faults (`faults.ts`), the physical aircraft
 * (`plant.ts`), the controller and the pilot's trim (`controller-design.ts`), the mixer
 * (`mixer.ts`), the pilot's
 * commands (`pilot.ts`), vibration and the thumbs' wobble (`disturbances.ts`) and the columns
 * (`log-columns.ts`); this file steps them together.
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
  const n = airframe.motors.length;
  const build: BuildParams = { ...defaultBuild(airframe), ...scenario.build };
  const fx = applyFaults(airframe, build, scenario.faults);
  const plant = buildPlant(airframe, build, fx);
  const { massKg, weight, cells, vFull, kT, kQ, rpmMax, spinSign, armX, armY, armR } = plant;
  const { cosTilt, sinTilt, jxx, jyy, jzz, dragZ, capacityMah, packR } = plant;
  const ctlDesign = designController(airframe, build, plant);
  const { collective, ctl, pilotHover, punchThrottle } = ctlDesign;
  const gs = fx.loopGainScale;
  const loop = (g: AxisGains) => new RateAxis(g.kp * gs, g.ki * gs, g.ff * gs, build.motorTauS);
  const rollLoop = loop(ctlDesign.roll);
  const pitchLoop = loop(ctlDesign.pitch);
  const yawLoop = loop(ctlDesign.yaw);

  // --- Steps and output ---------------------------------------------------------------------
  const rows = Math.round(seconds * rateHz) + 1;
  const logDt = 1 / rateHz;
  const sub = Math.max(1, Math.ceil(logDt / MAX_STEP_S - 1e-9));
  const dt = logDt / sub;
  const motorAlpha = 1 - Math.exp(-dt / build.motorTauS);
  const idle = build.idle;
  const cols = allocateColumns(n, rows, scenario.logMotorCurrent === true);
  const mixer = new Mixer(ctl, collective, idle);

  const sensorRng = streamFor(seed, 1);
  const loopRng = streamFor(seed, 2);
  const wobbleAt = pilotWobble(streamFor(seed, 3));
  const phaseRng = streamFor(seed, 5);

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

  // A frame mode too close to Nyquist would not survive the sensors' anti-alias filter.
  const res = fx.resonance && fx.resonance.hz < 0.45 * rateHz ? fx.resonance : null;
  const frameMode = res ? new FrameMode(res.hz, res.q, rateHz, streamFor(seed, 4)) : null;

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
  let altI = 0;
  let chargeMah = 0;
  let vbat = cellOpenCircuitV(build.startCharge) * cells;
  let ibat = AVIONICS_A;
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
  const cmd: PilotCommand = {
    hT: 0,
    vT: 0,
    throttleOverride: -1,
    thumbs: 1,
    spR: 0,
    spP: 0,
    spY: 0,
  };
  const vib: SensorVibration = { ax: 0, ay: 0, az: 0, gx: 0, gy: 0, gz: 0 };

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
      pilotCommand(cmd, ph, x, phaseStartAlt, punchThrottle);
      const thumbs = cmd.thumbs;
      // Sticks reach the controller once per radio frame. The pilot levels the aircraft by feel
      // (deg/s per deg) and wiggles a little.
      if (t >= nextRadioT) {
        nextRadioT += RADIO_FRAME_S;
        stickR = cmd.spR + thumbs * (wobbleAt(0, t) - 3 * roll * DEG);
        stickP = cmd.spP + thumbs * (wobbleAt(1, t) - 3 * pitch * DEG);
        stickY = cmd.spY + thumbs * wobbleAt(2, t);
      }
      if (cmd.throttleOverride >= 0) {
        throttle = cmd.throttleOverride;
        altI = 0;
      } else {
        const e = cmd.hT - alt;
        altI = Math.max(-3, Math.min(3, altI + 0.8 * e * dt));
        let aCmd = 4 * e + 4 * (cmd.vT - climb) + altI;
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
      const gyroP = p + gyroNoise * loopRng.normal();
      const gyroQ = q + gyroNoise * loopRng.normal();
      const gyroR = r + gyroNoise * loopRng.normal();
      const grounded = throttle < 0.05 && !airborne;
      // The integrators hold trim as a share of the collective. A steady offset (CG, a weak
      // motor) needs a moment in proportion to thrust (∝ output²) while each unit of
      // differential output buys moment in proportion to output, so the output that holds
      // it grows with throttle; a fixed additive trim would be wrong after every throttle step
      // (a punch-out, the drop that follows) until the integrator caught up again.
      const trim = Math.max(0.25, throttle / pilotHover);
      const hold = mixer.saturated;
      const oR = rollLoop.step(cR, gyroP, dt, trim, hold, grounded);
      const oP = pitchLoop.step(cP, gyroQ, dt, trim, hold, grounded);
      const oY = yawLoop.step(cY, gyroR, dt, trim, hold, grounded);

      // --- Mixer with desaturation (attitude before collective) ----------------------------
      mixer.mix(u, throttle, oR, oP, oY);
      if (mixer.uMax >= 0.98) saturationS += dt;

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
    cols.time[row] = row * logDt;
    vib.ax = vib.ay = vib.az = vib.gx = vib.gy = vib.gz = 0;
    const h = build.rotorHeightMm / 1000;
    let meanU = 0;
    for (let i = 0; i < n; i++) {
      const w = rpm[i]!;
      addRotorVibration(
        vib,
        plant,
        i,
        w,
        rotorPhase[i]!,
        thrust[i]!,
        fx.unbalanceGmm[i]!,
        build.mountGain,
        h,
        rateHz,
      );
      meanU += u[i]! / n;
      cols.motor[i]![row] = u[i]!;
      const rpmNoise = 8 * sensorRng.normal();
      cols.rpm[i]![row] = w + rpmNoise > 0 ? w + rpmNoise : 0;
      if (cols.imotor) cols.imotor[i]![row] = motorA[i]! + 0.05 * sensorRng.normal();
    }
    // Frame resonance, excited in proportion to rotor thrust.
    let resX = 0;
    let resY = 0;
    if (res && frameMode) {
      frameMode.next();
      const excite = (res.rmsDegS * (meanU * meanU)) / (pilotHover * pilotHover);
      if (res.axis !== 'pitch') resX = frameMode.x * excite;
      if (res.axis !== 'roll') resY = frameMode.y * excite;
    }
    const gn = build.gyroNoiseDegS;
    const an = build.accNoiseG;
    cols.gyroX[row] = p * DEG + vib.gx * DEG + resX + gn * sensorRng.normal();
    cols.gyroY[row] = q * DEG + vib.gy * DEG + resY + gn * sensorRng.normal();
    cols.gyroZ[row] = r * DEG + vib.gz * DEG + gn * sensorRng.normal();
    let tzNow = 0;
    for (let i = 0; i < n; i++) tzNow += thrust[i]! * cosTilt[i]!;
    const fz = airborne ? -tzNow / massKg : -G0;
    cols.accX[row] = vib.ax / G0 + an * sensorRng.normal();
    cols.accY[row] = vib.ay / G0 + an * sensorRng.normal();
    cols.accZ[row] = (fz + vib.az) / G0 + an * sensorRng.normal();
    cols.spRoll[row] = stickR;
    cols.spPitch[row] = stickP;
    cols.spYaw[row] = stickY;
    cols.throttle[row] = throttle;
    cols.vbat[row] = vbat + 0.01 * sensorRng.normal();
    cols.ibat[row] = ibat + 0.1 * sensorRng.normal();
  }

  const log = assembleLog(cols, rateHz, {
    source: 'hoverprint synth',
    scenario: scenario.name,
    seed: String(seed),
    airframe: airframe.name,
    motors: String(n),
    cells: String(cells),
    blades: String(plant.blades),
  });
  const flownAirframe: Airframe = {
    ...airframe,
    ...(fx.escMaxA !== null ? { escMaxA: fx.escMaxA } : {}),
  };
  const truth: GroundTruth = {
    scenario: scenario.name,
    seed,
    seconds,
    rateHz,
    airframe: flownAirframe,
    faults: scenario.faults.map((f) => ({ ...f })),
    trueCg: plant.trueCg,
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
      blades: plant.blades,
      frameResonanceHz: fx.resonance?.hz ?? null,
      frameResonanceQ: fx.resonance?.q ?? null,
      cells,
      batteryMah: capacityMah,
      batteryResistanceOhm: packR,
      escMaxA: fx.escMaxA,
      delayMs: fx.delayMs,
      loopGainScale: fx.loopGainScale,
      idle,
      expectedHoverThrustN: ctlDesign.expectedHover,
      trueHoverThrustN: ctlDesign.trueHover,
      peakMotorCurrentA: Array.from(peakMotorA),
      escOverS,
      saturationS,
      mAhUsed: chargeMah,
    },
  };
  return { log, truth };
}
