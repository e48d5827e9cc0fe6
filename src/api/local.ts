import { queryOptions } from '@tanstack/react-query';
import type { FilterSpec } from '../../shared/schemas/filters';
import { listLocalFlights } from '../lib/local-db';

/**
 * Keys of what this device works out for itself: flights kept in IndexedDB and results of the
 * analysis worker. None of these touch the network, so none waits for it.
 */
export const localKeys = {
  all: ['local'] as const,
  flights: () => [...localKeys.all, 'flights'] as const,
  strip: (flightId: string) => [...localKeys.all, 'strip', flightId] as const,
  filterBench: (flightId: string, channel: string, spec: FilterSpec | null) =>
    [...localKeys.all, 'filter-bench', flightId, channel, spec] as const,
  remapSource: (flightId: string | null) => [...localKeys.all, 'remap-source', flightId] as const,
};

export const localQueries = {
  /** Every flight kept on this device, newest first. */
  flights: () =>
    queryOptions({
      queryKey: localKeys.flights(),
      queryFn: listLocalFlights,
      networkMode: 'always',
    }),
};
