import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { Team, type TeamInput, type TeamPatch } from '../../shared/schemas/teams';
import { apiFetch } from '../lib/api-fetch';
import { sessionKeys } from './session';

/** The root of every key that belongs to one team (members, invites, thresholds). */
export const teamKeys = {
  all: ['teams'] as const,
  detail: (teamId: string) => [...teamKeys.all, 'detail', teamId] as const,
  members: (teamId: string) => [...teamKeys.detail(teamId), 'members'] as const,
  invites: (teamId: string) => [...teamKeys.detail(teamId), 'invites'] as const,
  thresholds: (teamId: string) => [...teamKeys.detail(teamId), 'thresholds'] as const,
};

const createTeam = (input: TeamInput) =>
  apiFetch(pathTo('teams'), Team, { method: 'POST', json: input });
const renameTeam = (teamId: string, input: TeamPatch) =>
  apiFetch(pathTo('team', { teamId }), Team, { method: 'PATCH', json: input });

/** The user's own team list is held by the session: creating or renaming a team refreshes it. */
export function useCreateTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: TeamInput) => createTeam(input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionKeys.me() }),
  });
}

export function useRenameTeam(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: TeamPatch) => renameTeam(teamId, input),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: teamKeys.detail(teamId) }),
        queryClient.invalidateQueries({ queryKey: sessionKeys.me() }),
      ]),
  });
}
