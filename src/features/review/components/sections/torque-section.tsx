import { useMemo } from 'react';
import type { FlightReport } from '../../../../../shared/schemas/report';
import type { Trace } from '../../../../../shared/analysis/review-detail';
import type { Airframe } from '../../../../../shared/schemas/airframe';
import { expectedHoverShares } from '../../../../../shared/airframe/allocation';
import { TimeChart } from '../../../../components/charts/time-chart';
import { inkSeries } from '../../../../components/charts/palette';
import { followReviewTime, type TimeContext } from './time-context';
import { MotorMarker } from '../../../../components/ui/motor-marker';

const pct = (v: number) => `${(v * 100).toFixed(1)} %`;

export function TorqueSection({
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
  const { cwShare, ccwShare, asymmetryPct } = report.torqueSplit;
  const expected = useMemo(() => {
    try {
      const shares = expectedHoverShares(airframe);
      let cw = 0;
      shares.forEach((s, i) => {
        if (airframe.motors[i]?.spin === 'cw') cw += s;
      });
      return { cw, ccw: 1 - cw };
    } catch {
      return null;
    }
  }, [airframe]);
  const yaw = effort.series['effort_yaw'];
  const cwMotors = airframe.motors
    .map((m, i) => ({ m, n: i + 1 }))
    .filter((x) => x.m.spin === 'cw');
  const ccwMotors = airframe.motors
    .map((m, i) => ({ m, n: i + 1 }))
    .filter((x) => x.m.spin === 'ccw');
  const chip = (n: number) => (
    <span key={n} className="inline-flex items-center gap-1">
      <MotorMarker motor={n} />
      {n}
    </span>
  );
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <div
            className="flex h-8 overflow-hidden rounded border border-line"
            role="img"
            aria-label={`Clockwise ${pct(cwShare)}, counter-clockwise ${pct(ccwShare)}`}
          >
            <div
              className="flex items-center justify-center bg-slate-brand text-xs text-paper"
              style={{ width: `${cwShare * 100}%` }}
            >
              cw <span className="num ml-1">{pct(cwShare)}</span>
            </div>
            <div
              className="flex items-center justify-center bg-paper-sunk text-xs text-ink"
              style={{ width: `${ccwShare * 100}%` }}
            >
              ccw <span className="num ml-1">{pct(ccwShare)}</span>
            </div>
          </div>
          {expected && (
            <div className="relative mt-1 h-3">
              <span
                className="absolute -translate-x-1/2 text-[10px] text-ink-faint"
                style={{ left: `${expected.cw * 100}%` }}
              >
                ▲ expected {pct(expected.cw)}
              </span>
            </div>
          )}
        </div>
        <dl className="num grid grid-cols-[auto_auto] gap-x-4 gap-y-1 text-sm">
          <dt className="font-sans text-ink-soft">Asymmetry (cw − ccw)</dt>
          <dd>
            {asymmetryPct >= 0 ? '+' : '−'}
            {Math.abs(asymmetryPct).toFixed(1)} %
          </dd>
          <dt className="font-sans text-ink-soft">Clockwise props</dt>
          <dd className="flex gap-2">{cwMotors.map((x) => chip(x.n))}</dd>
          <dt className="font-sans text-ink-soft">Counter-clockwise props</dt>
          <dd className="flex gap-2">{ccwMotors.map((x) => chip(x.n))}</dd>
        </dl>
      </div>
      <p className="text-sm text-ink-soft">
        {Math.abs(asymmetryPct - (expected ? (expected.cw - expected.ccw) * 100 : 0)) < 2
          ? 'The two spin sets share the hover evenly; yaw torque balances without steady yaw effort.'
          : asymmetryPct > 0
            ? 'The clockwise props carry more than their share: the controller holds a steady yaw correction. Check for mismatched props (pitch, wear) or twisted motor mounts on one spin set.'
            : 'The counter-clockwise props carry more than their share: the controller holds a steady yaw correction. Check for mismatched props (pitch, wear) or twisted motor mounts on one spin set.'}
      </p>
      {yaw && (
        <div>
          <h3 className="text-sm font-medium text-ink">Yaw effort</h3>
          <TimeChart
            t={effort.t}
            series={[{ name: 'Yaw effort', data: yaw, color: inkSeries.yaw, area: true }]}
            {...followReviewTime(time)}
            height={180}
            yName="output"
            legend={false}
            ariaLabel="Yaw effort over time"
          />
        </div>
      )}
    </div>
  );
}
