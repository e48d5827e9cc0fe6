import type { FlightFilter } from '../../../api/flight-list';
import { SEVERITIES } from '../../../../shared/schemas/report';
import { SelectField, TextField } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';

/** Day (YYYY-MM-DD) from the filter's ISO bound, and back: `to` covers the whole day. */
function dayOf(iso?: string): string {
  if (!iso) return '';
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}
const startOfDay = (day: string) => (day ? new Date(`${day}T00:00:00`).toISOString() : undefined);
const endOfDay = (day: string) => (day ? new Date(`${day}T23:59:59.999`).toISOString() : undefined);

export function FlightFilters({
  filter,
  aircraft,
  pilots,
  onChange,
}: {
  filter: FlightFilter;
  aircraft: { id: string; name: string }[];
  pilots: { id: string; name: string }[];
  onChange: (next: FlightFilter) => void;
}) {
  const set = (patch: Partial<FlightFilter>) => onChange({ ...filter, ...patch });
  const active = Object.values(filter).some((v) => v !== undefined && v !== '');
  return (
    <div role="search" aria-label="Filter flights" className="flex flex-wrap items-end gap-3">
      <SelectField
        label="Aircraft"
        className="w-40"
        value={filter.aircraftId ?? ''}
        onChange={(e) => set({ aircraftId: e.target.value || undefined })}
      >
        <option value="">All aircraft</option>
        {aircraft.map((a) => (
          <option key={a.id} value={a.id}>
            {a.name}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Pilot"
        className="w-40"
        value={filter.pilotId ?? ''}
        onChange={(e) => set({ pilotId: e.target.value || undefined })}
      >
        <option value="">Anyone</option>
        {pilots.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Verdict at least"
        className="w-32"
        value={filter.severity ?? ''}
        onChange={(e) =>
          set({ severity: (e.target.value || undefined) as FlightFilter['severity'] })
        }
      >
        <option value="">Any</option>
        {SEVERITIES.map((s) => (
          <option key={s} value={s}>
            {s}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Review"
        className="w-36"
        value={filter.review ?? ''}
        onChange={(e) => set({ review: (e.target.value || undefined) as FlightFilter['review'] })}
      >
        <option value="">Any</option>
        <option value="requested">Review asked</option>
        <option value="changes-requested">Changes asked</option>
        <option value="reviewed">Reviewed</option>
        <option value="none">Not asked</option>
      </SelectField>
      <SelectField
        label="Comments"
        className="w-36"
        value={filter.openComments === undefined ? '' : String(filter.openComments)}
        onChange={(e) =>
          set({
            openComments: e.target.value === '' ? undefined : (e.target.value as 'true' | 'false'),
          })
        }
      >
        <option value="">Any</option>
        <option value="true">Open threads</option>
        <option value="false">No open threads</option>
      </SelectField>
      <TextField
        label="From"
        type="date"
        className="w-36"
        value={dayOf(filter.from)}
        onChange={(e) => set({ from: startOfDay(e.target.value) })}
      />
      <TextField
        label="To"
        type="date"
        className="w-36"
        value={dayOf(filter.to)}
        onChange={(e) => set({ to: endOfDay(e.target.value) })}
      />
      {active && (
        <Button tone="quiet" size="sm" onClick={() => onChange({})}>
          Clear filters
        </Button>
      )}
    </div>
  );
}
