import { SEVERITIES, type FlightReport, type Severity } from '../../shared/schemas/report';
import type { TrendPoint } from '../../shared/schemas/aircraft';

/** Stored as 0 none, 1 note, 2 watch, 3 act so lists can filter "at least watch". */
export function severityRank(s: Severity): number {
  return SEVERITIES.indexOf(s) + 1;
}

export function severityName(rank: number): Severity | null {
  return SEVERITIES[rank - 1] ?? null;
}

export function findingStats(report: FlightReport) {
  const counts = { note: 0, watch: 0, act: 0 };
  let worst = 0;
  for (const f of report.findings) {
    counts[f.severity] += 1;
    worst = Math.max(worst, severityRank(f.severity));
  }
  return { counts, worst };
}

/** The few numbers the aircraft trend charts need, kept beside the report. */
export function trendOf(
  report: FlightReport,
): Omit<TrendPoint, 'flightId' | 'recordedAt' | 'worstSeverity'> {
  return {
    deviationPct: report.balance.deviationPct,
    asymmetryPct: report.torqueSplit.asymmetryPct,
    cg: report.cg,
    bandRms: Object.fromEntries(Object.entries(report.vibration).map(([ch, v]) => [ch, v.bandRms])),
    sagCellV: report.power?.sagCellV ?? null,
    minCellV: report.power?.minCellV ?? null,
    internalResistanceOhm: report.power?.internalResistanceOhm ?? null,
    saturationS: report.headroom.saturationS,
    // What drift reads of each earlier flight (shared/analysis/baseline.ts).
    hoverS: report.segments.hoverS,
    lagMs: report.tracking
      ? {
          roll: report.tracking.roll.lagMs,
          pitch: report.tracking.pitch.lagMs,
          yaw: report.tracking.yaw.lagMs,
        }
      : null,
  };
}
