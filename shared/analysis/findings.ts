import type { Airframe } from '../schemas/airframe';
import type { LogWarning } from '../log/types';
import { mostSevereFirst, type Finding, type Severity } from '../schemas/report';
import type { BalanceResult } from './balance';
import type { Diagnosis } from './diagnosis';
import type { HeadroomResult } from './headroom';
import type { PowerResult } from './power';
import type { Thresholds } from '../schemas/thresholds';
import type { TrackingResult } from './tracking';
import type { VibrationResult } from './vibration';

export interface FindingInput {
  airframe: Airframe;
  airframeAssumed: boolean;
  hoverS: number;
  armedS: number;
  /** Mean motor output in hover, 0–1 (null without hover). */
  hoverOutput: number | null;
  /** Mid-time of the longest hover, s. */
  hoverAtS: number | null;
  balance: BalanceResult | null;
  diagnosis: Diagnosis;
  vibration: VibrationResult;
  power: PowerResult | null;
  headroom: HeadroomResult;
  tracking: TrackingResult | null;
  warnings: LogWarning[];
  th: Thresholds;
}

const pct = (v: number) => `${Math.round(Math.abs(v))} %`;
const mm = (v: number) => `${Math.round(Math.abs(v))} mm`;
const list = (ms: number[]) =>
  ms.length <= 1 ? String(ms[0] ?? '') : `${ms.slice(0, -1).join(', ')} and ${ms[ms.length - 1]}`;

function level(value: number, watch: number, act: number): Severity | null {
  if (value >= act) return 'act';
  if (value >= watch) return 'watch';
  return null;
}

function armRadius(airframe: Airframe): number {
  const cg = airframe.cg ?? { x: 0, y: 0 };
  const r = airframe.motors.map((m) => Math.hypot(m.x - cg.x, m.y - cg.y));
  return r.reduce((a, b) => a + b, 0) / Math.max(1, r.length);
}

