import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  AircraftInput,
  AircraftPatch,
  BenchRunInput,
  ServiceEntryInput,
} from '../../../../shared/schemas/aircraft';
import {
  addBenchRun,
  addServiceEntry,
  createAircraft,
  deleteAircraft,
  deleteBenchRun,
  deleteServiceEntry,
  patchAircraft,
} from './aircraft-api';
import { aircraftKeys } from './aircraft-queries';

export function useCreateAircraft(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AircraftInput) => createAircraft(teamId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: aircraftKeys.lists() }),
  });
}

export function useUpdateAircraft(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AircraftPatch) => patchAircraft(id, input),
    onSuccess: (aircraft) => {
      queryClient.setQueryData(aircraftKeys.detail(id), aircraft);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: aircraftKeys.lists() }),
        // Trends are judged against the airframe, so they change with it.
        queryClient.invalidateQueries({ queryKey: aircraftKeys.trends(id) }),
      ]);
    },
  });
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

export function useAddServiceEntry(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ServiceEntryInput) => addServiceEntry(id, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: aircraftKeys.serviceLog(id) }),
  });
}

export function useDeleteServiceEntry(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (entryId: string) => deleteServiceEntry(id, entryId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: aircraftKeys.serviceLog(id) }),
  });
}

export function useAddBenchRun(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BenchRunInput) => addBenchRun(id, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: aircraftKeys.benchRuns(id) }),
  });
}

export function useDeleteBenchRun(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (runId: string) => deleteBenchRun(id, runId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: aircraftKeys.benchRuns(id) }),
  });
}
