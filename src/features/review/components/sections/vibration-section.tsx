import { useMemo, useState } from 'react';
import type { FlightReport, PeakLabel } from '../../../../../shared/schemas/report';
import type { ReviewDetail } from '../../../../../shared/analysis/review-detail';
import { XyChart, type XySeries } from '../../../../components/charts/xy-chart';
import { HeatmapChart } from '../../../../components/charts/heatmap-chart';
import { MotorMarker } from '../../../../components/ui/motor-marker';

const axisColour = ['#1f3a4d', '#8a5a2b', '#6b4c7a'];

export const peakLabelText: Record<Exclude<PeakLabel, null>, string> = {
  'rotor-1x': 'rotor 1× (unbalance, bent shaft or prop)',
  'rotor-2x': 'rotor 2× (prop tracking, loose mount)',
  'blade-pass': 'blade pass (props passing the arms)',
  frame: 'frame (fixed frequency: a structural mode)',
};

type Group = 'gyro' | 'acc';

export function VibrationSection({
  report,
  detail,
}: {
  report: FlightReport;
  detail: ReviewDetail;
}) {
  const [group, setGroup] = useState<Group>('gyro');
  const [logF, setLogF] = useState(true);
  const channels = Object.keys(detail.spectra).filter((c) => c.startsWith(group + '_'));
  const series: XySeries[] = useMemo(
    () =>
      channels.map((c, i) => ({
        name: c,
        x: detail.spectra[c]!.hz,
        y: detail.spectra[c]!.db,
        color: axisColour[i % 3]!,
      })),
    [channels, detail.spectra],
  );
  const peaks = channels.flatMap((c) =>
    (report.vibration[c]?.peaks ?? []).map((p) => ({ ...p, channel: c })),
  );
  peaks.sort((a, b) => b.db - a.db);
  const unit = group === 'gyro' ? '(deg/s)²/Hz' : 'g²/Hz';
  const camp = detail.campbell;
  const lines = useMemo(
    () =>
      camp?.orders.map((o) => ({
        label:
          o.label === 'rotor-1x' ? 'rotor 1×' : o.label === 'rotor-2x' ? 'rotor 2×' : 'blade pass',
        points: o.points,
        color: o.label === 'rotor-1x' ? '#c7771a' : o.label === 'rotor-2x' ? '#a63c35' : '#f7f5f0',
      })) ?? [],
    [camp],
  );
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <fieldset className="flex gap-1" aria-label="Sensor">
          {(['gyro', 'acc'] as const).map((g) => (
            <button
              key={g}
              type="button"
              aria-pressed={group === g}
              onClick={() => setGroup(g)}
              className={
                'rounded px-2 py-0.5 ' +
                (group === g ? 'bg-slate-brand text-paper' : 'border border-line text-ink-soft')
              }
            >
              {g === 'gyro' ? 'Gyro' : 'Accelerometer'}
            </button>
          ))}
        </fieldset>
        <label className="flex items-center gap-1.5 text-ink-soft">
          <input type="checkbox" checked={logF} onChange={(e) => setLogF(e.target.checked)} /> Log
          frequency axis
        </label>
        <span className="num text-xs text-ink-faint">
          band RMS ≥ 50 Hz:{' '}
          {channels
            .map(
              (c) =>
                `${c} ${report.vibration[c]?.bandRms.toFixed(group === 'gyro' ? 1 : 3) ?? '—'}`,
            )
            .join(' · ')}
        </span>
      </div>
      {series.length === 0 ? (
        <p className="text-sm text-ink-soft">
          This log has no {group === 'gyro' ? 'gyro' : 'accelerometer'} channels.
        </p>
      ) : (
        <XyChart
          series={series}
          xName="Hz"
          yName={`PSD, dB ${unit}`}
          xLog={logF}
          markers={peaks.slice(0, 6).map((p) => ({ x: p.hz, label: `${p.hz.toFixed(0)} Hz` }))}
          height={260}
          ariaLabel={`${group} power spectral density per axis`}
        />
      )}
      <table className="w-full text-sm" aria-label="Vibration peaks">
        <thead>
          <tr className="border-b border-line text-left text-xs uppercase tracking-wide text-ink-faint">
            <th className="py-1 pr-3 font-medium">Channel</th>
            <th className="py-1 pr-3 text-right font-medium">Frequency</th>
            <th className="py-1 pr-3 text-right font-medium">Level</th>
            <th className="py-1 pl-4 font-medium">Source</th>
          </tr>
        </thead>
        <tbody>
          {peaks.length === 0 && (
            <tr>
              <td colSpan={4} className="py-2 text-ink-soft">
                No peak stands out of the noise floor.
              </td>
            </tr>
          )}
          {peaks.map((p, i) => (
            <tr key={`${p.channel}-${p.hz}-${i}`} className="border-b border-line/60">
              <td className="num py-1 pr-3">{p.channel}</td>
              <td className="num py-1 pr-3 text-right">{p.hz.toFixed(1)} Hz</td>
              <td className="num py-1 pr-3 text-right">{p.db.toFixed(1)} dB</td>
              <td className="py-1 pl-4 text-ink-soft">
                {p.motor !== undefined && (
                  <span className="mr-1 inline-flex items-center gap-1">
                    <MotorMarker motor={p.motor} />
                    motor {p.motor},
                  </span>
                )}
                {p.label ? peakLabelText[p.label] : 'unlabelled (not tied to rotor speed)'}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <div>
        <h3 className="text-sm font-medium text-ink">Campbell diagram</h3>
        <p className="text-xs text-ink-faint">
          Short-time spectra of {group === 'gyro' ? 'the gyro' : 'the gyro'} binned by{' '}
          {camp?.by === 'rpm' ? 'rotor speed' : 'throttle'}: a peak that follows a dashed order line
          comes from the rotors; a vertical streak at a fixed frequency is the frame.
        </p>
        {camp ? (
          <HeatmapChart
            x={camp.hz}
            y={camp.rows}
            z={camp.db}
            xName="Hz"
            yName={camp.by === 'rpm' ? 'rotor speed, rpm' : 'throttle'}
            zName="dB"
            lines={lines}
            height={320}
            ariaLabel="Campbell diagram"
          />
        ) : (
          <p className="text-sm text-ink-soft">
            Not enough spread in rotor speed or throttle for a Campbell diagram.
          </p>
        )}
      </div>
    </div>
  );
}
