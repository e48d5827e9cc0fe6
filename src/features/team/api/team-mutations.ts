import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PresetPatch } from '../../../../shared/schemas/presets';
import type {
  InviteInput,
  MemberPatch,
  TeamInput,
  TeamPatch,
} from '../../../../shared/schemas/teams';
import type { ThresholdsInput } from '../../../../shared/schemas/thresholds';
import {
  changeRole,
  createInvite,
  createTeam,
  deletePreset,
  patchPreset,
  removeMember,
  renameTeam,
  saveThresholds,
  withdrawInvite,
} from './team-api';
import { teamKeys } from './team-queries';

/** Team changes also change the user's own team list, which the session holds: refresh it too. */
export function useCreateTeam(onTeamsChanged: () => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: TeamInput) => createTeam(input),
    onSuccess: () =>
      Promise.all([queryClient.invalidateQueries({ queryKey: teamKeys.list() }), onTeamsChanged()]),
  });
}

export function useRenameTeam(teamId: string, onTeamsChanged: () => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: TeamPatch) => renameTeam(teamId, input),
    onSuccess: () =>
      Promise.all([queryClient.invalidateQueries({ queryKey: teamKeys.all }), onTeamsChanged()]),
  });
}

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

export function useRenamePreset(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: PresetPatch & { id: string }) => patchPreset(id, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.presets(teamId) }),
  });
}

export function useDeletePreset(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deletePreset(id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.presets(teamId) }),
  });
}

export function useSaveThresholds(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ThresholdsInput) => saveThresholds(teamId, input),
    onSuccess: (saved) => {
      queryClient.setQueryData(teamKeys.thresholds(teamId), saved);
      return queryClient.invalidateQueries({ queryKey: teamKeys.thresholds(teamId) });
    },
  });
}
