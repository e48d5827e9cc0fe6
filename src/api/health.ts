import { queryOptions, useQuery } from '@tanstack/react-query';
import { HealthResponse } from '../../shared/schemas/health';
import { pathTo } from '../../shared/api/paths';
import { apiFetch } from '../lib/api-fetch';
import type { ServerAnswer } from '../lib/header-status';

/** Whether our server answers, asked every half minute for the header. */
export const healthKeys = {
  all: ['status'] as const,
  health: () => [...healthKeys.all, 'health'] as const,
};

/** The server's health answer (up, database answering, whether it has a dev inbox). */
export const fetchHealth = () => apiFetch(pathTo('health'), HealthResponse);

export const healthQueries = {
  health: () =>
    queryOptions({
      queryKey: healthKeys.health(),
      queryFn: fetchHealth,
      // Not answering: look again less often, so a dead server is not asked every half minute.
      refetchInterval: (q) => (q.state.status === 'error' ? 120_000 : 30_000),
      retry: false,
    }),
};

export const useHealth = () => useQuery(healthQueries.health());

/** Our server's answer for the header's status model (src/lib/header-status.ts). */
export function useServerAnswer(): ServerAnswer {
  const health = useHealth();
  if (health.isPending) return 'checking';
  return health.data?.ok === true && !health.isError ? 'answering' : 'not-answering';
}
