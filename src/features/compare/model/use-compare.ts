import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useAircraftFlights } from '../../../api/flight-list';
import { useReviewFlight, type ReviewFlight } from '../../../api/flights';
import { localQueries } from '../../../api/local';
import type { CompareCandidate, CompareFlight } from '../components/compare-panel';

/** "3 Dec 14:05 · file.csv", or the file name alone when the time is unknown. */
export const flightLabel = (f: { recordedAt: string | null; fileName: string }) => {
  const d = f.recordedAt ? new Date(f.recordedAt) : null;
  return d && !Number.isNaN(d.getTime())
    ? `${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short' })} ${d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })} · ${f.fileName}`
    : f.fileName;
};

/**
 * What compare offers beside a flight: other flights of the same aircraft from the team server
 * and from this device (a flight without an aircraft pairs with this device's flights of the
 * assumed airframe with as many motors), and the one picked, kept in the address as `?vs=`.
 */
export function useCompare(flight: ReviewFlight, options: { active: boolean; onServer: boolean }) {
  const { active, onServer } = options;
  const [params, setParams] = useSearchParams();
  const vs = params.get('vs');
  const motorCount = flight.report.motorCount;
  const serverList = useAircraftFlights(
    flight.teamId ?? '',
    flight.aircraftId ?? '',
    active && onServer && flight.aircraftId !== null,
  );
  const localList = useQuery({ ...localQueries.flights(), enabled: active });
  const candidates: CompareCandidate[] = useMemo(() => {
    const seen = new Set<string>([flight.id]);
    const out: CompareCandidate[] = [];
    for (const f of serverList.data?.flights ?? []) {
      if (seen.has(f.id)) continue;
      seen.add(f.id);
      out.push({ id: f.id, label: flightLabel(f) });
    }
    for (const f of localList.data ?? []) {
      if (seen.has(f.id)) continue;
      const same =
        flight.aircraftId !== null
          ? f.aircraftId === flight.aircraftId
          : !f.aircraftId && f.report.motorCount === motorCount;
      if (!same) continue;
      seen.add(f.id);
      out.push({
        id: f.id,
        label: `${flightLabel({ recordedAt: f.recordedAt ?? new Date(f.savedAt).toISOString(), fileName: f.fileName })} (this device)`,
      });
    }
    return out;
  }, [serverList.data, localList.data, flight.id, flight.aircraftId, motorCount]);
  const other = useReviewFlight(vs ?? '', active && vs !== null);
  const pick = (id: string) =>
    setParams(
      (old) => {
        const next = new URLSearchParams(old);
        next.set('vs', id);
        return next;
      },
      { replace: true },
    );
  const otherFlight: CompareFlight | null = other.data
    ? { label: flightLabel(other.data), report: other.data.report, detail: other.data.detail }
    : null;
  return {
    candidates,
    otherId: vs,
    onPick: pick,
    other: otherFlight,
    loading: other.isFetching,
    error: other.isError ? other.error.message : null,
  };
}
