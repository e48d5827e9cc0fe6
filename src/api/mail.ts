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

/** Whether this server has a dev inbox at all; asked once, for the navigation. */
export const useDevMailAvailable = () => {
  const inbox = useQuery({ ...mailQueries.inbox(), refetchInterval: false, staleTime: Infinity });
  return Boolean(inbox.data);
};
