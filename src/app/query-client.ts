import { onlineManager, QueryClient } from '@tanstack/react-query';
import { ApiError } from '../lib/api-fetch';
import { persistQueries, restoreQueries } from './query-persistence';

// TanStack Query assumes a network at start and only follows the online/offline events after;
// a page opened with no network (a reload at the field) must start paused, not fire requests
// bound to fail. Queries that read this device only say networkMode 'always' (src/api/local.ts).
if (typeof navigator !== 'undefined') onlineManager.setOnline(navigator.onLine);

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      // Kept a day so the lists restored for offline use are not dropped before they are seen.
      gcTime: 24 * 60 * 60 * 1000,
      // A 4xx will not fix itself by asking again; a network blip might.
      retry: (failures, error) =>
        !(error instanceof ApiError && error.status < 500) && failures < 2,
    },
  },
});

if (typeof localStorage !== 'undefined') {
  restoreQueries(queryClient);
  persistQueries(queryClient);
}
