import type {
  AircraftBaseline,
  BaselineCut,
  BaselineFlight,
  DriftSample,
} from '../schemas/baseline';
import type { ServiceKind } from '../schemas/aircraft';
import type { Drift, Finding } from '../schemas/report';
import type { Thresholds } from '../schemas/thresholds';
import { computeDrift } from './drift';

/**
 * Service-log kinds that change how the aircraft flies, so flights before them say nothing about
 * it now: a swapped motor or part, new props, a repair or crash, a new tune. An inspection or a
 * note changes nothing.
 */
export const CONFIG_CHANGES: readonly ServiceKind[] = [
  'part-swap',
  'prop-change',
  'repair',
  'crash',
  'tune',
];

/** A stored flight's trend numbers, which carry hover and lag only since drift existed. */
export type StoredTrend = Partial<DriftSample> & Pick<DriftSample, 'deviationPct' | 'asymmetryPct'>;

/** A stored trend as a drift sample; flights stored before hover was kept never join a baseline. */
export function sampleOfTrend(trend: StoredTrend): DriftSample {
  return {
    hoverS: trend.hoverS ?? 0,
    deviationPct: trend.deviationPct,
    asymmetryPct: trend.asymmetryPct,
    cg: trend.cg ?? null,
    bandRms: trend.bandRms ?? {},
    internalResistanceOhm: trend.internalResistanceOhm ?? null,
    lagMs: trend.lagMs ?? null,
  };
}

/** UTC day (YYYY-MM-DD) of an ISO time. */
const dayOf = (iso: string) => new Date(iso).toISOString().slice(0, 10);

/**
 * The latest configuration change on or before the flight's day. A change dated the same day
 * as the flight counts as before it: service is logged by day, and the flights of that day are
 * most likely the test flights after the work.
 */
export function latestConfigChange(
  entries: readonly BaselineCut[],
  beforeIso: string,
): BaselineCut | null {
  const day = dayOf(beforeIso);
  let cut: BaselineCut | null = null;
  for (const e of entries) {
    if (!CONFIG_CHANGES.includes(e.kind) || e.date > day) continue;
    if (!cut || e.date > cut.date) cut = e;
  }
  return cut;
}

/**
 * The baseline flights for a flight recorded at `beforeIso`: earlier flights (not `excludeId`)
 * on or after the cut's day, the most recent `driftMaxFlights` of those with enough hover,
 * oldest first; and how many were left out for too little hover.
 */
export function selectBaseline(
  candidates: readonly BaselineFlight[],
  opts: { beforeIso: string; excludeId?: string | undefined; cut: BaselineCut | null },
  th: Thresholds,
): { flights: BaselineFlight[]; shortHover: number } {
  const before = Date.parse(opts.beforeIso);
  const since = opts.cut ? Date.parse(`${opts.cut.date}T00:00:00Z`) : -Infinity;
  const earlier = candidates
    .filter((c) => c.flightId !== opts.excludeId)
    .filter((c) => {
      const t = Date.parse(c.recordedAt);
      return t < before && t >= since;
    })
    .sort((a, b) => Date.parse(a.recordedAt) - Date.parse(b.recordedAt));
  const enough = earlier.filter((c) => c.sample.hoverS >= th.minHoverForVerdictS);
  return {
    flights: enough.slice(-th.driftMaxFlights),
    shortHover: earlier.length - enough.length,
  };
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "2 Dec", with the year when it is not the year of `nowIso`. */
export function shortDate(date: string, nowIso: string): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const year = y === new Date(nowIso).getUTCFullYear() ? '' : ` ${y}`;
  return `${d} ${MONTHS[m - 1]}${year}`;
}

const KIND_WORDS: Record<ServiceKind, string> = {
  'part-swap': 'part swap',
  'prop-change': 'prop change',
  repair: 'repair',
  crash: 'crash',
  inspection: 'inspection',
  tune: 'tune',
  other: 'service',
};

/** "the motor 3 swap on 2 Dec", "the prop change on 28 Nov". */
export function cutWords(cut: BaselineCut, nowIso: string): string {
  const what =
    cut.kind === 'part-swap' && cut.motor !== null
      ? `motor ${cut.motor} swap`
      : `${KIND_WORDS[cut.kind]}${cut.motor !== null ? ` on motor ${cut.motor}` : ''}`;
  return `the ${what} on ${shortDate(cut.date, nowIso)}`;
}

/** What a flight was judged against, or why it was not. */
export type DriftOutcome =
  | { kind: 'compared'; against: string; drift: Drift; findings: Finding[]; flightIds: string[] }
  | { kind: 'none'; reason: string };

/**
 * Judges a flight against a baseline: the words for the verdict ("Kite's last 6 flights, since
 * the motor 3 swap on 2 Dec"), and the drift and its findings, or in words why there is none.
 * `where` names where the baseline came from when it is not the team's server.
 */
export function judgeAgainst(
  now: DriftSample,
  nowIso: string,
  baseline: Pick<AircraftBaseline, 'aircraftName' | 'since' | 'flights' | 'shortHover'>,
  th: Thresholds,
  where?: string,
): DriftOutcome {
  const n = baseline.flights.length;
  const since = baseline.since ? `, since ${cutWords(baseline.since, nowIso)}` : '';
  const kept = where ? ` ${where}` : '';
  if (now.deviationPct.length === 0)
    return { kind: 'none', reason: 'No drift: this flight has no balance to compare.' };
  if (n < th.driftMinFlights) {
    const short = baseline.shortHover
      ? ` (${baseline.shortHover} more had under ${th.minHoverForVerdictS} s of hover)`
      : '';
    return {
      kind: 'none',
      reason:
        `No drift: ${baseline.aircraftName} has ${n} earlier flight${n === 1 ? '' : 's'} ` +
        `with enough hover${kept}${since}${short}; it takes ${th.driftMinFlights}.`,
    };
  }
  const against = `${baseline.aircraftName}’s last ${n} flights${kept}${since}`;
  const r = computeDrift(
    now,
    { samples: baseline.flights.map((f) => f.sample), label: against },
    th,
  );
  if (!r.drift) return { kind: 'none', reason: r.warning ?? 'No drift.' };
  return {
    kind: 'compared',
    against,
    drift: r.drift,
    findings: r.findings,
    flightIds: baseline.flights.map((f) => f.flightId),
  };
}
