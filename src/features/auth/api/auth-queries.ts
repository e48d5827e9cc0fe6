import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import {
  acceptInvite,
  confirmReset,
  fetchInvitePreview,
  requestReset,
  signIn,
  signUp,
} from './auth-api';

export const authKeys = {
  all: ['auth'] as const,
  invite: (token: string) => [...authKeys.all, 'invite', token] as const,
};

export const authQueries = {
  invite: (token: string) =>
    queryOptions({
      queryKey: authKeys.invite(token),
      queryFn: () => fetchInvitePreview(token),
      retry: false,
    }),
};

export const useInvitePreview = (token: string) => useQuery(authQueries.invite(token));

// The session is refreshed at the call site (session feature), which knows where to go next.
export const useSignIn = () => useMutation({ mutationFn: signIn });
export const useSignUp = () => useMutation({ mutationFn: signUp });
export const useRequestReset = () => useMutation({ mutationFn: requestReset });
export const useConfirmReset = () => useMutation({ mutationFn: confirmReset });
export const useAcceptInvite = () => useMutation({ mutationFn: acceptInvite });
