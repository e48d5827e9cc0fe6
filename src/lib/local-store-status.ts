import { useLiveQuery } from 'dexie-react-hooks';
import { useSyncExternalStore } from 'react';
import { localDb } from './local-db';
import { storeProblemText } from './store-problem-text';

/**
 * Whether this device's store (IndexedDB through dexie) can be used. Private windows, blocked
 * site data or a full disk make it refuse; the app then works online without it and says why
 * once, calmly, instead of failing the page.
 */

let problem: string | null = null;
let probed = false;
const listeners = new Set<() => void>();

/**
 * Open the store once, on the first question about it. A browser with no IndexedDB at all
 * leaves dexie's live queries waiting rather than failing, so they cannot be the only test.
 */
function probeOnce(): void {
  if (probed) return;
  probed = true;
  localDb()
    .open()
    .catch((error: unknown) => reportLocalStoreProblem(error));
}

/** Note that the store failed; the first reason is the one shown. */
export function reportLocalStoreProblem(error: unknown): void {
  if (problem !== null) return;
  problem = storeProblemText(error);
  for (const listener of listeners) listener();
}

/** The reason the store cannot be used, or null while it works. */
export function useLocalStoreProblem(): string | null {
  return useSyncExternalStore(
    (onChange) => {
      probeOnce();
      listeners.add(onChange);
      return () => listeners.delete(onChange);
    },
    () => problem,
    () => null,
  );
}

/** For tests: forget a reported problem. */
export function resetLocalStoreProblem(): void {
  problem = null;
  probed = false;
  for (const listener of listeners) listener();
}

/**
 * dexie's live query, except that a store which cannot be opened or read gives `fallback` and
 * is reported, instead of throwing into the error boundary (useLiveQuery rethrows). A fallback
 * of undefined reads as "not known".
 */
export function useLocalLiveQuery<T>(
  querier: () => Promise<T>,
  deps: unknown[],
  fallback: T | undefined,
): T | undefined {
  const known = useLocalStoreProblem();
  const result = useLiveQuery<T | undefined>(async () => {
    if (known !== null) return fallback;
    try {
      return await querier();
    } catch (error) {
      reportLocalStoreProblem(error);
      return fallback;
    }
  }, [...deps, known]);
  return known !== null ? fallback : result;
}
