import type { Severity } from '../../shared/schemas/report';
import type { ReviewState } from '../../shared/schemas/flights';

/** Filters a person sets on a team's flight list, as query-string values (see FlightListQuery). */
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

/**
 * Keys of the team's flights: the lists (fleet, awaiting review, compare candidates) and one
 * flight as the review reads it. Kept apart from the fetchers so aircraft and comments can
 * invalidate flights without importing them.
 */
export const flightKeys = {
  all: ['flights'] as const,
  lists: () => [...flightKeys.all, 'list'] as const,
  teamLists: (teamId: string) => [...flightKeys.lists(), teamId] as const,
  list: (teamId: string, filter: FlightFilter) =>
    [...flightKeys.teamLists(teamId), filter] as const,
  awaiting: (teamId: string) => [...flightKeys.teamLists(teamId), 'awaiting-review'] as const,
  ofAircraft: (teamId: string, aircraftId: string) =>
    [...flightKeys.teamLists(teamId), 'aircraft', aircraftId] as const,
  details: () => [...flightKeys.all, 'detail'] as const,
  detail: (id: string) => [...flightKeys.details(), id] as const,
};
