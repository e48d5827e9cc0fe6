import {
  infiniteQueryOptions,
  useInfiniteQuery,
  useQuery,
  queryOptions,
} from '@tanstack/react-query';
import { fetchFlightPage, type FlightFilter } from './fleet-api';

export const fleetKeys = {
  all: ['flights'] as const,
  lists: () => [...fleetKeys.all, 'list'] as const,
  list: (teamId: string, filter: FlightFilter) => [...fleetKeys.lists(), teamId, filter] as const,
  awaiting: (teamId: string) => [...fleetKeys.lists(), teamId, 'awaiting-review'] as const,
};

export const fleetQueries = {
  list: (teamId: string, filter: FlightFilter) =>
    infiniteQueryOptions({
      queryKey: fleetKeys.list(teamId, filter),
      queryFn: ({ pageParam }) => fetchFlightPage(teamId, filter, pageParam),
      initialPageParam: undefined as string | undefined,
      getNextPageParam: (last) => last.nextCursor ?? undefined,
    }),
  awaiting: (teamId: string) =>
    queryOptions({
      queryKey: fleetKeys.awaiting(teamId),
      queryFn: () => fetchFlightPage(teamId, { review: 'requested', limit: 20 }),
    }),
};

export const useFlightList = (teamId: string, filter: FlightFilter) =>
  useInfiniteQuery(fleetQueries.list(teamId, filter));
export const useAwaitingReview = (teamId: string) => useQuery(fleetQueries.awaiting(teamId));