/** Ranked findings (act first, then watch, then note), each saying what to check on the bench. */
export function buildFindings(f: FindingInput): Finding[] {
  const out: Finding[] = [];
  const { th, balance, diagnosis } = f;
  const judged = balance && f.hoverS >= th.minHoverForVerdictS;
  const tS = f.hoverAtS ?? undefined;

  if (judged) {
    const dev = balance.deviationPct;
    const pattern = diagnosis.confidence >= 0.5 ? diagnosis.pattern : 'healthy';
    // Motor findings, unless a side or spin-set pattern explains the spread better.
    if (pattern !== 'cg-offset' && pattern !== 'spin-set') {
      dev.forEach((d, i) => {
        const sev = level(d, th.motorWatchPct, th.motorActPct);
        if (!sev) return;
        if (pattern === 'weak-motor' && diagnosis.motor !== i + 1) return;
        const spin = f.airframe.motors[i]?.spin === 'cw' ? 'clockwise' : 'counter-clockwise';
        out.push({
          code: 'motor-working-hard',
          severity: sev,
          motor: i + 1,
          ...(tS !== undefined ? { tS } : {}),
          message:
            `Motor ${i + 1} works ${pct(d)} harder than the frame predicts in hover. ` +
            `With props OFF, spin it by hand and feel for rough bearings or a rubbing bell, check ` +
            `its screws and wires; then swap its prop for a new ${spin} one and compare the next flight.`,
        });
      });
    }
    const radius = armRadius(f.airframe);
    const design = f.airframe.cg ?? { x: 0, y: 0 };
    const dx = balance.cg.xMm - design.x;
    const dy = balance.cg.yMm - design.y;
    const off = Math.hypot(dx, dy);
    const cgSev = level((off / radius) * 100, th.cgWatchPctOfArm, th.cgActPctOfArm);
    if (cgSev && pattern !== 'weak-motor' && pattern !== 'spin-set') {
      const parts: string[] = [];
      if (Math.abs(dx) >= 1) parts.push(`${mm(dx)} ${dx > 0 ? 'forward' : 'aft'}`);
      if (Math.abs(dy) >= 1) parts.push(`${mm(dy)} to the ${dy > 0 ? 'right' : 'left'}`);
      out.push({
        code: 'cg-offset',
        severity: cgSev,
        ...(tS !== undefined ? { tS } : {}),
        message:
          `The centre of gravity sits ${parts.join(' and ')} of where the frame expects it, so ` +
          `motors on that side carry more in hover. Balance the aircraft on two fingertips under ` +
          `the arms with the battery in its flying position; move the battery or camera until it sits level.`,
      });
    }
    const asym = balance.asymmetryPct - balance.expectedAsymmetryPct;
    const tsSev = level(Math.abs(asym), th.torqueSplitWatchPct, th.torqueSplitActPct);
    if (tsSev && pattern !== 'weak-motor' && pattern !== 'cg-offset') {
      const heavy = asym > 0 ? 'cw' : 'ccw';
      const set = f.airframe.motors.flatMap((m, i) => (m.spin === heavy ? [i + 1] : []));
      out.push({
        code: 'torque-split',
        severity: tsSev,
        ...(tS !== undefined ? { tS } : {}),
        message:
          `The ${heavy === 'cw' ? 'clockwise' : 'counter-clockwise'} props (motors ${list(set)}) carry ` +
          `${pct(asym)} more of the hover effort than the frame predicts, to hold the heading. ` +
          `Check that all props are the same make, size and pitch, that none is mounted upside down, ` +
          `and that every motor sits flat (a twisted arm or tilted motor pushes sideways).`,
      });
    }
  }

  // Vibration: the strongest peak per (label, motor) across channels.
  const seen = new Map<string, Finding & { amp: number }>();
  for (const [channel, v] of Object.entries(f.vibration.channels)) {
    const gyro = channel.startsWith('gyro');
    const unit = gyro ? 'deg/s' : 'g';
    for (const p of v.peaks) {
      const amp = p.amplitude;
      const sev = gyro
        ? level(amp, th.gyroToneWatchDegS, th.gyroToneActDegS)
        : level(amp, th.accToneWatchG, th.accToneActG);
      if (!sev) continue;
      const key = `${p.label ?? 'none'}:${p.motor ?? 0}:${Math.round(p.hz / (3 * f.vibration.df))}`;
      const prev = seen.get(key);
      const where = `${Math.round(p.hz)} Hz on ${channel} (about ${amp.toFixed(gyro ? 1 : 2)} ${unit})`;
      let finding: Finding;
      if (p.label === 'frame') {
        finding = {
          code: 'frame-resonance',
          severity: sev,
          axis: channel,
          message:
            `A vibration at ${where} stays put while the motors change speed: something in the frame ` +
            `rings. With the battery out, tap arms, standoffs, camera and antenna mounts and listen for ` +
            `a buzz; tighten the stack and frame screws, and check for a cracked arm.`,
        };
      } else if (p.label) {
        const order =
          p.label === 'rotor-1x'
            ? 'once per turn'
            : p.label === 'rotor-2x'
              ? 'twice per turn'
              : 'at blade pass';
        const cands =
          'candidates' in p && Array.isArray(p.candidates) ? (p.candidates as number[]) : [];
        const who = p.motor
          ? `motor ${p.motor}`
          : cands.length
            ? `motor ${cands.slice(0, -1).join(', ')} or ${cands[cands.length - 1]}`
            : 'a rotor';
        finding = {
          code: 'rotor-harmonic',
          severity: sev,
          axis: channel,
          ...(p.motor ? { motor: p.motor } : {}),
          message:
            `Vibration at ${where} follows ${who} ${order}. ` +
            (p.label === 'rotor-1x'
              ? `That is usually an unbalanced or chipped prop or a bent shaft: with the battery out, ` +
                `swap ${p.motor ? `motor ${p.motor}'s prop for a new one` : cands.length ? `the props on motors ${list(cands)} for new ones` : 'each prop for a new one'}, check the shaft ` +
                `runs true and the bell is not scraped.`
              : p.label === 'rotor-2x'
                ? `That often means a loose motor mount or a prop not seated flat: with the battery out, ` +
                  `tighten the motor screws and reseat the props.`
                : `Blade-pass tones grow with nicked or mismatched blades: inspect every blade tip ` +
                  `and replace damaged props as a set.`),
        };
      } else if (p.aliasOfHz !== undefined) {
        finding = {
          code: 'vibration-peak',
          severity: sev,
          axis: channel,
          message:
            `A vibration at ${where} matches the motors' electrical frequency (about ${Math.round(p.aliasOfHz)} Hz) ` +
            `folded down by the log rate, so it may be electrical noise rather than shaking; logging at a ` +
            `higher rate tells the two apart. With the battery out, route motor wires away from the ` +
            `flight controller, check the capacitor on the power leads, ` +
            `and check the gyro's own filtering on the filter bench.`,
        };
      } else {
        finding = {
          code: 'vibration-peak',
          severity: sev,
          axis: channel,
          message:
            `A strong vibration at ${where} that does not match the rotor speed or a fixed frame ` +
            `mode. With the battery out, check the flight controller's soft mounts and that no ` +
            `wire or strap touches the stack, then look at the filter bench for a notch.`,
        };
      }
      if (!prev || amp > prev.amp) seen.set(key, { ...finding, amp });
    }
  }
  for (const { amp: _amp, ...finding } of seen.values()) out.push(finding);

  // Headroom.
  const h = f.headroom;
  if (f.armedS > 0 && h.saturationS > 0) {
    const share = (h.saturationS / f.armedS) * 100;
    const sev = level(share, th.saturationWatchPct, th.saturationActPct) ?? 'note';
    const counts = new Map<number, number>();
    for (const e of h.saturationEvents)
      counts.set(e.motor, (counts.get(e.motor) ?? 0) + (e.t1 - e.t0));
    const top = [...counts.entries()].sort((a, b) => b[1] - a[1])[0];
    out.push({
      code: 'motor-saturation',
      severity: sev,
      ...(top ? { motor: top[0] } : {}),
      ...(h.saturationEvents[0] ? { tS: h.saturationEvents[0].t0 } : {}),
      message:
        `Motors hit their limit for ${h.saturationS.toFixed(1)} s (${share.toFixed(1)} % of the flight)` +
        (top ? `, motor ${top[0]} most` : '') +
        `. While saturated the aircraft cannot correct. If it happens in ordinary flying, the build ` +
        `lacks thrust: check motor kV against the cell count, prop size, and all-up weight.`,
    });
  }
  if (f.hoverOutput !== null && f.hoverS >= th.minHoverForVerdictS) {
    const sev = level(f.hoverOutput, th.hoverOutputWatch, th.hoverOutputAct);
    if (sev) {
      out.push({
        code: 'motor-saturation',
        severity: sev,
        ...(tS !== undefined ? { tS } : {}),
        message:
          `It hovers at ${Math.round(f.hoverOutput * 100)} % output, leaving little room to climb, ` +
          `brake or fight wind before the motors hit their limit. Check the all-up weight against ` +
          `the motors' thrust table, and the props and cell count the motors were chosen for.`,
      });
    }
  }
  if (h.escOverS > 0 && f.airframe.escMaxA !== undefined && !f.airframeAssumed) {
    out.push({
      code: 'esc-overcurrent',
      severity: h.escOverS >= th.escOverActS ? 'act' : 'watch',
      ...(h.escPeakMotor ? { motor: h.escPeakMotor } : {}),
      ...(h.escPeakAtS !== null ? { tS: h.escPeakAtS } : {}),
      message:
        `ESC current went over its ${f.airframe.escMaxA} A rating for ${h.escOverS.toFixed(1)} s` +
        ` (peak ${h.escPeakA?.toFixed(0)} A${h.escPeakMotor ? ` on motor ${h.escPeakMotor}` : ''}` +
        `${h.currentSource === 'shared' ? ', estimated from pack current' : ''}). Overheated ESCs ` +
        `fail in the air. After landing, feel the ESC for heat (carefully), and consider smaller ` +
        `props, a lower throttle limit or a higher-rated ESC. Follow the ESC maker's limits.`,
    });
  }

  const p = f.power;
  if (p) {
    const sev = p.minCellV <= th.cellActV ? 'act' : p.minCellV <= th.cellWatchV ? 'watch' : null;
    if (sev) {
      out.push({
        code: 'battery-sag',
        severity: sev,
        tS: p.minAtS,
        message:
          `Cells sagged to ${p.minCellV.toFixed(2)} V under load (from ${p.restCellV.toFixed(2)} V at rest` +
          (p.internalResistanceOhm !== null
            ? `; pack resistance about ${(p.internalResistanceOhm * 1000).toFixed(0)} mΩ`
            : '') +
          `). Land earlier or use a fresher pack; check each cell's resting voltage on a checker and ` +
          `retire packs that sag much more than their siblings or have puffed. Charge LiPos on a ` +
          `fireproof surface and never leave them unattended.`,
      });
    }
  }

  if (f.tracking) {
    const size = Math.max(1, f.airframe.prop.diameterIn / 5);
    for (const axis of ['roll', 'pitch', 'yaw'] as const) {
      const t = f.tracking[axis];
      if (t.lagMs === null) continue;
      const sev =
        axis === 'yaw'
          ? level(t.lagMs, th.trackingYawLagWatchMs * size, th.trackingYawLagActMs * size)
          : level(t.lagMs, th.trackingLagWatchMs * size, th.trackingLagActMs * size);
      if (!sev) continue;
      out.push({
        code: 'tracking-lag',
        severity: sev,
        axis,
        tS: t.worstAtS,
        message:
          `On ${axis} the aircraft follows the sticks about ${Math.round(t.lagMs)} ms late. Check for ` +
          `heavy gyro filtering (see the filter bench), a low loop rate, or soft gains; on the bench ` +
          `with props OFF, check the radio link latency settings.`,
      });
    }
  }

  for (const w of f.warnings) {
    if (w.code !== 'log-gap') continue;
    out.push({
      code: 'log-gap',
      severity: 'note',
      ...(w.tS !== undefined ? { tS: w.tS } : {}),
      message: `${w.message} Analysis treats the gap as missing data; check the logging rate and the SD card or flash speed.`,
    });
  }
  return out.sort(mostSevereFirst);
}
