import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { BenchRunInput, type BenchRow, type BenchRun } from '../../../../shared/schemas/aircraft';
import { XyChart } from '../../../components/charts/xy-chart';
import { Alert, ErrorNote } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { Empty, Loading } from '../../../components/ui/panel';
import { applyServerError } from '../../../lib/form-errors';
import { useAddBenchRun, useDeleteBenchRun } from '../../../api/aircraft-records';
import { useBenchRuns } from '../../../api/aircraft-records';
import { optionalNumber } from '../model/airframe-form';
import { parseBenchPaste } from '../model/bench-paste';

const benchColors = ['#1f3a4d', '#8a5a2b', '#6b4c7a', '#3f6e8c', '#4a5866', '#b7791f'];
const num = { setValueAs: optionalNumber };

/** Thrust per watt in g/W, when the reading has both current and voltage. */
export function efficiencyGPerW(row: BenchRow): number | null {
  if (!row.currentA || !row.voltageV) return null;
  const watts = row.currentA * row.voltageV;
  return watts > 0 ? row.thrustG / watts : null;
}

function RunTable({ run }: { run: BenchRun }) {
  return (
    <table className="w-full text-xs" aria-label={`Bench run ${run.date} ${run.motor}`}>
      <thead>
        <tr className="border-b border-line text-right text-ink-soft">
          <th className="py-1 pr-2 font-medium">Throttle</th>
          <th className="py-1 pr-2 font-medium">Thrust (g)</th>
          <th className="py-1 pr-2 font-medium">Current (A)</th>
          <th className="py-1 pr-2 font-medium">rpm</th>
          <th className="py-1 pr-2 font-medium">Voltage (V)</th>
          <th className="py-1 pr-2 font-medium">g/W</th>
        </tr>
      </thead>
      <tbody className="num text-right">
        {run.rows.map((r, i) => {
          const eff = efficiencyGPerW(r);
          return (
            <tr key={i} className="border-b border-line/50">
              <td className="py-0.5 pr-2">{(r.throttle * 100).toFixed(0)} %</td>
              <td className="py-0.5 pr-2">{r.thrustG}</td>
              <td className="py-0.5 pr-2">{r.currentA ?? '–'}</td>
              <td className="py-0.5 pr-2">{r.rpm ?? '–'}</td>
              <td className="py-0.5 pr-2">{r.voltageV ?? '–'}</td>
              <td className="py-0.5 pr-2">{eff === null ? '–' : eff.toFixed(2)}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/** Thrust-stand tests of a motor and prop: the table, the curve, and a form to add one. */
export function BenchRunsPanel({ aircraftId, canAdd }: { aircraftId: string; canAdd: boolean }) {
  const runs = useBenchRuns(aircraftId);
  const remove = useDeleteBenchRun(aircraftId);
  return (
    <div className="space-y-5">
      <Caution title="Bench work">
        Take the props off for anything that does not need thrust (motor direction, ESC set-up). On
        a thrust stand, clamp the stand down, stay out of the prop's plane, wear eye protection, and
        use a current-limited supply or a pack you have checked. Keep runs at full throttle short:
        motors and ESCs heat up without airflow.
      </Caution>
      {canAdd && <BenchRunForm aircraftId={aircraftId} />}
      {remove.isError && <ErrorNote error={remove.error} />}
      {runs.isPending ? (
        <Loading what="bench runs" />
      ) : runs.isError ? (
        <ErrorNote error={runs.error} />
      ) : runs.data.runs.length === 0 ? (
        <Empty>No bench runs yet.</Empty>
      ) : (
        <>
          <XyChart
            ariaLabel="Thrust against throttle"
            xName="throttle (0–1)"
            yName="thrust (g)"
            xMin={0}
            xMax={1}
            series={runs.data.runs.map((run, i) => ({
              name: `${run.date} ${run.motor} / ${run.prop}`,
              x: run.rows.map((r) => r.throttle),
              y: run.rows.map((r) => r.thrustG),
              color: benchColors[i % benchColors.length]!,
            }))}
          />
          <ul className="space-y-4">
            {runs.data.runs.map((run) => (
              <li key={run.id} className="rounded border border-line p-3">
                <div className="mb-2 flex items-start justify-between gap-3">
                  <p className="text-sm">
                    <span className="num">{run.date}</span> · <strong>{run.motor}</strong> with{' '}
                    {run.prop}
                    <span className="text-xs text-ink-faint"> · by {run.by.name}</span>
                  </p>
                  {run.canDelete && (
                    <Button
                      size="sm"
                      tone="danger"
                      disabled={remove.isPending}
                      aria-label={`Delete the bench run of ${run.date} (${run.motor} with ${run.prop})`}
                      onClick={() => {
                        if (
                          window.confirm(
                            `Delete the bench run of ${run.date} (${run.motor} with ${run.prop}) and its ${run.rows.length} readings? It cannot be brought back.`,
                          )
                        )
                          remove.mutate(run.id);
                      }}
                    >
                      Delete
                    </Button>
                  )}
                </div>
                {run.note && <p className="mb-2 text-xs text-ink-soft">{run.note}</p>}
                <RunTable run={run} />
              </li>
            ))}
          </ul>
        </>
      )}
    </div>
  );
}

function BenchRunForm({ aircraftId }: { aircraftId: string }) {
  const add = useAddBenchRun(aircraftId);
  const [formError, setFormError] = useState<string | null>(null);
  const [paste, setPaste] = useState('');
  const [pasteError, setPasteError] = useState<string | null>(null);
  const blank = {
    throttle: undefined as unknown as number,
    thrustG: undefined as unknown as number,
  };
  const {
    register,
    control,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(BenchRunInput, plainMessages),
    defaultValues: {
      date: new Date().toISOString().slice(0, 10),
      motor: '',
      prop: '',
      note: '',
      rows: [blank, blank],
    },
  });
  const rows = useFieldArray({ control, name: 'rows' });
  const rowsError = errors.rows?.root?.message ?? errors.rows?.message;

  return (
    <details className="rounded border border-line bg-paper-sunk p-3">
      <summary className="cursor-pointer text-sm font-medium">Add a bench run</summary>
      <form
        noValidate
        aria-label="Add bench run"
        className="mt-3 space-y-3"
        onSubmit={handleSubmit((input) => {
          setFormError(null);
          add.mutate(input, {
            onSuccess: () => reset(),
            onError: (e) =>
              setFormError(
                applyServerError(e, setError, ['date', 'motor', 'prop', 'note', 'rows']),
              ),
          });
        })}
      >
        {formError && <Alert tone="error">{formError}</Alert>}
        <div className="grid gap-3 sm:grid-cols-3">
          <TextField label="Date" type="date" error={errors.date?.message} {...register('date')} />
          <TextField
            label="Motor"
            placeholder="2207 1950kV, motor 3"
            error={errors.motor?.message}
            {...register('motor')}
          />
          <TextField
            label="Prop"
            placeholder="5.1×3.6×3"
            error={errors.prop?.message}
            {...register('prop')}
          />
        </div>
        <TextAreaField
          label="Paste readings (throttle 0–1 or %, thrust g, current A, rpm, voltage V per line)"
          rows={3}
          value={paste}
          error={pasteError ?? undefined}
          onChange={(e) => setPaste(e.target.value)}
        />
        <Button
          size="sm"
          onClick={() => {
            const parsed = parseBenchPaste(paste);
            if (typeof parsed === 'string') setPasteError(parsed);
            else {
              setPasteError(null);
              rows.replace(parsed);
            }
          }}
        >
          Fill table from pasted lines
        </Button>
        <table className="w-full text-xs" aria-label="Readings">
          <thead>
            <tr className="text-left text-ink-soft">
              <th className="pr-2 font-medium">Throttle (0–1)</th>
              <th className="pr-2 font-medium">Thrust (g)</th>
              <th className="pr-2 font-medium">Current (A)</th>
              <th className="pr-2 font-medium">rpm</th>
              <th className="pr-2 font-medium">Voltage (V)</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {rows.fields.map((f, i) => (
              <tr key={f.id}>
                {(['throttle', 'thrustG', 'currentA', 'rpm', 'voltageV'] as const).map((k) => (
                  <td key={k} className="pr-2 pb-1">
                    <input
                      aria-label={`Reading ${i + 1} ${k}`}
                      inputMode="decimal"
                      aria-invalid={errors.rows?.[i]?.[k] ? true : undefined}
                      title={errors.rows?.[i]?.[k]?.message}
                      className={
                        'num w-full rounded border bg-paper-raised px-1.5 py-0.5 ' +
                        (errors.rows?.[i]?.[k] ? 'border-sev-act' : 'border-line')
                      }
                      {...register(`rows.${i}.${k}`, num)}
                    />
                  </td>
                ))}
                <td>
                  <Button
                    size="sm"
                    tone="quiet"
                    aria-label={`Remove reading ${i + 1}`}
                    onClick={() => rows.remove(i)}
                  >
                    ✕
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {rowsError && <Alert tone="error">{rowsError}</Alert>}
        <div className="flex gap-2">
          <Button size="sm" onClick={() => rows.append(blank)}>
            Add reading
          </Button>
          <Button type="submit" tone="primary" disabled={add.isPending}>
            Save bench run
          </Button>
        </div>
        <TextAreaField label="Note" rows={2} error={errors.note?.message} {...register('note')} />
      </form>
    </details>
  );
}
