import { QueryClient } from '@tanstack/react-query';
import { ApiError } from '../lib/api-fetch';

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      // A 4xx will not fix itself by asking again; a network blip might.
      retry: (failures, error) => !(error instanceof ApiError && error.status < 500) && failures < 2,
    },
  },
});
