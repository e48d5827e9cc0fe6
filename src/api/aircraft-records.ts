import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { pathTo } from '../../shared/api/paths';
import {
  BenchRun,
  BenchRunList,
  ServiceEntry,
  ServiceLog,
  Trends,
  type BenchRunInput,
  type ServiceEntryInput,
} from '../../shared/schemas/aircraft';
import { apiFetch } from '../lib/api-fetch';
import { aircraftKeys } from './aircraft';

/** What the crew records about one aircraft: its service log, bench runs and wear trends. */
const fetchServiceLog = (id: string) => apiFetch(pathTo('serviceLog', { id }), ServiceLog);
const addServiceEntry = (id: string, input: ServiceEntryInput) =>
  apiFetch(pathTo('serviceLog', { id }), ServiceEntry, { method: 'POST', json: input });
const deleteServiceEntry = (id: string, entryId: string) =>
  apiFetch(pathTo('serviceEntry', { id, entryId }), z.unknown(), { method: 'DELETE' });

const fetchBenchRuns = (id: string) => apiFetch(pathTo('benchRuns', { id }), BenchRunList);
const addBenchRun = (id: string, input: BenchRunInput) =>
  apiFetch(pathTo('benchRuns', { id }), BenchRun, { method: 'POST', json: input });
const deleteBenchRun = (id: string, runId: string) =>
  apiFetch(pathTo('benchRun', { id, runId }), z.unknown(), { method: 'DELETE' });

const fetchTrends = (id: string) => apiFetch(pathTo('trends', { id }), Trends);

export const aircraftRecordQueries = {
  // Records the crew adds to and corrects from several devices: always ask again when the page
  // opens, so an entry added or deleted elsewhere a moment ago shows.
  serviceLog: (id: string) =>
    queryOptions({
      queryKey: aircraftKeys.serviceLog(id),
      queryFn: () => fetchServiceLog(id),
      staleTime: 0,
    }),
  benchRuns: (id: string) =>
    queryOptions({
      queryKey: aircraftKeys.benchRuns(id),
      queryFn: () => fetchBenchRuns(id),
      staleTime: 0,
    }),
  trends: (id: string) =>
    queryOptions({ queryKey: aircraftKeys.trends(id), queryFn: () => fetchTrends(id) }),
};

export const useServiceLog = (id: string) => useQuery(aircraftRecordQueries.serviceLog(id));
export const useBenchRuns = (id: string) => useQuery(aircraftRecordQueries.benchRuns(id));
export const useTrends = (id: string) => useQuery(aircraftRecordQueries.trends(id));

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
