import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { FlightListQuery } from '../../../../shared/schemas/flights';
import type { FlightFilter } from '../../../api/flight-list';

const filterKeys = [
  'aircraftId',
  'pilotId',
  'severity',
  'review',
  'openComments',
  'from',
  'to',
] as const;

/** The list filter lives in the address so a filtered view can be bookmarked and shared. */
export function useFilterParams(): [FlightFilter, (next: FlightFilter) => void] {
  const [params, setParams] = useSearchParams();
  const filter = useMemo(() => {
    const raw: Record<string, string> = {};
    for (const k of filterKeys) {
      const v = params.get(k);
      if (v) raw[k] = v;
    }
    // Anything malformed in a hand-edited address is dropped rather than sent.
    const parsed = FlightListQuery.pick({
      aircraftId: true,
      pilotId: true,
      severity: true,
      review: true,
      from: true,
      to: true,
    }).safeParse(raw);
    const f: FlightFilter = parsed.success ? { ...parsed.data } : {};
    if (raw.openComments === 'true' || raw.openComments === 'false')
      f.openComments = raw.openComments;
    return f;
  }, [params]);
  const set = (next: FlightFilter) => {
    const p = new URLSearchParams();
    for (const k of filterKeys) {
      const v = next[k];
      if (v !== undefined && v !== '') p.set(k, String(v));
    }
    setParams(p, { replace: true });
  };
  return [filter, set];
}
