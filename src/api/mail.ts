import { queryOptions, useQuery } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { DevMailList } from '../../shared/schemas/mail';
import { ApiError, apiFetch } from '../lib/api-fetch';
import { useHealth } from './health';

/** Caught messages, or null when this server sends real mail (the route is not mounted). */
async function fetchDevMail() {
  try {
    return await apiFetch(pathTo('devMail'), DevMailList);
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
}

export const mailKeys = {
  all: ['dev-mail'] as const,
  inbox: () => [...mailKeys.all, 'inbox'] as const,
  /** Whether this server has an inbox at all: kept across reloads, so offline the link stays. */
  available: () => [...mailKeys.all, 'available'] as const,
};

export const mailQueries = {
  inbox: () =>
    queryOptions({
      queryKey: mailKeys.inbox(),
      queryFn: fetchDevMail,
      refetchInterval: 5_000,
      staleTime: 0,
    }),
};

export const useDevMail = () => useQuery(mailQueries.inbox());

/**
 * Whether this server has a dev inbox at all, for the navigation. The health answer says so
 * when it can, so a server sending real mail is never asked for an inbox it lacks (a 404 in the
 * console). Otherwise the inbox is asked once an hour, and the answer remembered
 * (src/app/query-persistence.ts) so the link does not disappear while the network is away.
 */
export const useDevMailAvailable = () => {
  const health = useHealth();
  const said = health.data?.devMail;
  const probe = useQuery({
    queryKey: mailKeys.available(),
    queryFn: async () => (await fetchDevMail()) !== null,
    staleTime: 60 * 60 * 1000,
    enabled: health.isSuccess && said === undefined,
  });
  return said ?? probe.data === true;
};
