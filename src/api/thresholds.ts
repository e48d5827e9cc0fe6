import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { TeamThresholds, type ThresholdsInput } from '../../shared/schemas/thresholds';
import { apiFetch } from '../lib/api-fetch';
import { teamKeys } from './teams';

const fetchThresholds = (teamId: string) =>
  apiFetch(pathTo('thresholds', { teamId }), TeamThresholds);
const saveThresholds = (teamId: string, input: ThresholdsInput, version?: number) =>
  apiFetch(pathTo('thresholds', { teamId }), TeamThresholds, {
    method: 'PUT',
    json: input,
    version,
  });

export const thresholdQueries = {
  team: (teamId: string) =>
    queryOptions({ queryKey: teamKeys.thresholds(teamId), queryFn: () => fetchThresholds(teamId) }),
};

export const useThresholds = (teamId: string) => useQuery(thresholdQueries.team(teamId));

export function useSaveThresholds(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    /** `version`: the one the editor started from; the server answers 412 if it is stale. */
    mutationFn: ({ input, version }: { input: ThresholdsInput; version?: number }) =>
      saveThresholds(teamId, input, version),
    onSuccess: (saved) => {
      queryClient.setQueryData(teamKeys.thresholds(teamId), saved);
      return queryClient.invalidateQueries({ queryKey: teamKeys.thresholds(teamId) });
    },
  });
}

/** Take the team's thresholds as the server holds them now (after someone else saved first). */
export function useReloadThresholds(teamId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.refetchQueries({ queryKey: teamKeys.thresholds(teamId), exact: true });
}
