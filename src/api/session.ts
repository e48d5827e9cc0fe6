import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { pathTo } from '../../shared/api/paths';
import {
  Me,
  MeResponse,
  OkResponse,
  SessionResponse,
  type ChangePasswordInput,
  type UpdateMeInput,
} from '../../shared/schemas/auth';
import { ApiError, apiFetch } from '../lib/api-fetch';

/** Who is signed in on this device, with their teams and roles. */
export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

/** The signed-in user with their teams, or null when nobody is signed in (a 200, or a 401 from an older server). */
async function fetchMe(): Promise<Me | null> {
  try {
    return (await apiFetch(pathTo('me'), SessionResponse)).user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}
const signOut = () => apiFetch(pathTo('signOut'), OkResponse, { method: 'POST' });
const updateMe = (input: UpdateMeInput) =>
  apiFetch(pathTo('me'), MeResponse, { method: 'PATCH', json: input });
const changePassword = (input: ChangePasswordInput) =>
  apiFetch(pathTo('password'), MeResponse, { method: 'POST', json: input });

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

function rememberMe(me: Me | null) {
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

/** Sign out here; everything cached about the team is dropped with the session. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      rememberMe(null);
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
      queryClient.setQueryData(sessionKeys.me(), null);
    },
  });
}

function useMeMutation<I>(fn: (input: I) => Promise<MeResponse>) {
  const setMe = useSetMe();
  return useMutation({ mutationFn: fn, onSuccess: ({ user }) => setMe(user) });
}

export const useUpdateMe = () => useMeMutation(updateMe);
export const useChangePassword = () => useMeMutation(changePassword);
