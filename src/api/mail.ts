import { queryOptions, useQuery } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { DevMailList } from '../../shared/schemas/mail';
import { ApiError, apiFetch } from '../lib/api-fetch';
import { fetchHealth, useHealth } from './health';

/** Caught messages, or null when this server sends real mail (the route is not mounted). */
async function fetchDevMail() {
  try {
    return await apiFetch(pathTo('devMail'), DevMailList);
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
}

/** Whether the server has an inbox: its health answer says so, or (an older server) the inbox. */
async function fetchAvailable() {
  const { devMail } = await fetchHealth();
  return devMail ?? (await fetchDevMail()) !== null;
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
 * console); otherwise the inbox is asked once an hour. Either answer is remembered under one key
 * (src/app/query-persistence.ts), so after a reload with no network the link is still there.
 */
export const useDevMailAvailable = () => {
  const health = useHealth();
  const said = health.data?.devMail;
  const known = useQuery({
    queryKey: mailKeys.available(),
    queryFn: fetchAvailable,
    staleTime: 60 * 60 * 1000,
    enabled: health.isSuccess,
  });
  return said ?? known.data === true;
};
