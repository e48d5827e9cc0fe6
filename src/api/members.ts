import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { pathTo } from '../../shared/api/paths';
import { Member, MemberList, type MemberPatch } from '../../shared/schemas/teams';
import { apiFetch } from '../lib/api-fetch';
import { teamKeys } from './teams';

const fetchMembers = (teamId: string) => apiFetch(pathTo('members', { teamId }), MemberList);
const changeRole = (teamId: string, userId: string, input: MemberPatch) =>
  apiFetch(pathTo('member', { teamId, userId }), Member, { method: 'PATCH', json: input });
const removeMember = (teamId: string, userId: string) =>
  apiFetch(pathTo('member', { teamId, userId }), z.unknown(), { method: 'DELETE' });

export const memberQueries = {
  // People join and leave from other browsers: always ask again when a page that lists them opens.
  list: (teamId: string) =>
    queryOptions({
      queryKey: teamKeys.members(teamId),
      queryFn: () => fetchMembers(teamId),
      staleTime: 0,
    }),
};

export const useMembers = (teamId: string, enabled = true) =>
  useQuery({ ...memberQueries.list(teamId), enabled });

export function useChangeRole(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, ...input }: MemberPatch & { userId: string }) =>
      changeRole(teamId, userId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.members(teamId) }),
  });
}

export function useRemoveMember(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(teamId, userId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.members(teamId) }),
  });
}
