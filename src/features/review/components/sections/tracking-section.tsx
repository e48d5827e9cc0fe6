import type { FlightReport } from '../../../../../shared/schemas/report';
import type { ReviewDetail, Trace } from '../../../../../shared/analysis/review-detail';
import { TimeChart } from '../../../../components/charts/time-chart';
import { inkSeries } from '../../../../components/charts/palette';
import { followReviewTime, type TimeContext } from './time-context';
import { StickResponse } from './stick-response';

const axes = [
  { key: 'roll', gyro: 'gyro_x', sp: 'sp_roll', label: 'Roll' },
  { key: 'pitch', gyro: 'gyro_y', sp: 'sp_pitch', label: 'Pitch' },
  { key: 'yaw', gyro: 'gyro_z', sp: 'sp_yaw', label: 'Yaw' },
] as const;

export function TrackingSection({
  report,
  tracking,
  response,
  time,
}: {
  report: FlightReport;
  tracking: Trace | null;
  /** Stick response curves from the review detail; absent in flights stored before them. */
  response?: ReviewDetail['stickResponse'];
  time: TimeContext;
}) {
  const t = report.tracking;
  if (!t || !tracking)
    return (
      <p className="text-sm text-ink-soft">
        This log has no rate setpoints (sp_roll, sp_pitch, sp_yaw), so tracking cannot be measured.
      </p>
    );
  return (
    <div className="flex flex-col gap-4">
      <table className="w-full max-w-md text-sm" aria-label="Tracking per axis">
        <thead>
          <tr className="border-b border-line text-left text-xs uppercase tracking-wide text-ink-faint">
            <th className="py-1 pr-3 font-medium">Axis</th>
            <th className="py-1 pr-3 text-right font-medium">RMS error</th>
            <th className="py-1 pr-3 text-right font-medium">Lag</th>
          </tr>
        </thead>
        <tbody>
          {axes.map((a) => (
            <tr key={a.key} className="border-b border-line/60">
              <td className="py-1 pr-3">{a.label}</td>
              <td className="num py-1 pr-3 text-right">{t[a.key].rmsDegS.toFixed(1)} deg/s</td>
              <td className="num py-1 pr-3 text-right">
                {t[a.key].lagMs === null ? '—' : `${t[a.key].lagMs!.toFixed(1)} ms`}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <StickResponse tracking={t} curves={response} />
      {axes.map((a) => {
        const g = tracking.series[a.gyro];
        const s = tracking.series[a.sp];
        if (!g || !s) return null;
        return (
          <div key={a.key}>
            <h3 className="text-sm font-medium text-ink">{a.label}</h3>
            <TimeChart
              t={tracking.t}
              series={[
                { name: 'Setpoint', data: s, color: inkSeries.setpoint, dashed: true },
                { name: 'Gyro', data: g, color: inkSeries.measured },
              ]}
              {...followReviewTime(time)}
              height={170}
              yName="deg/s"
              ariaLabel={`${a.label} setpoint and gyro over time`}
            />
          </div>
        );
      })}
    </div>
  );
}
