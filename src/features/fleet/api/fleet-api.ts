import { pathTo } from '../../../../shared/api/paths';
import type { Severity } from '../../../../shared/schemas/report';
import { FlightPage, type ReviewState } from '../../../../shared/schemas/flights';
import { apiFetch } from '../../../lib/api-fetch';

/** Filters a person sets on the fleet's flight list, as query-string values (see FlightListQuery). */
export interface FlightFilter {
  aircraftId?: string | undefined;
  pilotId?: string | undefined;
  from?: string | undefined;
  to?: string | undefined;
  openComments?: 'true' | 'false' | undefined;
  severity?: Severity | undefined;
  review?: ReviewState | undefined;
  limit?: number | undefined;
}

export function flightListSearch(filter: FlightFilter, cursor?: string): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filter))
    if (value !== undefined && value !== '') params.set(key, String(value));
  if (cursor) params.set('cursor', cursor);
  const s = params.toString();
  return s ? `?${s}` : '';
}

export const fetchFlightPage = (teamId: string, filter: FlightFilter, cursor?: string) =>
  apiFetch(pathTo('teamFlights', { teamId }) + flightListSearch(filter, cursor), FlightPage);
