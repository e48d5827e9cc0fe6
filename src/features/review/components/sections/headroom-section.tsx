import { Caution } from '../../../../components/ui/caution';
import { useMemo } from 'react';
import type { FlightReport } from '../../../../../shared/schemas/report';
import type { Trace } from '../../../../../shared/analysis/review-detail';
import type { Airframe } from '../../../../../shared/schemas/airframe';
import { TimeChart } from '../../../../components/charts/time-chart';
import { motorSeries, type TimeContext } from './time-context';
import { MotorMarker } from '../../../../components/ui/motor-marker';

export function HeadroomSection({
  report,
  effort,
  airframe,
  time,
}: {
  report: FlightReport;
  effort: Trace;
  airframe: Airframe;
  time: TimeContext;
}) {
  const h = report.headroom;
  const motors = useMemo(() => motorSeries(effort, report.motorCount), [effort, report.motorCount]);
  const events = useMemo(
    () => h.saturationEvents.map((e) => [e.t0, e.t1] as [number, number]),
    [h.saturationEvents],
  );
  return (
    <div className="flex flex-col gap-4">
      <dl className="num grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
        <dt className="font-sans text-ink-soft">Time saturated</dt>
        <dd>{h.saturationS.toFixed(2)} s</dd>
        <dt className="font-sans text-ink-soft">Saturation events</dt>
        <dd>{h.saturationEvents.length}</dd>
        <dt className="font-sans text-ink-soft">ESC peak</dt>
        <dd>{h.escPeakA === null ? 'not logged' : `${h.escPeakA.toFixed(1)} A`}</dd>
        <dt className="font-sans text-ink-soft">Over rating</dt>
        <dd>
          {h.escOverS.toFixed(2)} s
          {airframe.escMaxA !== undefined && (
            <span className="font-sans text-xs text-ink-faint"> (rating {airframe.escMaxA} A)</span>
          )}
        </dd>
      </dl>
      <TimeChart
        t={effort.t}
        series={motors}
        cursorT={time.cursorT}
        onCursor={time.onCursor}
        events={events}
        group={time.group}
        height={220}
        yMin={0}
        yMax={1}
        yName="output"
        ariaLabel="Motor outputs with saturation shaded"
      />
      {h.saturationEvents.length > 0 && (
        <ul className="flex flex-wrap gap-2 text-xs" aria-label="Saturation events">
          {h.saturationEvents.slice(0, 40).map((e, i) => (
            <li key={i}>
              <button
                type="button"
                onClick={() => time.onCursor(e.t0)}
                className="num inline-flex items-center gap-1 rounded border border-line px-2 py-0.5 hover:bg-paper-sunk"
              >
                <MotorMarker motor={e.motor} />
                motor {e.motor} · {e.t0.toFixed(2)}–{e.t1.toFixed(2)} s
              </button>
            </li>
          ))}
        </ul>
      )}
      <Caution title="Motors and ESCs">
        <p>
          A motor pinned at full output has no room left to correct; one pinned at the floor cannot
          slow further. ESC ratings are usually continuous figures with a short burst allowance:
          running over them heats the FETs and can end in a burnt ESC and a fall. Size ESCs with
          margin over the measured peak.
        </p>
      </Caution>
    </div>
  );
}
