import {
  infiniteQueryOptions,
  queryOptions,
  useInfiniteQuery,
  useQuery,
} from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { FlightPage } from '../../shared/schemas/flights';
import { apiFetch } from '../lib/api-fetch';
import { flightKeys, type FlightFilter } from './flight-keys';

export type { FlightFilter };

function flightListSearch(filter: FlightFilter, cursor?: string): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filter))
    if (value !== undefined && value !== '') params.set(key, String(value));
  if (cursor) params.set('cursor', cursor);
  const s = params.toString();
  return s ? `?${s}` : '';
}

const fetchFlightPage = (teamId: string, filter: FlightFilter, cursor?: string) =>
  apiFetch(pathTo('teamFlights', { teamId }) + flightListSearch(filter, cursor), FlightPage);

export const flightListQueries = {
  /** The fleet's list, newest first, a page at a time. */
  list: (teamId: string, filter: FlightFilter) =>
    infiniteQueryOptions({
      queryKey: flightKeys.list(teamId, filter),
      queryFn: ({ pageParam }) => fetchFlightPage(teamId, filter, pageParam),
      initialPageParam: undefined as string | undefined,
      getNextPageParam: (last) => last.nextCursor ?? undefined,
    }),
  awaiting: (teamId: string) =>
    queryOptions({
      queryKey: flightKeys.awaiting(teamId),
      queryFn: () => fetchFlightPage(teamId, { review: 'requested', limit: 20 }),
    }),
  /** Flights of one aircraft, newest first, for compare. */
  ofAircraft: (teamId: string, aircraftId: string) =>
    queryOptions({
      queryKey: flightKeys.ofAircraft(teamId, aircraftId),
      queryFn: () => fetchFlightPage(teamId, { aircraftId, limit: 50 }),
    }),
};

export const useFlightList = (teamId: string, filter: FlightFilter) =>
  useInfiniteQuery(flightListQueries.list(teamId, filter));
export const useAwaitingReview = (teamId: string) => useQuery(flightListQueries.awaiting(teamId));
export const useAircraftFlights = (teamId: string, aircraftId: string, enabled = true) =>
  useQuery({ ...flightListQueries.ofAircraft(teamId, aircraftId), enabled });
