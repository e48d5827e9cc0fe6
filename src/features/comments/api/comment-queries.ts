import { queryOptions } from '@tanstack/react-query';
import { fetchComments, fetchMembers } from './comments-api';

export const commentKeys = {
  all: ['comments'] as const,
  flights: () => [...commentKeys.all, 'flight'] as const,
  flight: (flightId: string) => [...commentKeys.flights(), flightId] as const,
  members: (teamId: string) => [...commentKeys.all, 'members', teamId] as const,
};

export const commentQueries = {
  flight: (flightId: string) =>
    queryOptions({
      queryKey: commentKeys.flight(flightId),
      queryFn: () => fetchComments(flightId),
      staleTime: 10_000,
    }),
  members: (teamId: string) =>
    queryOptions({
      queryKey: commentKeys.members(teamId),
      queryFn: () => fetchMembers(teamId),
      staleTime: 5 * 60_000,
    }),
};
