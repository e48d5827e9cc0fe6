import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import { FlightSummary, type ReviewRequestInput } from '../../shared/schemas/flights';
import { apiFetch } from '../lib/api-fetch';
import { flightKeys } from './flight-keys';

/** The pilot asks team members (a coach) to review a flight; they get an e-mail. */
const requestReview = (flightId: string, input: ReviewRequestInput) =>
  apiFetch(pathTo('reviewRequest', { id: flightId }), FlightSummary, {
    method: 'POST',
    json: input,
  });

export function useRequestReview(flightId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewRequestInput) => requestReview(flightId, input),
    // The fleet's "Awaiting review" and review filter read the new state.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: flightKeys.lists() }),
  });
}
