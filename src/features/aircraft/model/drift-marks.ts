import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useAircraft } from '../../../api/aircraft';
import { thresholdQueries } from '../../../api/thresholds';
import {
  judgeAgainst,
  latestConfigChange,
  sampleOfTrend,
  selectBaseline,
} from '../../../../shared/analysis/baseline';
import type { ServiceEntry, TrendPoint } from '../../../../shared/schemas/aircraft';
import type { BaselineFlight } from '../../../../shared/schemas/baseline';
import type { FindingCode } from '../../../../shared/schemas/report';
import { defaultThresholds, type Thresholds } from '../../../../shared/schemas/thresholds';

/** A flight that raised drift, for the trend charts: when, and which drift findings. */
export interface DriftMark {
  t: number;
  recordedAt: string;
  codes: FindingCode[];
  /** Motors with `motor-drift`. */
  motors: number[];
}

/**
 * Each trend flight judged as its review judges it (shared/analysis/baseline.ts): against the
 * aircraft's flights before it since the latest configuration change; the ones that raised drift.
 */
export function driftMarks(
  points: readonly TrendPoint[],
  entries: readonly Pick<ServiceEntry, 'date' | 'kind' | 'motor' | 'note'>[],
  th: Thresholds,
): DriftMark[] {
  const flights: BaselineFlight[] = points.map((p) => ({
    flightId: p.flightId,
    recordedAt: p.recordedAt,
    sample: sampleOfTrend(p),
  }));
  const marks: DriftMark[] = [];
  for (const f of flights) {
    const cut = latestConfigChange(entries, f.recordedAt);
    const picked = selectBaseline(
      flights,
      { beforeIso: f.recordedAt, excludeId: f.flightId, cut },
      th,
    );
    const r = judgeAgainst(f.sample, f.recordedAt, { aircraftName: '', since: cut, ...picked }, th);
    if (r.kind !== 'compared' || r.findings.length === 0) continue;
    marks.push({
      t: Date.parse(f.recordedAt),
      recordedAt: f.recordedAt,
      codes: [...new Set(r.findings.map((x) => x.code))],
      motors: r.findings.flatMap((x) => (x.code === 'motor-drift' && x.motor ? [x.motor] : [])),
    });
  }
  return marks;
}

/** The drift marks of an aircraft's trends, judged by its team's thresholds. */
export function useDriftMarks(
  aircraftId: string,
  points: readonly TrendPoint[] | undefined,
  entries: readonly ServiceEntry[] | undefined,
): DriftMark[] {
  const teamId = useAircraft(aircraftId).data?.teamId ?? '';
  const th = useQuery({ ...thresholdQueries.team(teamId), enabled: teamId !== '' }).data
    ?.thresholds;
  return useMemo(
    () => driftMarks(points ?? [], entries ?? [], th ?? defaultThresholds),
    [points, entries, th],
  );
}
