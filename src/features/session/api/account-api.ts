import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pathTo } from '../../../../shared/api/paths';
import {
  MeResponse,
  type ChangePasswordInput,
  type UpdateMeInput,
} from '../../../../shared/schemas/auth';
import { apiFetch } from '../../../lib/api-fetch';
import { rememberMe, sessionKeys } from './session-queries';

export const updateMe = (input: UpdateMeInput) =>
  apiFetch(pathTo('me'), MeResponse, { method: 'PATCH', json: input });

export const changePassword = (input: ChangePasswordInput) =>
  apiFetch(pathTo('password'), MeResponse, { method: 'POST', json: input });

function useMeMutation<I>(fn: (input: I) => Promise<MeResponse>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: ({ user }) => {
      rememberMe(user);
      queryClient.setQueryData(sessionKeys.me(), user);
      return queryClient.invalidateQueries({ queryKey: sessionKeys.me() });
    },
  });
}

export const useUpdateMe = () => useMeMutation(updateMe);
export const useChangePassword = () => useMeMutation(changePassword);
