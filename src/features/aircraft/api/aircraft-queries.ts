import { queryOptions, useQuery } from '@tanstack/react-query';
import {
  fetchAircraft,
  fetchBenchRuns,
  fetchServiceLog,
  fetchTeamAircraft,
  fetchTrends,
} from './aircraft-api';

export const aircraftKeys = {
  all: ['aircraft'] as const,
  lists: () => [...aircraftKeys.all, 'list'] as const,
  list: (teamId: string) => [...aircraftKeys.lists(), teamId] as const,
  details: () => [...aircraftKeys.all, 'detail'] as const,
  detail: (id: string) => [...aircraftKeys.details(), id] as const,
  serviceLog: (id: string) => [...aircraftKeys.detail(id), 'service-log'] as const,
  benchRuns: (id: string) => [...aircraftKeys.detail(id), 'bench-runs'] as const,
  trends: (id: string) => [...aircraftKeys.detail(id), 'trends'] as const,
};

export const aircraftQueries = {
  list: (teamId: string) =>
    queryOptions({ queryKey: aircraftKeys.list(teamId), queryFn: () => fetchTeamAircraft(teamId) }),
  detail: (id: string) =>
    queryOptions({ queryKey: aircraftKeys.detail(id), queryFn: () => fetchAircraft(id) }),
  // Records the crew adds to and corrects from several devices: always ask again when the page
  // opens, so an entry added or deleted elsewhere a moment ago shows.
  serviceLog: (id: string) =>
    queryOptions({
      queryKey: aircraftKeys.serviceLog(id),
      queryFn: () => fetchServiceLog(id),
      staleTime: 0,
    }),
  benchRuns: (id: string) =>
    queryOptions({
      queryKey: aircraftKeys.benchRuns(id),
      queryFn: () => fetchBenchRuns(id),
      staleTime: 0,
    }),
  trends: (id: string) =>
    queryOptions({ queryKey: aircraftKeys.trends(id), queryFn: () => fetchTrends(id) }),
};

export const useTeamAircraft = (teamId: string) => useQuery(aircraftQueries.list(teamId));
export const useAircraft = (id: string) => useQuery(aircraftQueries.detail(id));
export const useServiceLog = (id: string) => useQuery(aircraftQueries.serviceLog(id));
export const useBenchRuns = (id: string) => useQuery(aircraftQueries.benchRuns(id));
export const useTrends = (id: string) => useQuery(aircraftQueries.trends(id));
