import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { pathTo } from '../../shared/api/paths';
import {
  Preset,
  PresetList,
  type PresetInput,
  type PresetPatch,
} from '../../shared/schemas/presets';
import { apiFetch } from '../lib/api-fetch';

/** A team's import presets (saved column maps): the team page, the import and the review read them. */
export const presetKeys = {
  all: ['presets'] as const,
  team: (teamId: string) => [...presetKeys.all, teamId] as const,
};

export const fetchPresets = (teamId: string) => apiFetch(pathTo('presets', { teamId }), PresetList);
const createPreset = (teamId: string, input: PresetInput) =>
  apiFetch(pathTo('presets', { teamId }), Preset, { method: 'POST', json: input });
const patchPreset = (id: string, patch: PresetPatch, version?: number) =>
  apiFetch(pathTo('preset', { id }), Preset, { method: 'PATCH', json: patch, version });
const deletePreset = (id: string) =>
  apiFetch(pathTo('preset', { id }), z.unknown(), { method: 'DELETE' });

export const presetQueries = {
  team: (teamId: string) =>
    queryOptions({ queryKey: presetKeys.team(teamId), queryFn: () => fetchPresets(teamId) }),
};

export const usePresets = (teamId: string, enabled = true) =>
  useQuery({ ...presetQueries.team(teamId), enabled });

export function useSavePreset(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PresetInput) => createPreset(teamId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: presetKeys.team(teamId) }),
  });
}

/** Rename or remap a preset; `version` is the one the editor started from (412 if stale). */
export function useUpdatePreset(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch, version }: { id: string; patch: PresetPatch; version?: number }) =>
      patchPreset(id, patch, version),
    onSettled: () => queryClient.invalidateQueries({ queryKey: presetKeys.team(teamId) }),
  });
}

/** Take the team's presets as the server holds them now. */
export function useReloadPresets(teamId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.refetchQueries({ queryKey: presetKeys.team(teamId), exact: true });
}

export function useDeletePreset(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deletePreset(id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: presetKeys.team(teamId) }),
  });
}
