import { dehydrate, hydrate, type QueryClient } from '@tanstack/react-query';
import { aircraftKeys } from '../api/aircraft';
import { presetKeys } from '../api/presets';

/**
 * Keeps the small team lists (aircraft, import presets) across reloads, so a pilot who opens
 * the app at the field with no network can still pick an aircraft for an import. Flights and
 * reviews are not kept here: flights read on this device live in IndexedDB.
 */
const KEY = 'hoverprint.query-cache.v1';
/** Kept whole, or (aircraft) only the lists: details (service log, trends…) are read fresh. */
const kept: readonly (readonly string[])[] = [presetKeys.all, aircraftKeys.lists()];

export function isKept(queryKey: readonly unknown[]): boolean {
  return kept.some((prefix) => prefix.every((part, i) => queryKey[i] === part));
}

export function restoreQueries(client: QueryClient, storage: Storage = localStorage): void {
  try {
    const raw = storage.getItem(KEY);
    if (raw) hydrate(client, JSON.parse(raw));
  } catch {
    storage.removeItem(KEY); // unreadable: start empty rather than fail to start
  }
}

/** Write the kept queries at most once a second after they change; returns the unsubscribe. */
export function persistQueries(
  client: QueryClient,
  storage: Storage = localStorage,
  delayMs = 1000,
) {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const save = () => {
    timer = undefined;
    const state = dehydrate(client, {
      shouldDehydrateQuery: (q) => q.state.status === 'success' && isKept(q.queryKey),
    });
    try {
      storage.setItem(KEY, JSON.stringify(state));
    } catch {
      // storage full or blocked: the lists are fetched again when online
    }
  };
  const unsubscribe = client.getQueryCache().subscribe((event) => {
    if (!isKept(event.query.queryKey)) return;
    timer ??= setTimeout(save, delayMs);
  });
  return () => {
    unsubscribe();
    if (timer) {
      clearTimeout(timer);
      save();
    }
  };
}
