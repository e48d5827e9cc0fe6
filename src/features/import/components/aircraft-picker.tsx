import type { Aircraft } from '../../../../shared/schemas/aircraft';
import { useTeamAircraft } from '../../../api/aircraft';

export interface AircraftPickerProps {
  /** Null when signed out: only the assumed airframe is offered. */
  teamId: string | null;
  value: string;
  onChange: (aircraftId: string, aircraft: Aircraft | null) => void;
}

export const UNKNOWN_AIRCRAFT = '';

/** Which machine flew: a team aircraft (its airframe drives the analysis) or an assumed quad X. */
export function AircraftPicker({ teamId, value, onChange }: AircraftPickerProps) {
  const aircraft = useTeamAircraft(teamId ?? '', teamId !== null);
  const list = aircraft.data?.aircraft ?? [];
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="text-ink-soft">Aircraft</span>
      <select
        className="rounded border border-line-strong bg-paper-raised px-2 py-1.5"
        value={value}
        onChange={(e) =>
          onChange(e.target.value, list.find((a) => a.id === e.target.value) ?? null)
        }
      >
        <option value={UNKNOWN_AIRCRAFT}>Unknown quad X (assumed 5-inch, 4S)</option>
        {list.map((a) => (
          <option key={a.id} value={a.id}>
            {a.name} · {a.airframe.motors.length} motors
          </option>
        ))}
      </select>
      {aircraft.isError && (
        <span className="text-xs text-sev-act">
          Could not load the team&apos;s aircraft: {aircraft.error.message}
        </span>
      )}
      {teamId === null && (
        <span className="text-xs text-ink-faint">
          Sign in to pick one of your team&apos;s aircraft.
        </span>
      )}
    </label>
  );
}
