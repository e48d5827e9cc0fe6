import { liveQuery } from 'dexie';
import { useEffect, useState } from 'react';

/**
 * Subscribe to a Dexie query and re-render when the tables it reads change (also from other
 * tabs). `undefined` until the first answer. List what the query closes over in `deps`.
 */
export function useLiveQuery<T>(query: () => Promise<T>, deps: readonly unknown[]): T | undefined {
  const [value, setValue] = useState<T | undefined>(undefined);
  useEffect(() => {
    const subscription = liveQuery(query).subscribe({
      next: setValue,
      error: (error: unknown) => console.error('local database query failed', error),
    });
    return () => subscription.unsubscribe();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, deps);
  return value;
}
