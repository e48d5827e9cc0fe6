import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { TeamThresholds, type ThresholdsInput } from '../../shared/schemas/thresholds';
import { apiFetch } from '../lib/api-fetch';
import { teamKeys } from './teams';

const fetchThresholds = (teamId: string) =>
  apiFetch(pathTo('thresholds', { teamId }), TeamThresholds);
const saveThresholds = (teamId: string, input: ThresholdsInput) =>
  apiFetch(pathTo('thresholds', { teamId }), TeamThresholds, { method: 'PUT', json: input });

export const thresholdQueries = {
  team: (teamId: string) =>
    queryOptions({ queryKey: teamKeys.thresholds(teamId), queryFn: () => fetchThresholds(teamId) }),
};

export const useThresholds = (teamId: string) => useQuery(thresholdQueries.team(teamId));

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
