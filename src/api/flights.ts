import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { FlightReport as FlightReportSchema, type FlightReport } from '../../shared/schemas/report';
import type { ReviewDetail } from '../../shared/analysis/review-detail';
import { pathTo } from '../../shared/api/paths';
import type { ColumnMap } from '../../shared/log/column-map';
import { FlightDetail, ReviewDetailLoose, type ReviewState } from '../../shared/schemas/flights';
import { ApiError, apiFetch } from '../lib/api-fetch';
import { getLocalFlight } from '../lib/local-db';
import { aircraftKeys } from './aircraft';
import { flightKeys } from './flight-keys';
import { localKeys } from './local';

export { flightKeys };

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
  /** Where its review stands, as the team server said; null when read from this device. */
  reviewState: ReviewState | null;
}

export class FlightNotFoundError extends Error {
  override name = 'FlightNotFoundError';
}

/** The two routes a flight sync writes: summary first, raw log second. */
export const flightPath = (id: string) => pathTo('flight', { id });
export const flightRawPath = (id: string) => pathTo('flightRaw', { id });

/**
 * This device first (it works offline and before the sync), the team server second. A local
 * record is checked with the same schema the server uses, so an old record from an earlier
 * version fails here with a clear message rather than deep inside a chart.
 */
async function fetchReviewFlight(id: string): Promise<ReviewFlight> {
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
      reviewState: null,
    };
  }
  // Not kept here and no network: say so rather than send a request bound to fail. The query
  // is asked again when the network is back.
  if (typeof navigator !== 'undefined' && navigator.onLine === false)
    throw new FlightNotFoundError(
      'This flight is not kept on this device; it opens from your team when the network is back.',
    );
  try {
    const stored = await apiFetch(flightPath(id), FlightDetail);
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
      reviewState: stored.reviewState,
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

/** The raw log as stored by the team, for reading a flight again that this device does not keep. */
export async function fetchRawLog(id: string): Promise<Blob> {
  const res = await fetch(flightRawPath(id), { credentials: 'same-origin' });
  if (!res.ok)
    throw new ApiError(
      res.status,
      'http_' + res.status,
      res.status === 404
        ? 'The raw log of this flight is not on this device or on the team server.'
        : `The raw log could not be fetched (HTTP ${res.status}); try again when online and signed in.`,
    );
  return res.blob();
}

export const flightQueries = {
  /** One flight for the review: from this device when kept here, else from the team. */
  review: (id: string) =>
    queryOptions({
      queryKey: flightKeys.detail(id),
      queryFn: () => fetchReviewFlight(id),
      staleTime: Infinity,
      // This device is asked first and needs no network; a team flight fails fast offline.
      networkMode: 'always',
      // A flight waiting for the sync is looked at again, so comments open once it has landed.
      refetchInterval: (q) => {
        const f = q.state.data;
        return f && f.source === 'local' && f.teamId !== null && !f.syncedToTeam ? 5000 : false;
      },
      retry: (n, e) => !(e instanceof FlightNotFoundError) && n < 1,
    }),
};

export const useReviewFlight = (id: string, enabled = true) =>
  useQuery({ ...flightQueries.review(id), enabled });

/** After the sync sent flights: the team's lists, aircraft cards and open reviews read again. */
export function refreshAfterSync(queryClient: QueryClient) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: flightKeys.all }),
    queryClient.invalidateQueries({ queryKey: aircraftKeys.all }),
    queryClient.invalidateQueries({ queryKey: localKeys.flights() }),
  ]);
}
