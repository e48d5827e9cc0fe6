import { useMemo } from 'react';
import type { FlightReport } from '../../../../../shared/schemas/report';
import type { Trace } from '../../../../../shared/analysis/review-detail';
import { TimeChart } from '../../../../components/charts/time-chart';
import { inkSeries } from '../../../../components/charts/palette';
import { followReviewTime, motorSeries, traceSeries, type TimeContext } from './time-context';

export function EffortSection({
  report,
  effort,
  time,
}: {
  report: FlightReport;
  effort: Trace;
  time: TimeContext;
}) {
  const parts = useMemo(
    () =>
      traceSeries(effort, [
        { key: 'collective', name: 'Collective', color: inkSeries.collective, width: 1.6 },
        { key: 'effort_roll', name: 'Roll', color: inkSeries.roll },
        { key: 'effort_pitch', name: 'Pitch', color: inkSeries.pitch },
        { key: 'effort_yaw', name: 'Yaw', color: inkSeries.yaw },
      ]),
    [effort],
  );
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
          {...followReviewTime(time)}
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
          {...followReviewTime(time)}
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
