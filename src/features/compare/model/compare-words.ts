import type { FlightReport } from '../../../../shared/schemas/report';
import type { Airframe } from '../../../../shared/schemas/airframe';

/** Whole percent with its sign; what rounds to zero reads 0 %, never +0 % or −0 %. */
const signedPct = (v: number) => {
  const r = Math.round(v);
  return r === 0 ? '0 %' : `${r > 0 ? '+' : '−'}${Math.abs(r)} %`;
};

/** Smallest change worth a sentence, in the unit of each figure (common practice: below these, flight-to-flight noise). */
export const compareThresholds = {
  deviationPts: 2,
  asymmetryPts: 1.5,
  cgMm: 2,
  bandRmsRel: 0.15,
  sagV: 0.05,
} as const;

/**
 * A signed quantity's change in words by the sign, not the size: rose (up), fell (down), or
 * moved when it crossed zero, where up and down would both mislead.
 */
function signedChange(before: number, after: number): 'rose' | 'fell' | 'moved' {
  if (Math.sign(before) * Math.sign(after) < 0) return 'moved';
  return after > before ? 'rose' : 'fell';
}

/**
 * The differences between an earlier flight (`before`) and this one (`after`) as sentences a
 * tuner reads: "motor 3 deviation fell from +9 % to +1 %". Only changes above the thresholds.
 */
export function describeDifferences(before: FlightReport, after: FlightReport): string[] {
  const out: string[] = [];
  if (before.motorCount !== after.motorCount) {
    out.push(
      `The flights have different motor counts (${before.motorCount} and ${after.motorCount}); balance is not compared.`,
    );
  } else {
    after.balance.deviationPct.forEach((a, i) => {
      const b = before.balance.deviationPct[i];
      if (b === undefined || !Number.isFinite(a) || !Number.isFinite(b)) return;
      if (Math.abs(a - b) < compareThresholds.deviationPts) return;
      const verb = signedChange(b, a);
      out.push(`Motor ${i + 1} deviation ${verb} from ${signedPct(b)} to ${signedPct(a)}.`);
    });
  }
  const da = after.torqueSplit.asymmetryPct - before.torqueSplit.asymmetryPct;
  if (Math.abs(da) >= compareThresholds.asymmetryPts) {
    out.push(
      `Torque split asymmetry ${Math.abs(after.torqueSplit.asymmetryPct) < Math.abs(before.torqueSplit.asymmetryPct) ? 'narrowed' : 'widened'} from ${signedPct(before.torqueSplit.asymmetryPct)} to ${signedPct(after.torqueSplit.asymmetryPct)}.`,
    );
  }
  if (before.cg && after.cg) {
    const moved = Math.hypot(after.cg.xMm - before.cg.xMm, after.cg.yMm - before.cg.yMm);
    if (moved >= compareThresholds.cgMm) {
      const dx = after.cg.xMm - before.cg.xMm;
      const dy = after.cg.yMm - before.cg.yMm;
      const dir = [
        Math.abs(dx) >= 1 ? (dx > 0 ? 'forward' : 'aft') : null,
        Math.abs(dy) >= 1 ? (dy > 0 ? 'right' : 'left') : null,
      ]
        .filter(Boolean)
        .join(' and ');
      out.push(
        `The estimated CG moved ${moved.toFixed(1)} mm ${dir} (now x ${after.cg.xMm.toFixed(1)} mm, y ${after.cg.yMm.toFixed(1)} mm).`,
      );
    }
  } else if (!before.cg !== !after.cg) {
    out.push('Only one of the flights had enough hover for a CG estimate.');
  }
  for (const ch of Object.keys(after.vibration)) {
    const a = after.vibration[ch]!.bandRms;
    const b = before.vibration[ch]?.bandRms;
    if (b === undefined || !(b > 0) || !Number.isFinite(a)) continue;
    const rel = a / b - 1;
    if (Math.abs(rel) < compareThresholds.bandRmsRel) continue;
    out.push(
      `${ch} vibration above 50 Hz ${rel < 0 ? 'dropped' : 'grew'} by ${Math.abs(Math.round(rel * 100))} %.`,
    );
  }
  if (before.power && after.power) {
    const d = after.power.sagCellV - before.power.sagCellV;
    if (Math.abs(d) >= compareThresholds.sagV) {
      out.push(
        `Sag per cell ${d < 0 ? 'fell' : 'rose'} from ${before.power.sagCellV.toFixed(2)} V to ${after.power.sagCellV.toFixed(2)} V.`,
      );
    }
  }
  const sev = (r: FlightReport) => ({
    act: r.findings.filter((f) => f.severity === 'act').length,
    watch: r.findings.filter((f) => f.severity === 'watch').length,
  });
  const sb = sev(before);
  const sa = sev(after);
  if (sb.act !== sa.act || sb.watch !== sa.watch) {
    out.push(
      `Findings to act on: ${sb.act} before, ${sa.act} now; to watch: ${sb.watch} before, ${sa.watch} now.`,
    );
  }
  if (out.length === 0)
    out.push(
      'No difference above flight-to-flight noise in balance, torque split, CG, vibration or sag.',
    );
  return out;
}

/** Positions closer than this are the same motor mount, mm (below any frame's build tolerance). */
const SAME_PLACE_MM = 0.5;

function sameGeometry(a: Airframe, b: Airframe): boolean {
  if (a.motors.length !== b.motors.length) return false;
  const near = (p: { x: number; y: number }, q: { x: number; y: number }) =>
    Math.hypot(p.x - q.x, p.y - q.y) < SAME_PLACE_MM;
  const cgA = a.cg ?? { x: 0, y: 0 };
  const cgB = b.cg ?? { x: 0, y: 0 };
  return (
    a.motors.every((m, i) => {
      const o = b.motors[i]!;
      return m.spin === o.spin && near(m, o);
    }) &&
    near(cgA, cgB) &&
    (a.thrustExponent ?? 2) === (b.thrustExponent ?? 2)
  );
}

/** The geometry a flight was judged against, as its detail (or the aircraft) says. */
export interface JudgedAirframe {
  airframe: Airframe | null;
  assumed: boolean;
}

const judgedName = (j: JudgedAirframe) => `${j.airframe!.name}${j.assumed ? ' (assumed)' : ''}`;

/**
 * A sentence when the two flights' balance was judged against different geometry (motor
 * places, spins, design CG or thrust exponent), so their deviations measure against different
 * expected shares; null when the geometry matches or is not known for both.
 */
export function describeGeometryChange(
  before: JudgedAirframe,
  after: JudgedAirframe,
): string | null {
  if (!before.airframe || !after.airframe) return null;
  if (before.airframe.motors.length !== after.airframe.motors.length) return null;
  if (sameGeometry(before.airframe, after.airframe)) return null;
  return `The flights were judged against different geometry (${judgedName(before)} before, ${judgedName(after)} now), so each motor's deviation is measured against a different expected share.`;
}
