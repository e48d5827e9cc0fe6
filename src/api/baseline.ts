import { queryOptions, useQuery } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { AircraftBaseline, type BaselineQuery } from '../../shared/schemas/baseline';
import { apiFetch } from '../lib/api-fetch';
import { deviceBaselineFlights } from '../lib/local-baseline';
import { aircraftKeys } from './aircraft';
import { localKeys } from './local';

/**
 * The aircraft's recent flights a review judges drift against, as the team's server selects
 * them (since the latest configuration change in the service log, enough hover, bounded).
 */
export const baselineKeys = {
  all: (aircraftId: string) => [...aircraftKeys.detail(aircraftId), 'baseline'] as const,
  before: (aircraftId: string, q: BaselineQuery) =>
    [...baselineKeys.all(aircraftId), q.before, q.exclude ?? null] as const,
  /** The same, from the flights kept on this device. */
  device: (aircraftId: string) => [...localKeys.all, 'baseline', aircraftId] as const,
};

const fetchBaseline = (aircraftId: string, q: BaselineQuery) => {
  const search = new URLSearchParams({ before: q.before });
  if (q.exclude) search.set('exclude', q.exclude);
  return apiFetch(`${pathTo('aircraftBaseline', { id: aircraftId })}?${search}`, AircraftBaseline);
};

export const baselineQueries = {
  before: (aircraftId: string, q: BaselineQuery) =>
    queryOptions({
      queryKey: baselineKeys.before(aircraftId, q),
      queryFn: () => fetchBaseline(aircraftId, q),
      // A flight synced or a service entry added elsewhere changes it; a minute is fresh enough
      // for one review.
      staleTime: 60_000,
      retry: false,
    }),
};

export const useAircraftBaseline = (aircraftId: string, q: BaselineQuery, enabled: boolean) =>
  useQuery({ ...baselineQueries.before(aircraftId, q), enabled });

/** The same aircraft's flights kept on this device: the baseline offline. */
export const deviceBaselineQueries = {
  of: (aircraftId: string) =>
    queryOptions({
      queryKey: baselineKeys.device(aircraftId),
      queryFn: () => deviceBaselineFlights(aircraftId),
      networkMode: 'always',
    }),
};

export const useDeviceBaseline = (aircraftId: string, enabled: boolean) =>
  useQuery({ ...deviceBaselineQueries.of(aircraftId), enabled });
