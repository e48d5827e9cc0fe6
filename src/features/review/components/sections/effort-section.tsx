import { useMemo } from 'react';
import type { FlightReport } from '../../../../../shared/analysis/report-schema';
import type { Trace } from '../../../../../shared/analysis/review-detail';
import { TimeChart, type TimeSeries } from '../../../../components/charts/time-chart';
import { inkSeries, motorColor } from '../../../../components/charts/palette';
import type { TimeContext } from './time-context';

export function motorSeries(trace: Trace, motorCount: number): TimeSeries[] {
  const out: TimeSeries[] = [];
  for (let n = 1; n <= motorCount; n++) {
    const data = trace.series[`motor${n}`];
    if (data) out.push({ name: `Motor ${n}`, data, color: motorColor(n) });
  }
  return out;
}

export function EffortSection({
  report,
  effort,
  time,
}: {
  report: FlightReport;
  effort: Trace;
  time: TimeContext;
}) {
  const parts = useMemo(() => {
    const s: TimeSeries[] = [];
    const add = (key: string, name: string, color: string, width?: number) => {
      const data = effort.series[key];
      if (data) s.push({ name, data, color, ...(width ? { width } : {}) });
    };
    add('collective', 'Collective', inkSeries.collective, 1.6);
    add('effort_roll', 'Roll', inkSeries.roll);
    add('effort_pitch', 'Pitch', inkSeries.pitch);
    add('effort_yaw', 'Yaw', inkSeries.yaw);
    return s;
  }, [effort]);
  const motors = useMemo(() => motorSeries(effort, report.motorCount), [effort, report.motorCount]);
  const gaps = report.warnings.filter((w) => /gap/i.test(w));
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h3 className="text-sm font-medium text-ink">Effort the mixer asked for</h3>
        <p className="text-xs text-ink-faint">
          Motor outputs split into collective and the roll, pitch and yaw parts (fractions of full
          output). Hover shaded.
        </p>
        <TimeChart
          t={effort.t}
          series={parts}
          cursorT={time.cursorT}
          onCursor={time.onCursor}
          bands={time.hover}
          group={time.group}
          height={220}
          yName="output"
          ariaLabel="Effort over time"
        />
      </div>
      <div>
        <h3 className="text-sm font-medium text-ink">Motor outputs</h3>
        <TimeChart
          t={effort.t}
          series={motors}
          cursorT={time.cursorT}
          onCursor={time.onCursor}
          bands={time.hover}
          group={time.group}
          height={220}
          yName="output"
          yMin={0}
          yMax={1}
          ariaLabel="Motor outputs over time"
        />
      </div>
      {gaps.length > 0 && (
        <ul className="list-disc pl-5 text-xs text-ink-soft">
          {gaps.map((g) => (
            <li key={g}>{g}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
