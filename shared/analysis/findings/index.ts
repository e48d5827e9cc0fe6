import type { LogWarning } from '../../log/types';
import type { Airframe } from '../../schemas/airframe';
import { mostSevereFirst, type Finding } from '../../schemas/report';
import type { Thresholds } from '../../schemas/thresholds';
import type { BalanceResult } from '../balance';
import type { Diagnosis } from '../diagnosis';
import type { HeadroomResult } from '../headroom';
import type { PowerResult } from '../power';
import type { ThrustLoss } from '../thrust-loss';
import type { TrackingResult } from '../tracking';
import type { VibrationResult } from '../vibration';
import { balanceFindings } from './balance';
import { trackingFindings } from './tracking';
import { vibrationFindings } from './vibration';
import { level } from './words';

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
  /** The lone-motor thrust loss that explains the hover moments, when one does. */
  thrustLoss: ThrustLoss | null;
  vibration: VibrationResult;
  power: PowerResult | null;
  headroom: HeadroomResult;
  tracking: TrackingResult | null;
  warnings: LogWarning[];
  th: Thresholds;
}

/** Ranked findings (act first, then watch, then note), each saying what to check on the bench. */
export function buildFindings(f: FindingInput): Finding[] {
  const out: Finding[] = [];
  const { th, balance, diagnosis } = f;
  const judged = balance && f.hoverS >= th.minHoverForVerdictS;
  const tS = f.hoverAtS ?? undefined;

  if (judged) {
    out.push(
      ...balanceFindings({
        airframe: f.airframe,
        balance,
        diagnosis,
        thrustLoss: f.thrustLoss,
        tS,
        th,
      }),
    );
  }

  out.push(...vibrationFindings(f.vibration, th));

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

  if (f.tracking) out.push(...trackingFindings(f.tracking, f.airframe.prop.diameterIn, th));

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
