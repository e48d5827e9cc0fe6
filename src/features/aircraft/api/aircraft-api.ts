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

const enc = encodeURIComponent;
export const aircraftPaths = {
  teamAircraft: (teamId: string) => `/api/teams/${enc(teamId)}/aircraft`,
  aircraft: (id: string) => `/api/aircraft/${enc(id)}`,
  serviceLog: (id: string) => `/api/aircraft/${enc(id)}/service-log`,
  benchRuns: (id: string) => `/api/aircraft/${enc(id)}/bench-runs`,
  trends: (id: string) => `/api/aircraft/${enc(id)}/trends`,
};

export const fetchTeamAircraft = (teamId: string) =>
  apiFetch(aircraftPaths.teamAircraft(teamId), AircraftList);
export const createAircraft = (teamId: string, input: AircraftInput) =>
  apiFetch(aircraftPaths.teamAircraft(teamId), Aircraft, { method: 'POST', json: input });
export const fetchAircraft = (id: string) => apiFetch(aircraftPaths.aircraft(id), Aircraft);
export const patchAircraft = (id: string, input: AircraftPatch) =>
  apiFetch(aircraftPaths.aircraft(id), Aircraft, { method: 'PATCH', json: input });
export const deleteAircraft = (id: string) =>
  apiFetch(aircraftPaths.aircraft(id), z.unknown(), { method: 'DELETE' });

export const fetchServiceLog = (id: string) => apiFetch(aircraftPaths.serviceLog(id), ServiceLog);
export const addServiceEntry = (id: string, input: ServiceEntryInput) =>
  apiFetch(aircraftPaths.serviceLog(id), ServiceEntry, { method: 'POST', json: input });

export const fetchBenchRuns = (id: string) => apiFetch(aircraftPaths.benchRuns(id), BenchRunList);
export const addBenchRun = (id: string, input: BenchRunInput) =>
  apiFetch(aircraftPaths.benchRuns(id), BenchRun, { method: 'POST', json: input });

export const fetchTrends = (id: string) => apiFetch(aircraftPaths.trends(id), Trends);
