import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { pathTo } from '../../shared/api/paths';
import {
  AcceptInviteResponse,
  Invite,
  InviteList,
  InvitePreview,
  type InviteInput,
} from '../../shared/schemas/teams';
import { apiFetch } from '../lib/api-fetch';
import { teamKeys } from './teams';

/** A team's invitations (the owner's side) and one invitation by its link (the invitee's). */
export const inviteKeys = {
  all: ['invites'] as const,
  byToken: (token: string) => [...inviteKeys.all, 'token', token] as const,
};

const fetchInvites = (teamId: string) => apiFetch(pathTo('invites', { teamId }), InviteList);
const createInvite = (teamId: string, input: InviteInput) =>
  apiFetch(pathTo('invites', { teamId }), Invite, { method: 'POST', json: input });
const withdrawInvite = (teamId: string, inviteId: string) =>
  apiFetch(pathTo('teamInvite', { teamId, inviteId }), z.unknown(), { method: 'DELETE' });
const fetchInvitePreview = (token: string) => apiFetch(pathTo('invite', { token }), InvitePreview);
const acceptInvite = (token: string) =>
  apiFetch(pathTo('acceptInvite', { token }), AcceptInviteResponse, { method: 'POST' });

export const inviteQueries = {
  team: (teamId: string) =>
    queryOptions({
      queryKey: teamKeys.invites(teamId),
      queryFn: () => fetchInvites(teamId),
      staleTime: 0,
    }),
  preview: (token: string) =>
    queryOptions({
      queryKey: inviteKeys.byToken(token),
      queryFn: () => fetchInvitePreview(token),
      retry: false,
    }),
};

export const useInvites = (teamId: string, enabled = true) =>
  useQuery({ ...inviteQueries.team(teamId), enabled });
export const useInvitePreview = (token: string) => useQuery(inviteQueries.preview(token));

export function useCreateInvite(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => createInvite(teamId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.invites(teamId) }),
  });
}

/** The link stops working at once; the list then shows the invitation as withdrawn. */
export function useWithdrawInvite(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (inviteId: string) => withdrawInvite(teamId, inviteId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.invites(teamId) }),
  });
}

// The session is refreshed at the call site, which knows where to go next.
export const useAcceptInvite = () => useMutation({ mutationFn: acceptInvite });
