import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { Me } from '../../../../shared/schemas/auth';
import { fetchMe } from './session-api';

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

const LAST_ME = 'hoverprint.last-me';

/**
 * The last known user, so the header and sync know who this is while the server cannot be
 * reached; the server's answer replaces it as soon as there is one.
 */
function readLastMe(): Me | null | undefined {
  try {
    const raw = localStorage.getItem(LAST_ME);
    if (raw === null) return undefined;
    const parsed = Me.nullable().safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : undefined;
  } catch {
    return undefined;
  }
}

export function rememberMe(me: Me | null) {
  try {
    if (me) localStorage.setItem(LAST_ME, JSON.stringify(me));
    else localStorage.removeItem(LAST_ME);
  } catch {
    // storage full or blocked: only the offline header loses the name
  }
}

export const sessionQueries = {
  me: () =>
    queryOptions({
      queryKey: sessionKeys.me(),
      queryFn: async () => {
        const me = await fetchMe();
        rememberMe(me);
        return me;
      },
      initialData: readLastMe,
      initialDataUpdatedAt: 0,
      staleTime: 60_000,
    }),
};

/** `data` is the user, null when signed out, undefined while the first answer is pending. */
export function useMe() {
  return useQuery(sessionQueries.me());
}

/** Put a fresh user (after sign-in, sign-up, joining a team) into the session. */
export function useSetMe() {
  const queryClient = useQueryClient();
  return useCallback(
    (me: Me | null) => {
      rememberMe(me);
      queryClient.setQueryData(sessionKeys.me(), me);
      return queryClient.invalidateQueries({ queryKey: sessionKeys.me() });
    },
    [queryClient],
  );
}
