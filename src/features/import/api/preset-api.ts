import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { Preset, PresetList, type PresetInput } from '../../../../shared/schemas/presets';
import { pathTo } from '../../../../shared/api/paths';
import { apiFetch } from '../../../lib/api-fetch';

const presetsPath = (teamId: string) => pathTo('presets', { teamId });

export const fetchPresets = (teamId: string) => apiFetch(presetsPath(teamId), PresetList);

export const createPreset = (teamId: string, input: PresetInput) =>
  apiFetch(presetsPath(teamId), Preset, { method: 'POST', json: input });

export const presetKeys = {
  all: ['presets'] as const,
  team: (teamId: string) => [...presetKeys.all, teamId] as const,
};

export const presetQueries = {
  team: (teamId: string) =>
    queryOptions({ queryKey: presetKeys.team(teamId), queryFn: () => fetchPresets(teamId) }),
};

export function useSavePreset(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PresetInput) => createPreset(teamId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: presetKeys.team(teamId) }),
  });
}
