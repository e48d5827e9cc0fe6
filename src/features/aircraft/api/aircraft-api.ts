import { pathTo } from '../../../../shared/api/paths';
import { z } from 'zod';
import {
  Aircraft,
  AircraftList,
  BenchRun,
  BenchRunList,
  ServiceEntry,
  ServiceLog,
  Trends,
  type AircraftInput,
  type AircraftPatch,
  type BenchRunInput,
  type ServiceEntryInput,
} from '../../../../shared/schemas/aircraft';
import { apiFetch } from '../../../lib/api-fetch';

export const fetchTeamAircraft = (teamId: string) =>
  apiFetch(pathTo('teamAircraft', { teamId }), AircraftList);
export const createAircraft = (teamId: string, input: AircraftInput) =>
  apiFetch(pathTo('teamAircraft', { teamId }), Aircraft, { method: 'POST', json: input });
export const fetchAircraft = (id: string) => apiFetch(pathTo('aircraft', { id }), Aircraft);
export const patchAircraft = (id: string, input: AircraftPatch) =>
  apiFetch(pathTo('aircraft', { id }), Aircraft, { method: 'PATCH', json: input });
export const deleteAircraft = (id: string) =>
  apiFetch(pathTo('aircraft', { id }), z.unknown(), { method: 'DELETE' });

export const fetchServiceLog = (id: string) => apiFetch(pathTo('serviceLog', { id }), ServiceLog);
export const addServiceEntry = (id: string, input: ServiceEntryInput) =>
  apiFetch(pathTo('serviceLog', { id }), ServiceEntry, { method: 'POST', json: input });
export const deleteServiceEntry = (id: string, entryId: string) =>
  apiFetch(pathTo('serviceEntry', { id, entryId }), z.unknown(), { method: 'DELETE' });

export const fetchBenchRuns = (id: string) => apiFetch(pathTo('benchRuns', { id }), BenchRunList);
export const addBenchRun = (id: string, input: BenchRunInput) =>
  apiFetch(pathTo('benchRuns', { id }), BenchRun, { method: 'POST', json: input });
export const deleteBenchRun = (id: string, runId: string) =>
  apiFetch(pathTo('benchRun', { id, runId }), z.unknown(), { method: 'DELETE' });

export const fetchTrends = (id: string) => apiFetch(pathTo('trends', { id }), Trends);
