import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { pathTo } from '../../shared/api/paths';
import {
  Aircraft,
  AircraftList,
  type AircraftInput,
  type AircraftPatch,
} from '../../shared/schemas/aircraft';
import { apiFetch } from '../lib/api-fetch';
import { flightKeys } from './flight-keys';

/**
 * A team's aircraft and one aircraft. Every screen that shows an aircraft (fleet, aircraft page,
 * import picker, review) reads it under these keys, so an edit on one shows on all.
 */
export const aircraftKeys = {
  all: ['aircraft'] as const,
  lists: () => [...aircraftKeys.all, 'list'] as const,
  list: (teamId: string) => [...aircraftKeys.lists(), teamId] as const,
  details: () => [...aircraftKeys.all, 'detail'] as const,
  detail: (id: string) => [...aircraftKeys.details(), id] as const,
  serviceLog: (id: string) => [...aircraftKeys.detail(id), 'service-log'] as const,
  benchRuns: (id: string) => [...aircraftKeys.detail(id), 'bench-runs'] as const,
  trends: (id: string) => [...aircraftKeys.detail(id), 'trends'] as const,
};

const fetchTeamAircraft = (teamId: string) =>
  apiFetch(pathTo('teamAircraft', { teamId }), AircraftList);
const fetchAircraft = (id: string) => apiFetch(pathTo('aircraft', { id }), Aircraft);
const createAircraft = (teamId: string, input: AircraftInput) =>
  apiFetch(pathTo('teamAircraft', { teamId }), Aircraft, { method: 'POST', json: input });
const patchAircraft = (id: string, input: AircraftPatch, version?: number) =>
  apiFetch(pathTo('aircraft', { id }), Aircraft, { method: 'PATCH', json: input, version });
const deleteAircraft = (id: string) =>
  apiFetch(pathTo('aircraft', { id }), z.unknown(), { method: 'DELETE' });

export const aircraftQueries = {
  list: (teamId: string) =>
    queryOptions({ queryKey: aircraftKeys.list(teamId), queryFn: () => fetchTeamAircraft(teamId) }),
  detail: (id: string) =>
    queryOptions({ queryKey: aircraftKeys.detail(id), queryFn: () => fetchAircraft(id) }),
};

export const useTeamAircraft = (teamId: string, enabled = true) =>
  useQuery({ ...aircraftQueries.list(teamId), enabled });
export const useAircraft = (id: string, enabled = true) =>
  useQuery({ ...aircraftQueries.detail(id), enabled });

export function useCreateAircraft(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AircraftInput) => createAircraft(teamId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: aircraftKeys.lists() }),
  });
}

/** An edit of the aircraft; `version` is the one the form started from (412 if it is stale). */
export interface AircraftEdit {
  patch: AircraftPatch;
  version?: number;
}

export function useUpdateAircraft(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ patch, version }: AircraftEdit) => patchAircraft(id, patch, version),
    onSuccess: (aircraft) => {
      queryClient.setQueryData(aircraftKeys.detail(id), aircraft);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: aircraftKeys.lists() }),
        // Trends are judged against the airframe, so they change with it.
        queryClient.invalidateQueries({ queryKey: aircraftKeys.trends(id) }),
        // Flight lists carry the aircraft's name.
        queryClient.invalidateQueries({ queryKey: flightKeys.lists() }),
      ]);
    },
  });
}

/** Take the aircraft as the server holds it now (after someone else saved first). */
export function useReloadAircraft(id: string) {
  const queryClient = useQueryClient();
  return () => queryClient.refetchQueries({ queryKey: aircraftKeys.detail(id), exact: true });
}

export function useDeleteAircraft(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteAircraft(id),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: aircraftKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: aircraftKeys.lists() });
    },
  });
}
