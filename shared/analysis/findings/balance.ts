import type { Airframe } from '../../schemas/airframe';
import { severityRank, type Finding } from '../../schemas/report';
import type { Thresholds } from '../../schemas/thresholds';
import type { BalanceResult } from '../balance';
import type { Diagnosis } from '../diagnosis';
import type { ThrustLoss } from '../thrust-loss';
import { level, list, mm, pct } from './words';

export interface BalanceFindingInput {
  airframe: Airframe;
  balance: BalanceResult;
  diagnosis: Diagnosis;
  /** The lone-motor thrust loss that explains the hover moments, when one does. */
  thrustLoss: ThrustLoss | null;
  tS: number | undefined;
  th: Thresholds;
}

function armRadius(airframe: Airframe): number {
  const cg = airframe.cg ?? { x: 0, y: 0 };
  const r = airframe.motors.map((m) => Math.hypot(m.x - cg.x, m.y - cg.y));
  return r.reduce((a, b) => a + b, 0) / Math.max(1, r.length);
}

/** "It makes about 15 % less thrust for its output than its neighbours (…)". */
export function lossWords(loss: ThrustLoss): string {
  return (
    `It makes about ${pct(loss.lossPct)} less thrust for its output than its neighbours ` +
    `(least squares over the hover moment equations, CG held at the design point).`
  );
}

function motorFinding(
  f: BalanceFindingInput,
  motor: number,
  severity: Finding['severity'],
): Finding {
  const d = f.balance.deviationPct[motor - 1] ?? 0;
  const spin = f.airframe.motors[motor - 1]?.spin === 'cw' ? 'clockwise' : 'counter-clockwise';
  const loss = f.thrustLoss?.motor === motor ? f.thrustLoss : null;
  const work =
    d >= 0.5
      ? `Motor ${motor} works ${pct(d)} harder than the frame predicts in hover.`
      : `Motor ${motor} needs more output than its neighbours for the same job, though the ` +
        `others share the correction (its own output is ${pct(d)} ${d < 0 ? 'under' : 'over'} what the frame predicts).`;
  return {
    code: 'motor-working-hard',
    severity,
    motor,
    ...(f.tS !== undefined ? { tS: f.tS } : {}),
    message:
      `${work} ${loss ? lossWords(loss) + ' ' : ''}` +
      `With props OFF, spin it by hand and feel for rough bearings or a rubbing bell, check ` +
      `its screws and wires; then swap its prop for a new ${spin} one and compare the next flight.`,
  };
}

/**
 * Balance, CG and torque split findings. A side or spin-set pattern suppresses motor findings
 * it explains better, and every pattern the diagnosis states with high confidence reaches the
 * verdict, at least as a `note`.
 */
export function balanceFindings(f: BalanceFindingInput): Finding[] {
  const out: Finding[] = [];
  const { th, balance, diagnosis, tS } = f;
  const dev = balance.deviationPct;
  const pattern = diagnosis.confidence >= 0.5 ? diagnosis.pattern : 'healthy';
  const sure = diagnosis.confidence >= th.patternConfidence;
  const lossLevel =
    f.thrustLoss && level(f.thrustLoss.lossPct, th.motorLossWatchPct, th.motorLossActPct);
  if (pattern !== 'cg-offset' && pattern !== 'spin-set') {
    dev.forEach((d, i) => {
      let sev = level(d, th.motorWatchPct, th.motorActPct);
      if (pattern === 'weak-motor' && diagnosis.motor !== i + 1) return;
      if (f.thrustLoss?.motor === i + 1 && lossLevel && sev)
        sev = severityRank(lossLevel) > severityRank(sev) ? lossLevel : sev;
      if (sev) out.push(motorFinding(f, i + 1, sev));
    });
  }
  if (sure && pattern === 'weak-motor' && diagnosis.motor !== undefined) {
    const m = diagnosis.motor;
    if (!out.some((x) => x.motor === m)) {
      const sev = f.thrustLoss?.motor === m && lossLevel ? lossLevel : 'note';
      out.push(motorFinding(f, m, sev));
    }
  }

  const radius = armRadius(f.airframe);
  const design = f.airframe.cg ?? { x: 0, y: 0 };
  const dx = balance.cg.xMm - design.x;
  const dy = balance.cg.yMm - design.y;
  const off = Math.hypot(dx, dy);
  let cgSev = level((off / radius) * 100, th.cgWatchPctOfArm, th.cgActPctOfArm);
  if (pattern === 'weak-motor' || pattern === 'spin-set') cgSev = null;
  else if (!cgSev && sure && pattern === 'cg-offset') cgSev = 'note';
  if (cgSev) {
    const parts: string[] = [];
    if (Math.abs(dx) >= 1) parts.push(`${mm(dx)} ${dx > 0 ? 'forward' : 'aft'}`);
    if (Math.abs(dy) >= 1) parts.push(`${mm(dy)} to the ${dy > 0 ? 'right' : 'left'}`);
    out.push({
      code: 'cg-offset',
      severity: cgSev,
      ...(tS !== undefined ? { tS } : {}),
      message:
        `The centre of gravity sits ${parts.join(' and ') || 'slightly off'} of where the frame expects it, so ` +
        `motors on that side carry more in hover. Balance the aircraft on two fingertips under ` +
        `the arms with the battery in its flying position; move the battery or camera until it sits level.`,
    });
  }

  const asym = balance.asymmetryPct - balance.expectedAsymmetryPct;
  let tsSev = level(Math.abs(asym), th.torqueSplitWatchPct, th.torqueSplitActPct);
  if (pattern === 'weak-motor' || pattern === 'cg-offset') tsSev = null;
  else if (!tsSev && sure && pattern === 'spin-set') tsSev = 'note';
  if (tsSev) {
    const heavy = asym > 0 ? 'cw' : 'ccw';
    const set = f.airframe.motors.flatMap((m, i) => (m.spin === heavy ? [i + 1] : []));
    out.push({
      code: 'torque-split',
      severity: tsSev,
      ...(tS !== undefined ? { tS } : {}),
      message:
        `The ${heavy === 'cw' ? 'clockwise' : 'counter-clockwise'} props (motors ${list(set)}) carry ` +
        `${Math.abs(asym).toFixed(1)} % more of the hover effort than the frame predicts, to hold the heading. ` +
        `Check that all props are the same make, size and pitch, that none is mounted upside down, ` +
        `and that every motor sits flat (a twisted arm or tilted motor pushes sideways).`,
    });
  }
  return out;
}
