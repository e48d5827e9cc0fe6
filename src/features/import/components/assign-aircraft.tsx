import { useState } from 'react';
import type { Aircraft } from '../../../../shared/schemas/aircraft';
import { assignLocalFlight } from '../../../lib/local-db';
import { runImport } from '../model/run-import';
import { AircraftPicker, UNKNOWN_AIRCRAFT } from './aircraft-picker';

export interface AssignAircraftProps {
  flightId: string;
  /** The raw log kept on this device, read again with the aircraft's own airframe. */
  file: Blob | null;
  fileName: string;
  teamId: string;
  /** Called once the flight is filed (and re-analysed) so the review can reload it. */
  onDone: () => void;
}

/**
 * A flight imported as "unknown quad X" cannot sync (the team files flights by aircraft) and was
 * judged against an assumed geometry. Picking the aircraft re-reads the kept log with the
 * aircraft's own airframe under the same flight id, then lets the sync send it.
 */
export function AssignAircraft({ flightId, file, fileName, teamId, onDone }: AssignAircraftProps) {
  const [aircraft, setAircraft] = useState<Aircraft | null>(null);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  const save = async () => {
    if (!aircraft) return;
    setBusy(true);
    setProblem(null);
    try {
      if (file) {
        const status = await runImport({
          jobId: `assign-${flightId}`,
          file,
          fileName,
          flightId,
          target: { airframe: aircraft.airframe, teamId, aircraftId: aircraft.id },
          onStatus: () => undefined,
          isCancelled: () => false,
        });
        if (status.kind !== 'done') {
          // The log needed a column map or cannot be read again: file it with the analysis it has.
          await assignLocalFlight(flightId, { teamId, aircraftId: aircraft.id });
          setProblem(
            'Filed under the aircraft, but the log could not be re-read with its airframe; the analysis still assumes a quad X.',
          );
        }
      } else {
        await assignLocalFlight(flightId, { teamId, aircraftId: aircraft.id });
      }
      onDone();
    } catch (e) {
      setProblem(e instanceof Error ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="flex flex-wrap items-end gap-2 rounded border border-accent/50 bg-accent-soft/40 px-3 py-2 text-sm">
      <p className="w-full text-xs text-ink-soft">
        This flight needs an aircraft before it can sync to the team. Pick the aircraft that flew
        it: the log is judged again against that aircraft&apos;s geometry and then sent.
      </p>
      <AircraftPicker
        teamId={teamId}
        value={aircraft?.id ?? UNKNOWN_AIRCRAFT}
        onChange={(_id, a) => setAircraft(a)}
      />
      <button
        type="button"
        disabled={!aircraft || busy}
        onClick={() => void save()}
        className="rounded bg-slate-brand px-3 py-1.5 text-xs font-medium text-paper disabled:opacity-50"
      >
        {busy ? 'Re-analysing…' : 'File under this aircraft'}
      </button>
      {problem && (
        <p role="alert" className="w-full text-xs text-sev-act">
          {problem}
        </p>
      )}
    </div>
  );
}
