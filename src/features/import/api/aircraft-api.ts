import { queryOptions } from '@tanstack/react-query';
import { AircraftList } from '../../../../shared/schemas/aircraft';
import { pathTo } from '../../../../shared/api/paths';
import { apiFetch } from '../../../lib/api-fetch';

export const fetchTeamAircraft = (teamId: string) =>
  apiFetch(pathTo('teamAircraft', { teamId }), AircraftList);

export const importAircraftKeys = {
  all: ['import', 'aircraft'] as const,
  team: (teamId: string) => [...importAircraftKeys.all, teamId] as const,
};

export const importAircraftQueries = {
  team: (teamId: string) =>
    queryOptions({
      queryKey: importAircraftKeys.team(teamId),
      queryFn: () => fetchTeamAircraft(teamId),
    }),
};
