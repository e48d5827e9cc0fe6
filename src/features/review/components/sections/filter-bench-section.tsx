import { Caution } from '../../../../components/ui/caution';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import {
  DEFAULT_LOWPASS_Q,
  DEFAULT_NOTCH_Q,
  FilterSpec,
  type FilterStage,
} from '../../../../../shared/schemas/filters';
import type { FlightReport } from '../../../../../shared/schemas/report';
import type { Airframe } from '../../../../../shared/schemas/airframe';
import { XyChart } from '../../../../components/charts/xy-chart';
import { inkSeries } from '../../../../components/charts/palette';
import type { ReviewFlight } from '../../../../api/flights';
import { localKeys } from '../../../../api/local';
import { runFilterBench } from '../../model/worker-flight';

const kindLabel: Record<FilterStage['kind'], string> = {
  lowpass1: 'Low-pass, 1st order',
  lowpass2: 'Low-pass, biquad',
  notch: 'Notch',
};

interface DraftStage {
  kind: FilterStage['kind'];
  hz: string;
  q: string;
}

function toSpec(stages: DraftStage[]): { spec: FilterSpec | null; problem: string | null } {
  const parsed = FilterSpec.safeParse(
    stages.map((s) => ({
      kind: s.kind,
      hz: Number(s.hz),
      ...(s.kind !== 'lowpass1' && s.q.trim() !== '' ? { q: Number(s.q) } : {}),
    })),
  );
  if (!parsed.success)
    return { spec: null, problem: 'Each stage needs a positive frequency (and Q up to 100).' };
  return { spec: parsed.data, problem: null };
}

/** Starting points built from this flight's own loudest peak, when there is one. */
function starters(report: FlightReport, channel: string): Record<string, DraftStage[]> {
  const top = report.vibration[channel]?.peaks[0];
  const nyq = report.sampleRateHz / 2;
  const lp = Math.round(Math.min(150, nyq * 0.4));
  const out: Record<string, DraftStage[]> = {
    'Low-pass': [{ kind: 'lowpass2', hz: String(lp), q: DEFAULT_LOWPASS_Q.toFixed(3) }],
  };
  if (top) {
    out[`Notch at ${top.hz.toFixed(0)} Hz`] = [
      { kind: 'notch', hz: top.hz.toFixed(1), q: String(DEFAULT_NOTCH_Q) },
    ];
    out['Notch + low-pass'] = [
      { kind: 'notch', hz: top.hz.toFixed(1), q: String(DEFAULT_NOTCH_Q) },
      { kind: 'lowpass1', hz: String(Math.round(Math.min(250, nyq * 0.6))), q: '' },
    ];
  }
  return out;
}

