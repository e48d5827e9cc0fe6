import { dehydrate, hydrate, type QueryClient } from '@tanstack/react-query';

/**
 * Keeps the small team lists (teams, aircraft, import presets) across reloads, so a pilot who
 * opens the app at the field with no network can still pick an aircraft for an import. Flights
 * and reviews are not kept here: flights read on this device live in IndexedDB.
 */
const KEY = 'hoverprint.query-cache.v1';
const keptWhole = new Set(['import', 'presets']);
/** Of these only the lists are kept; details (service log, members, trends…) are read fresh. */
const keptLists = new Set(['teams', 'aircraft']);

export function isKept(queryKey: readonly unknown[]): boolean {
  const [root, level] = queryKey;
  if (typeof root !== 'string') return false;
  return keptWhole.has(root) || (keptLists.has(root) && level === 'list');
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

export function forgetPersistedQueries(storage: Storage = localStorage) {
  storage.removeItem(KEY);
}
