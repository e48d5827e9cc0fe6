import { useEffect, useState } from 'react';

/**
 * False on the first render, true once the browser has painted it. Charts wait for this so the
 * page's text (the verdict) paints in one task and each chart builds in a task of its own,
 * keeping every main-thread task short (tests/bench/README.md: none over 100 ms).
 */
export function useAfterPaint(): boolean {
  const [ready, setReady] = useState(false);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const frame = requestAnimationFrame(() => {
      timer = setTimeout(() => setReady(true), 0);
    });
    return () => {
      cancelAnimationFrame(frame);
      if (timer !== undefined) clearTimeout(timer);
    };
  }, []);
  return ready;
}