export function FilterBenchSection({
  flight,
  airframe,
}: {
  flight: ReviewFlight;
  airframe: Airframe;
}) {
  const { report } = flight;
  const gyros = ['gyro_x', 'gyro_y', 'gyro_z'].filter((c) => report.channels.includes(c));
  const [channel, setChannel] = useState(gyros[0] ?? 'gyro_x');
  const [stages, setStages] = useState<DraftStage[]>(
    () => starters(report, gyros[0] ?? 'gyro_x')['Low-pass']!,
  );
  const [applied, setApplied] = useState<FilterSpec | null>(() => toSpec(stages).spec);
  const draft = toSpec(stages);

  // The flight and airframe are fixed for a flight id; the worker keys its log by that id.
  // eslint-disable-next-line @tanstack/query/exhaustive-deps
  const bench = useQuery({
    queryKey: localKeys.filterBench(flight.id, channel, applied),
    queryFn: () => runFilterBench(flight, airframe, channel, applied ?? []),
    enabled: applied !== null && gyros.length > 0,
    staleTime: Infinity,
    retry: false,
    // Read on this device; a stored flight's raw log is fetched inside when needed.
    networkMode: 'always',
  });

  if (gyros.length === 0)
    return <p className="text-sm text-ink-soft">This log has no gyro channels to filter.</p>;

  const set = (i: number, patch: Partial<DraftStage>) =>
    setStages((old) => old.map((s, j) => (j === i ? { ...s, ...patch } : s)));
  const r = bench.data;
  const nyq = report.sampleRateHz / 2;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4 text-sm">
        <label className="flex flex-col gap-1">
          <span className="text-ink-soft">Gyro axis</span>
          <select
            value={channel}
            onChange={(e) => setChannel(e.target.value)}
            className="rounded border border-line-strong bg-paper-raised px-2 py-1"
          >
            {gyros.map((g) => (
              <option key={g}>{g}</option>
            ))}
          </select>
        </label>
        <div className="flex flex-wrap gap-1">
          {Object.entries(starters(report, channel)).map(([name, s]) => (
            <button
              key={name}
              type="button"
              onClick={() => setStages(s)}
              className="rounded border border-line px-2 py-1 text-xs text-ink-soft"
            >
              {name}
            </button>
          ))}
        </div>
      </div>
      <form
        className="flex flex-col gap-2"
        aria-label="Filter cascade"
        onSubmit={(e) => {
          e.preventDefault();
          if (draft.spec) setApplied(draft.spec);
        }}
      >
        {stages.map((s, i) => (
          <div key={i} className="flex flex-wrap items-center gap-2 text-sm">
            <span className="num w-5 text-ink-faint">{i + 1}.</span>
            <select
              aria-label={`Stage ${i + 1} kind`}
              value={s.kind}
              onChange={(e) => set(i, { kind: e.target.value as FilterStage['kind'] })}
              className="rounded border border-line-strong bg-paper-raised px-1 py-0.5"
            >
              {(Object.keys(kindLabel) as FilterStage['kind'][]).map((k) => (
                <option key={k} value={k}>
                  {kindLabel[k]}
                </option>
              ))}
            </select>
            <label className="flex items-center gap-1">
              <input
                aria-label={`Stage ${i + 1} frequency, Hz`}
                className="num w-20 rounded border border-line-strong px-1 py-0.5"
                value={s.hz}
                onChange={(e) => set(i, { hz: e.target.value })}
              />
              Hz
            </label>
            {s.kind !== 'lowpass1' && (
              <label className="flex items-center gap-1">
                Q
                <input
                  aria-label={`Stage ${i + 1} Q`}
                  className="num w-16 rounded border border-line-strong px-1 py-0.5"
                  value={s.q}
                  onChange={(e) => set(i, { q: e.target.value })}
                />
              </label>
            )}
            <button
              type="button"
              onClick={() => setStages((old) => old.filter((_, j) => j !== i))}
              className="text-xs text-ink-faint hover:text-ink"
              aria-label={`Remove stage ${i + 1}`}
            >
              remove
            </button>
          </div>
        ))}
        <div className="flex gap-2">
          <button
            type="button"
            onClick={() =>
              setStages((old) => [...old, { kind: 'notch', hz: '200', q: String(DEFAULT_NOTCH_Q) }])
            }
            className="rounded border border-line px-2 py-1 text-xs text-ink-soft"
            disabled={stages.length >= 12}
          >
            Add stage
          </button>
          <button
            type="submit"
            disabled={!draft.spec}
            className="rounded bg-slate-brand px-3 py-1 text-xs font-medium text-paper disabled:opacity-50"
          >
            Apply to this flight
          </button>
        </div>
        {draft.problem && <p className="text-xs text-sev-act">{draft.problem}</p>}
      </form>
      {bench.isPending && applied !== null && (
        <p className="text-sm text-ink-soft">Filtering the gyro in the worker…</p>
      )}
      {bench.isError &&
        (bench.error.name === 'NeedsColumnMapError' ? (
          <div
            role="alert"
            className="rounded border-l-4 border-sev-watch bg-paper-raised px-4 py-3"
          >
            <p className="text-sm font-semibold text-ink">
              This log needs a column map to be read again
            </p>
            <p className="mt-1 text-sm text-ink-soft">
              Its headers are not ours, and no map is kept for this flight nor among the team&apos;s
              import presets. Map its columns once and the filter bench reads it with that map from
              then on.
            </p>
            <Link
              to={`/import?remap=${encodeURIComponent(flight.id)}`}
              className="mt-2 inline-block rounded bg-slate-brand px-3 py-1 text-xs font-medium text-paper"
            >
              Map the columns…
            </Link>
          </div>
        ) : (
          <p role="alert" className="text-sm text-sev-act">
            The filter bench could not run: {bench.error.message}
          </p>
        ))}
      {r && (
        <div className="grid grid-cols-[minmax(0,1fr)] gap-4 lg:grid-cols-2">
          <XyChart
            series={[
              { name: 'Magnitude', x: r.response.hz, y: r.response.magDb, color: inkSeries.after },
            ]}
            xName="Hz"
            yName="dB"
            xLog
            xMax={nyq}
            yMin={-60}
            height={220}
            ariaLabel="Filter magnitude response"
          />
          <XyChart
            series={[
              {
                name: 'Group delay',
                x: r.response.hz,
                y: r.response.groupDelayMs,
                color: inkSeries.pitch,
              },
            ]}
            xName="Hz"
            yName="ms"
            xLog
            xMax={nyq}
            height={220}
            ariaLabel="Filter group delay"
          />
          <div className="lg:col-span-2">
            <XyChart
              series={[
                { name: 'Before', x: r.before.hz, y: r.before.db, color: inkSeries.before },
                { name: 'After', x: r.after.hz, y: r.after.db, color: inkSeries.after },
              ]}
              xName="Hz"
              yName={`${channel} PSD, dB`}
              xLog
              height={240}
              ariaLabel={`${channel} spectrum before and after the filters`}
            />
            <p className="num mt-1 text-xs text-ink-soft">
              delay at 20 Hz ≈ {delayAt(r.response.hz, r.response.groupDelayMs, 20).toFixed(2)} ms ·
              at 80 Hz ≈ {delayAt(r.response.hz, r.response.groupDelayMs, 80).toFixed(2)} ms
            </p>
          </div>
        </div>
      )}
      <Caution title="Filter changes">
        <p>
          A preview on logged data, not a tune. Every millisecond of filter delay is control lag;
          try changes in small steps, with the aircraft restrained or in open space, props off for
          any bench checks.
        </p>
      </Caution>
    </div>
  );
}

/** Linear interpolation of group delay at `hz`, ms. */
function delayAt(hz: number[], ms: number[], at: number): number {
  for (let i = 1; i < hz.length; i++) {
    if (hz[i]! >= at) {
      const a = hz[i - 1]!;
      const b = hz[i]!;
      const w = b === a ? 0 : (at - a) / (b - a);
      return ms[i - 1]! + w * (ms[i]! - ms[i - 1]!);
    }
  }
  return ms[ms.length - 1] ?? NaN;
}
