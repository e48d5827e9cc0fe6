import { queryOptions, useQuery } from '@tanstack/react-query';
import {
  fetchInvites,
  fetchMembers,
  fetchPresets,
  fetchTeam,
  fetchTeams,
  fetchThresholds,
} from './team-api';

export const teamKeys = {
  all: ['teams'] as const,
  list: () => [...teamKeys.all, 'list'] as const,
  detail: (teamId: string) => [...teamKeys.all, 'detail', teamId] as const,
  members: (teamId: string) => [...teamKeys.detail(teamId), 'members'] as const,
  invites: (teamId: string) => [...teamKeys.detail(teamId), 'invites'] as const,
  presets: (teamId: string) => [...teamKeys.detail(teamId), 'presets'] as const,
  thresholds: (teamId: string) => [...teamKeys.detail(teamId), 'thresholds'] as const,
};

export const teamQueries = {
  list: () => queryOptions({ queryKey: teamKeys.list(), queryFn: fetchTeams }),
  detail: (teamId: string) =>
    queryOptions({ queryKey: teamKeys.detail(teamId), queryFn: () => fetchTeam(teamId) }),
  // People join and leave from other browsers: always ask again when the page opens.
  members: (teamId: string) =>
    queryOptions({
      queryKey: teamKeys.members(teamId),
      queryFn: () => fetchMembers(teamId),
      staleTime: 0,
    }),
  invites: (teamId: string) =>
    queryOptions({
      queryKey: teamKeys.invites(teamId),
      queryFn: () => fetchInvites(teamId),
      staleTime: 0,
    }),
  presets: (teamId: string) =>
    queryOptions({ queryKey: teamKeys.presets(teamId), queryFn: () => fetchPresets(teamId) }),
  thresholds: (teamId: string) =>
    queryOptions({ queryKey: teamKeys.thresholds(teamId), queryFn: () => fetchThresholds(teamId) }),
};

export const useTeam = (teamId: string) => useQuery(teamQueries.detail(teamId));
export const useMembers = (teamId: string) => useQuery(teamQueries.members(teamId));
export const useInvites = (teamId: string, enabled = true) =>
  useQuery({ ...teamQueries.invites(teamId), enabled });
export const usePresets = (teamId: string) => useQuery(teamQueries.presets(teamId));
export const useThresholds = (teamId: string) => useQuery(teamQueries.thresholds(teamId));
