import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pathTo } from '../../shared/api/paths';
import {
  FlightSummary,
  type ReviewRequestInput,
  type ReviewStateInput,
} from '../../shared/schemas/flights';
import { apiFetch } from '../lib/api-fetch';
import { flightKeys } from './flight-keys';
import type { ReviewFlight } from './flights';

/** The pilot asks team members (a coach) to review a flight; they get an e-mail. */
const requestReview = (flightId: string, input: ReviewRequestInput) =>
  apiFetch(pathTo('reviewRequest', { id: flightId }), FlightSummary, {
    method: 'POST',
    json: input,
  });

/** A coach or the owner closes the review, or asks for changes; the pilot gets an e-mail. */
const setReview = (flightId: string, input: ReviewStateInput) =>
  apiFetch(pathTo('review', { id: flightId }), FlightSummary, { method: 'POST', json: input });

/** The fleet's lists and filters and the open review read the new state. */
function useReviewStateChange<I>(
  flightId: string,
  send: (id: string, input: I) => Promise<FlightSummary>,
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: I) => send(flightId, input),
    onSuccess: (summary) => {
      queryClient.setQueryData<ReviewFlight>(flightKeys.detail(flightId), (f) =>
        f ? { ...f, reviewState: summary.reviewState } : f,
      );
      return queryClient.invalidateQueries({ queryKey: flightKeys.lists() });
    },
  });
}

export const useRequestReview = (flightId: string) => useReviewStateChange(flightId, requestReview);
export const useSetReview = (flightId: string) => useReviewStateChange(flightId, setReview);
