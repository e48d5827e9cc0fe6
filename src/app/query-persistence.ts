import { dehydrate, hydrate, type QueryClient } from '@tanstack/react-query';
import { aircraftKeys } from '../api/aircraft';
import { flightKeys } from '../api/flight-keys';
import { mailKeys } from '../api/mail';
import { presetKeys } from '../api/presets';
import { teamKeys } from '../api/teams';

/**
 * Keeps the team's lists across reloads (aircraft, import presets, the fleet's flight lists,
 * members, invites and thresholds), so a pilot who opens the app at the field with no network
 * sees what the team had when last online, and can still pick an aircraft for an import. One
 * flight's review is not kept here: flights read on this device live in IndexedDB.
 */
const KEY = 'hoverprint.query-cache.v1';
/** Key patterns kept; `null` stands for any one part (a team id). */
const kept: readonly (readonly (string | null)[])[] = [
  presetKeys.all,
  // Only the lists: an aircraft's details (service log, trends…) are read fresh.
  aircraftKeys.lists(),
  flightKeys.lists(),
  [...teamKeys.all, 'detail', null, 'members'],
  [...teamKeys.all, 'detail', null, 'invites'],
  [...teamKeys.all, 'detail', null, 'thresholds'],
  mailKeys.available(),
];

export function isKept(queryKey: readonly unknown[]): boolean {
  return kept.some(
    (pattern) =>
      queryKey.length >= pattern.length &&
      pattern.every((part, i) => part === null || queryKey[i] === part),
  );
}

export function restoreQueries(client: QueryClient, storage: Storage = localStorage): void {
  try {
    const raw = storage.getItem(KEY);
    if (raw) hydrate(client, JSON.parse(raw));
    // What was kept is shown at once but read again on first use: a copy saved seconds ago
    // would otherwise count as fresh and hide a change made meanwhile on another device.
    void client.invalidateQueries({ predicate: (q) => isKept(q.queryKey), refetchType: 'none' });
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
