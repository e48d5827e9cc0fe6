import { queryOptions } from '@tanstack/react-query';
import { HealthResponse } from '../../../../shared/api/health';
import { paths } from '../../../../shared/api/paths';
import { apiFetch } from '../../../lib/api-fetch';

export const statusKeys = {
  all: ['status'] as const,
  health: () => [...statusKeys.all, 'health'] as const,
};

export const statusQueries = {
  health: () =>
    queryOptions({
      queryKey: statusKeys.health(),
      queryFn: () => apiFetch(paths.health, HealthResponse),
      refetchInterval: 30_000,
      retry: false,
    }),
};
