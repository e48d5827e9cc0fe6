import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';

/**
 * The review's shared cursor, kept in the address (`?t=12.34`) so a link — from a comment
 * e-mail, a finding, a colleague — opens the same moment. Seconds from the start of the log.
 */
export function useCursor(durationS: number): [number | null, (tS: number) => void] {
  const [params, setParams] = useSearchParams();
  const raw = params.get('t');
  const t = useMemo(() => {
    if (raw === null) return null;
    const v = Number(raw);
    return Number.isFinite(v) ? Math.min(Math.max(v, 0), Math.max(durationS, 0)) : null;
  }, [raw, durationS]);
  const set = useCallback(
    (tS: number) =>
      setParams(
        (old) => {
          const next = new URLSearchParams(old);
          next.set('t', (Math.round(tS * 1000) / 1000).toString());
          return next;
        },
        { replace: true },
      ),
    [setParams],
  );
  return [t, set];
}

/** Arrow step: a hundredth of the flight, at least one sample of the drawn trace. */
export function cursorStep(durationS: number, fine: boolean): number {
  const step = Math.max(durationS / 100, 0.01);
  return fine ? step / 10 : step;
}
