import { queryOptions } from '@tanstack/react-query';
import type { FlightReport } from '../../../../shared/schemas/report';
import { FlightReport as FlightReportSchema } from '../../../../shared/schemas/report';
import type { ReviewDetail } from '../../../../shared/analysis/review-detail';
import { Aircraft } from '../../../../shared/schemas/aircraft';
import type { Airframe } from '../../../../shared/schemas/airframe';
import { FlightDetail, FlightPage } from '../../../../shared/schemas/flights';
import type { ColumnMap } from '../../../../shared/log/column-map';
import { PresetList } from '../../../../shared/schemas/presets';
import { ReviewDetailLoose } from '../../../../shared/schemas/flights';
import { pathTo } from '../../../../shared/api/paths';
import { apiFetch, ApiError } from '../../../lib/api-fetch';
import { getLocalFlight } from '../../../lib/local-db';

/** A flight as the review reads it, wherever it came from. */
export interface ReviewFlight {
  id: string;
  /** 'local': analysed on this device (maybe not yet synced); 'server': stored by the team. */
  source: 'local' | 'server';
  fileName: string;
  report: FlightReport;
  detail: ReviewDetail;
  teamId: string | null;
  aircraftId: string | null;
  aircraftName: string | null;
  pilotId: string | null;
  recordedAt: string | null;
  /** Raw log kept on this device, to re-read for the filter bench after a reload. */
  file: Blob | null;
  /** How the log was read on this device (column map, pole count), to read it again alike. */
  readOptions: { columnMap?: ColumnMap; poles?: number };
  /** The team server has the flight (comments live there). */
  syncedToTeam: boolean;
}

export class FlightNotFoundError extends Error {
  override name = 'FlightNotFoundError';
}

/**
 * This device first (it works offline and before the sync), the team server second. A local
 * record is checked with the same schema the server uses, so an old record from an earlier
 * version fails here with a clear message rather than deep inside a chart.
 */
export async function fetchReviewFlight(id: string): Promise<ReviewFlight> {
  let local;
  try {
    local = await getLocalFlight(id);
  } catch {
    local = undefined; // IndexedDB unavailable (private window): the server may still have it
  }
  if (local) {
    const report = FlightReportSchema.parse(local.report);
    const detail = ReviewDetailLoose.parse(local.detail);
    return {
      id,
      source: 'local',
      fileName: local.fileName,
      report,
      detail,
      teamId: local.teamId ?? null,
      aircraftId: local.aircraftId ?? null,
      aircraftName: null,
      pilotId: null,
      recordedAt: local.recordedAt ?? null,
      file: local.file,
      readOptions: {
        ...(local.columnMap ? { columnMap: local.columnMap } : {}),
        ...(local.poles !== undefined ? { poles: local.poles } : {}),
      },
      syncedToTeam: local.syncState === 'synced' || local.summarySynced === true,
    };
  }
  try {
    const stored = await apiFetch(pathTo('flight', { id }), FlightDetail);
    if (!stored.detail)
      throw new FlightNotFoundError(
        'This flight was stored without its review detail; import the log again.',
      );
    return {
      id,
      source: 'server',
      fileName: stored.fileName,
      report: stored.report,
      detail: stored.detail,
      teamId: stored.teamId,
      aircraftId: stored.aircraftId,
      aircraftName: stored.aircraftName,
      pilotId: stored.pilot.id,
      recordedAt: stored.recordedAt,
      file: null,
      readOptions: {},
      syncedToTeam: true,
    };
  } catch (e) {
    if (e instanceof ApiError && (e.status === 404 || e.status === 401 || e.status === 403)) {
      throw new FlightNotFoundError(
        e.status === 404
          ? 'No flight with this id on this device or in your teams.'
          : 'This flight is not on this device; sign in with a team that has it to open it.',
      );
    }
    throw e;
  }
}

export const fetchAircraft = (id: string) => apiFetch(pathTo('aircraft', { id }), Aircraft);

/** Flights of one aircraft, newest first, for compare. */
export const fetchAircraftFlights = (teamId: string, aircraftId: string) =>
  apiFetch(
    `${pathTo('teamFlights', { teamId })}?aircraftId=${encodeURIComponent(aircraftId)}&limit=50`,
    FlightPage,
  );

/** Raw log from the server, for the filter bench on a flight not kept on this device. */
export async function fetchRawLog(id: string): Promise<Blob> {
  const res = await fetch(pathTo('flightRaw', { id }), {
    credentials: 'same-origin',
  });
  if (!res.ok)
    throw new ApiError(
      res.status,
      'http_' + res.status,
      'The raw log is not available from the server.',
    );
  return res.blob();
}

/** The team's import presets, to read a stored flight's raw log whose headers need a map. */
export const fetchTeamPresets = (teamId: string) =>
  apiFetch(pathTo('presets', { teamId }), PresetList);

export const reviewKeys = {
  all: ['review'] as const,
  flight: (id: string) => [...reviewKeys.all, 'flight', id] as const,
  aircraft: (id: string) => [...reviewKeys.all, 'aircraft', id] as const,
  aircraftFlights: (teamId: string, aircraftId: string) =>
    [...reviewKeys.all, 'aircraft-flights', teamId, aircraftId] as const,
};

export const reviewQueries = {
  flight: (id: string) =>
    queryOptions({
      queryKey: reviewKeys.flight(id),
      queryFn: () => fetchReviewFlight(id),
      staleTime: Infinity,
      // A flight waiting for the sync is looked at again, so comments open once it has landed.
      refetchInterval: (q) => {
        const f = q.state.data;
        return f && f.source === 'local' && f.teamId !== null && !f.syncedToTeam ? 5000 : false;
      },
      retry: (n, e) => !(e instanceof FlightNotFoundError) && n < 1,
    }),
  aircraft: (id: string) =>
    queryOptions({
      queryKey: reviewKeys.aircraft(id),
      queryFn: () => fetchAircraft(id),
      staleTime: 5 * 60_000,
    }),
  aircraftFlights: (teamId: string, aircraftId: string) =>
    queryOptions({
      queryKey: reviewKeys.aircraftFlights(teamId, aircraftId),
      queryFn: () => fetchAircraftFlights(teamId, aircraftId),
    }),
};

export type { Airframe };
