import { startTransition, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import type { Finding } from '../../../../shared/schemas/report';
import type { Airframe } from '../../../../shared/schemas/airframe';
import type { TimePin } from '../../../components/charts/time-chart';
import type { ReviewFlight } from '../../../api/flights';
import { cursorStep } from '../model/use-cursor';
import { drawnAirframe } from '../model/drawn-airframe';
import { useStripTrace } from '../model/use-strip';
import { sections, type SectionId } from '../model/sections';
import { FlightStrip } from './flight-strip';
import { SectionNav } from './section-nav';
import { VerdictList } from './verdict-list';
import { BalanceSection } from './sections/balance-section';
import { EffortSection } from './sections/effort-section';
import { FilterBenchSection } from './sections/filter-bench-section';
import { HeadroomSection } from './sections/headroom-section';
import { PowerSection } from './sections/power-section';
import { TorqueSection } from './sections/torque-section';
import { TrackingSection } from './sections/tracking-section';
import { VibrationSection } from './sections/vibration-section';
import type { TimeContext } from './sections/time-context';
import type { DriftOutcome } from '../../../../shared/analysis/baseline';
import { DriftLine } from './drift-line';
import { withDrift } from '../model/with-drift';

export interface ReviewPageProps {
  flight: ReviewFlight;
  /**
   * Geometry to draw when the flight's detail carries none (flights stored by earlier
   * versions): the aircraft's from the server, or an assumed preset offline.
   */
  airframe: Airframe;
  airframeAssumed: boolean;
  section: SectionId;
  cursorT: number | null;
  onCursor: (tS: number) => void;
  pins: TimePin[];
  onPin: (id: string) => void;
  /** `c` pressed: the comments rail opens its box at the cursor. */
  onCommentAtCursor?: () => void;
  /** The comments rail, composed by the route. */
  rail?: ReactNode;
  /** The compare section's content, composed by the route. */
  compare?: ReactNode;
  /** Sync state line for the header, composed by the route. */
  status?: ReactNode;
  /** The flight against its aircraft's recent flights; null while loading, absent to leave it out. */
  drift?: DriftOutcome | null;
}

function isTyping(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName);
}

export function ReviewPage(props: ReviewPageProps) {
  const {
    flight,
    airframe: fallbackAirframe,
    airframeAssumed: fallbackAssumed,
    section,
    cursorT,
    onCursor,
    pins,
    onPin,
    onCommentAtCursor,
    rail,
    compare,
    status,
    drift,
  } = props;
  const { report, detail } = flight;
  const { airframe, assumed: airframeAssumed } = drawnAirframe(flight, {
    airframe: fallbackAirframe,
    assumed: fallbackAssumed,
  });
  const strip = useStripTrace(flight.id, detail);
  // The verdict paints in the first commit; the section's evidence follows as a transition,
  // which React renders in slices between frames instead of in the verdict's task.
  const [evidenceShown, setEvidenceShown] = useState(false);
  useEffect(() => startTransition(() => setEvidenceShown(true)), []);
  const durationS = report.durationS;
  const time: TimeContext = useMemo(
    () => ({ cursorT, onCursor, group: `flight-${flight.id}`, hover: report.segments.hover }),
    [cursorT, onCursor, flight.id, report.segments.hover],
  );

  // Arrow keys move the cursor, `c` comments at it — anywhere on the page but in a field.
  const keys = useRef({ cursorT, durationS, onCursor, onCommentAtCursor });
  useEffect(() => {
    keys.current = { cursorT, durationS, onCursor, onCommentAtCursor };
  });
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.altKey || e.ctrlKey || e.metaKey || isTyping(e.target)) return;
      const k = keys.current;
      if (e.key === 'ArrowLeft' || e.key === 'ArrowRight') {
        const step = cursorStep(k.durationS, e.shiftKey) * (e.key === 'ArrowLeft' ? -1 : 1);
        const from = k.cursorT ?? 0;
        k.onCursor(Math.min(k.durationS, Math.max(0, from + step)));
        e.preventDefault();
      } else if (e.key === 'c' && k.onCommentAtCursor) {
        k.onCommentAtCursor();
        e.preventDefault();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  const selectFinding = (f: Finding) => {
    if (f.tS !== undefined) onCursor(f.tS);
  };
  const info = sections.find((s) => s.id === section)!;
  const findings = useMemo(() => withDrift(report.findings, drift), [report.findings, drift]);

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
      <div className="flex min-w-0 flex-col gap-4">
        <header className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
          <h1 className="text-2xl font-semibold tracking-tight text-slate-brand">Review</h1>
          <p className="num text-sm text-ink-soft">
            {flight.fileName} · {report.durationS.toFixed(1)} s · {report.sampleRateHz.toFixed(0)}{' '}
            Hz · {report.rows.toLocaleString('en')} rows · {report.motorCount} motors
          </p>
          <p className="text-sm text-ink-soft">
            {flight.aircraftName ?? report.airframe.name}
            {report.airframe.assumed && ' (assumed airframe)'}
          </p>
          {status}
        </header>
        {report.warnings.length > 0 && (
          <details className="rounded border border-line bg-paper-sunk px-3 py-1.5 text-xs text-ink-soft">
            <summary className="cursor-pointer">
              {report.warnings.length} import remark{report.warnings.length === 1 ? '' : 's'}
            </summary>
            <ul className="mt-1 list-disc pl-5">
              {report.warnings.map((w, i) => (
                <li key={i}>{w}</li>
              ))}
            </ul>
          </details>
        )}
        <VerdictList
          flightId={flight.id}
          findings={findings}
          hoverS={report.segments.hoverS}
          onSelect={selectFinding}
          comparedWith={drift !== undefined && <DriftLine outcome={drift} />}
        />
        <FlightStrip effort={detail.effort} strip={strip} time={time} pins={pins} onPin={onPin} />
        <SectionNav flightId={flight.id} current={section} />
        <section aria-labelledby="section-title" className="flex flex-col gap-3">
          <div>
            <h2 id="section-title" className="text-lg font-semibold text-slate-brand">
              {info.label}
            </h2>
            <p className="text-sm text-ink-soft">{info.question}</p>
          </div>
          {!evidenceShown && <div className="h-64" aria-busy="true" />}
          {evidenceShown && section === 'balance' && (
            <BalanceSection
              report={report}
              diagnosis={detail.diagnosis}
              airframe={airframe}
              assumed={airframeAssumed}
            />
          )}
          {evidenceShown && section === 'torque' && (
            <TorqueSection report={report} effort={detail.effort} airframe={airframe} time={time} />
          )}
          {evidenceShown && section === 'effort' && (
            <EffortSection report={report} effort={detail.effort} time={time} />
          )}
          {evidenceShown && section === 'vibration' && (
            <VibrationSection report={report} detail={detail} />
          )}
          {evidenceShown && section === 'filters' && (
            <FilterBenchSection flight={flight} airframe={airframe} />
          )}
          {evidenceShown && section === 'power' && (
            <PowerSection report={report} power={detail.power} time={time} />
          )}
          {evidenceShown && section === 'headroom' && (
            <HeadroomSection
              report={report}
              effort={detail.effort}
              airframe={airframe}
              time={time}
            />
          )}
          {evidenceShown && section === 'tracking' && (
            <TrackingSection
              report={report}
              tracking={detail.tracking}
              response={detail.stickResponse}
              time={time}
            />
          )}
          {evidenceShown && section === 'compare' && compare}
        </section>
      </div>
      {rail && <aside className="flex min-w-0 flex-col gap-4">{rail}</aside>}
    </div>
  );
}
