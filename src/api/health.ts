import { queryOptions, useQuery } from '@tanstack/react-query';
import { HealthResponse } from '../../shared/api/health';
import { pathTo } from '../../shared/api/paths';
import { apiFetch } from '../lib/api-fetch';

/** Whether our server answers, asked every half minute for the header. */
export const healthKeys = {
  all: ['status'] as const,
  health: () => [...healthKeys.all, 'health'] as const,
};

export const healthQueries = {
  health: () =>
    queryOptions({
      queryKey: healthKeys.health(),
      queryFn: () => apiFetch(pathTo('health'), HealthResponse),
      refetchInterval: 30_000,
      retry: false,
    }),
};

export const useHealth = () => useQuery(healthQueries.health());
