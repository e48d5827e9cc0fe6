import { useMemo, useState } from 'react';
import type { FlightReport } from '../../../../shared/schemas/report';
import type { ReviewDetail } from '../../../../shared/analysis/review-detail';
import { XyChart } from '../../../components/charts/xy-chart';
import { inkSeries } from '../../../components/charts/palette';
import type { Airframe } from '../../../../shared/schemas/airframe';
import { describeDifferences, describeGeometryChange } from '../model/compare-words';
import { MotorMarker } from '../../../components/ui/motor-marker';
import { DeviationBar } from '../../../components/ui/deviation-bar';

export interface CompareFlight {
  label: string;
  report: FlightReport;
  detail: ReviewDetail;
  /** The aircraft's airframe, for a flight whose detail predates carrying its own. */
  airframe?: Airframe;
}

/** The geometry the flight was judged against: its detail's first, else the aircraft's. */
function judged(f: CompareFlight) {
  const own = f.detail.airframe;
  return {
    airframe: own ?? f.airframe ?? null,
    assumed: own ? f.report.airframe.assumed : false,
  };
}

export interface CompareCandidate {
  id: string;
  label: string;
}

export interface ComparePanelProps {
  current: CompareFlight;
  candidates: CompareCandidate[];
  otherId: string | null;
  onPick: (id: string) => void;
  other: CompareFlight | null;
  loading: boolean;
  error: string | null;
  /** Why there are no candidates, when there are none. */
  emptyReason?: string;
}

/** Signed to one decimal; a value that rounds to zero reads 0.0, never −0.0. */
function signedPct(v: number): string {
  const r = Math.round(v * 10) / 10;
  if (r === 0) return '0.0 %';
  return `${r > 0 ? '+' : '−'}${Math.abs(r).toFixed(1)} %`;
}

function Deviations({ f }: { f: CompareFlight }) {
  const { airframe } = judged(f);
  return (
    <ul className="flex flex-col gap-1">
      {f.report.balance.deviationPct.map((d, i) => {
        return (
          <li key={i} className="flex items-center gap-2 text-sm">
            <MotorMarker motor={i + 1} />
            <span className="w-14">Motor {i + 1}</span>
            <span className="num w-8 text-xs text-ink-faint">
              {airframe?.motors[i]?.spin ?? ''}
            </span>
            <span className="num w-16 text-right">{signedPct(d)}</span>
            <DeviationBar motor={i + 1} pct={d} className="h-2 w-24" />
          </li>
        );
      })}
    </ul>
  );
}

function Column({ f, title }: { f: CompareFlight; title: string }) {
  const t = f.report.torqueSplit;
  const { airframe, assumed } = judged(f);
  return (
    <div className="flex min-w-0 flex-col gap-3 rounded border border-line bg-paper-raised p-3">
      <h3 className="text-sm font-semibold text-ink">
        {title}{' '}
        {f.label.toLowerCase() !== title.toLowerCase() && (
          <span className="num font-normal text-ink-faint">{f.label}</span>
        )}
      </h3>
      <p className="text-xs text-ink-soft">
        Judged against{' '}
        {airframe ? (
          <>
            <span className="font-medium text-ink">{airframe.name}</span>
            {assumed && ' (assumed)'} · {airframe.motors.length} motors, {airframe.prop.diameterIn}″
            props
          </>
        ) : (
          'an airframe this flight does not record'
        )}
      </p>
      <Deviations f={f} />
      <p className="num text-sm">
        <span className="font-sans text-ink-soft">Torque split </span>cw{' '}
        {(t.cwShare * 100).toFixed(1)} % · ccw {(t.ccwShare * 100).toFixed(1)} %
      </p>
      <p className="num text-sm">
        <span className="font-sans text-ink-soft">CG </span>
        {f.report.cg
          ? `x ${f.report.cg.xMm.toFixed(1)} mm, y ${f.report.cg.yMm.toFixed(1)} mm`
          : '—'}
      </p>
    </div>
  );
}

/** This flight against another of the same aircraft: side by side, spectra overlaid, changes in words. */
export function ComparePanel({
  current,
  candidates,
  otherId,
  onPick,
  other,
  loading,
  error,
  emptyReason,
}: ComparePanelProps) {
  const channels = Object.keys(current.detail.spectra);
  const [channel, setChannel] = useState(channels[0] ?? 'gyro_x');
  const sentences = useMemo(() => {
    if (!other) return [];
    const geometry = describeGeometryChange(judged(other), judged(current));
    const lines = describeDifferences(other.report, current.report);
    return geometry ? [geometry, ...lines] : lines;
  }, [other, current]);
  const spectra = useMemo(() => {
    const s = [];
    const a = current.detail.spectra[channel];
    const b = other?.detail.spectra[channel];
    if (b) s.push({ name: `Earlier · ${other!.label}`, x: b.hz, y: b.db, color: inkSeries.before });
    if (a) s.push({ name: `This flight`, x: a.hz, y: a.db, color: inkSeries.after });
    return s;
  }, [current, other, channel]);

  if (candidates.length === 0)
    return (
      <p className="text-sm text-ink-soft">
        {emptyReason ?? 'No other flight of this aircraft to compare with yet.'}
      </p>
    );

  return (
    <div className="flex flex-col gap-4">
      <label className="flex items-center gap-2 text-sm">
        <span className="shrink-0 text-ink-soft">Compare with</span>
        <select
          value={otherId ?? ''}
          onChange={(e) => onPick(e.target.value)}
          className="min-w-0 flex-1 rounded border border-line-strong bg-paper-raised px-2 py-1 sm:flex-none"
        >
          <option value="" disabled>
            pick a flight…
          </option>
          {candidates.map((c) => (
            <option key={c.id} value={c.id}>
              {c.label}
            </option>
          ))}
        </select>
      </label>
      {loading && <p className="text-sm text-ink-soft">Loading the other flight…</p>}
      {error && (
        <p role="alert" className="text-sm text-sev-act">
          {error}
        </p>
      )}
      {other && (
        <>
          <section
            aria-label="What changed"
            className="rounded border-l-4 border-accent bg-paper-raised px-4 py-3"
          >
            <h3 className="text-sm font-semibold text-ink">What changed since {other.label}</h3>
            <ul className="mt-1 list-disc pl-5 text-sm text-ink-soft">
              {sentences.map((s) => (
                <li key={s}>{s}</li>
              ))}
            </ul>
          </section>
          <div className="grid grid-cols-[minmax(0,1fr)] gap-3 md:grid-cols-2">
            <Column f={other} title="Earlier" />
            <Column f={current} title="This flight" />
          </div>
          <div>
            <label className="flex items-center gap-2 text-sm">
              <span className="text-ink-soft">Spectrum of</span>
              <select
                value={channel}
                onChange={(e) => setChannel(e.target.value)}
                className="rounded border border-line-strong bg-paper-raised px-2 py-1"
              >
                {channels.map((c) => (
                  <option key={c}>{c}</option>
                ))}
              </select>
            </label>
            <XyChart
              series={spectra}
              xName="Hz"
              yName="PSD, dB"
              xLog
              height={240}
              ariaLabel={`${channel} spectra of both flights`}
            />
          </div>
        </>
      )}
    </div>
  );
}
