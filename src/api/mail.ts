import { queryOptions, useQuery } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { DevMailList } from '../../shared/schemas/mail';
import { ApiError, apiFetch } from '../lib/api-fetch';

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
 * Whether this server has a dev inbox at all, for the navigation: asked once, and remembered
 * (src/app/query-persistence.ts) so the link does not disappear while the network is away.
 */
export const useDevMailAvailable = () => {
  const available = useQuery({
    queryKey: mailKeys.available(),
    queryFn: async () => (await fetchDevMail()) !== null,
    staleTime: 60 * 60 * 1000,
  });
  return available.data === true;
};
