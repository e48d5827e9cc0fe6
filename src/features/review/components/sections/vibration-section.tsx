import { useCallback, useMemo, useState } from 'react';
import type { FlightReport } from '../../../../../shared/schemas/report';
import type { ReviewDetail } from '../../../../../shared/analysis/review-detail';
import {
  distinctLines,
  groupPeaks,
  sameLine,
} from '../../../../../shared/analysis/vibration-groups';
import {
  XY_GRID,
  XyChart,
  type XyMarker,
  type XySeries,
} from '../../../../components/charts/xy-chart';
import { HeatmapChart } from '../../../../components/charts/heatmap-chart';
import { placePeakLabels } from './peak-label-layout';
import { VibrationPeakTable } from './vibration-peak-table';

const axisColour = ['#1f3a4d', '#8a5a2b', '#6b4c7a'];
/** Lines labelled on the spectrum: the loudest distinct ones. */
const MARKED_LINES = 6;
/** Plot width assumed before the chart is measured: a phone's, so labels never start out crowded. */
const NARROW_PLOT_PX = 280;

/** Width of an element as it resizes (0 until measured). */
function useWidth(): [(el: HTMLElement | null) => void, number] {
  const [width, setWidth] = useState(0);
  const ref = useCallback((el: HTMLElement | null) => {
    if (!el || typeof ResizeObserver === 'undefined') return;
    setWidth(el.clientWidth);
    const ro = new ResizeObserver(() => setWidth(el.clientWidth));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return [ref, width];
}

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
  const channels = useMemo(
    () => Object.keys(detail.spectra).filter((c) => c.startsWith(group + '_')),
    [detail.spectra, group],
  );
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
  const unit = group === 'gyro' ? '(deg/s)²/Hz' : 'g²/Hz';
  const rmsUnit = group === 'gyro' ? 'deg/s' : 'g';
  const hz = channels.length ? detail.spectra[channels[0]!]!.hz : [];
  const df = hz.length > 1 ? hz[1]! - hz[0]! : 1;
  const xMin = logF ? df : 0;
  const xMax = hz.length ? hz[hz.length - 1]! : 1;
  const causes = useMemo(
    () =>
      groupPeaks(
        channels.flatMap((c) =>
          (report.vibration[c]?.peaks ?? []).map((p) => ({ ...p, channel: c })),
        ),
        df,
      ),
    [channels, report.vibration, df],
  );
  const [plotRef, boxWidth] = useWidth();
  const markers: XyMarker[] = useMemo(() => {
    // One label per line: the same line on three axes, or named by two causes, is one line.
    const lines: { hz: number; db: number }[] = [];
    for (const l of causes.flatMap((c) => distinctLines(c, df)).sort((a, b) => b.db - a.db))
      if (!lines.some((o) => sameLine(o.hz, l.hz, df))) lines.push(l);
    lines.splice(MARKED_LINES);
    const widthPx = boxWidth > 0 ? boxWidth - XY_GRID.left - XY_GRID.right : NARROW_PLOT_PX;
    return placePeakLabels(lines, { widthPx, xMin, xMax, xLog: logF }).map((l) => ({
      x: l.hz,
      label: l.text ?? '',
      ...(l.row !== null ? { row: l.row } : {}),
    }));
  }, [causes, df, boxWidth, xMin, xMax, logF]);
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
        <span className="num text-xs text-ink-faint" data-testid="band-rms">
          band RMS 50 Hz–Nyquist:{' '}
          {channels
            .map((c) => {
              const v = report.vibration[c]?.bandRms;
              return `${c} ${v === undefined ? '—' : `${v.toFixed(group === 'gyro' ? 1 : 3)} ${rmsUnit}`}`;
            })
            .join(' · ')}
        </span>
      </div>
      {series.length === 0 ? (
        <p className="text-sm text-ink-soft">
          This log has no {group === 'gyro' ? 'gyro' : 'accelerometer'} channels.
        </p>
      ) : (
        <div ref={plotRef}>
          <XyChart
            series={series}
            xName="Hz"
            yName={`PSD, dB re 1 ${unit}`}
            xLog={logF}
            xMin={xMin}
            xMax={xMax}
            markers={markers}
            height={260}
            ariaLabel={`${group} power spectral density per axis`}
          />
        </div>
      )}
      <VibrationPeakTable causes={causes} unit={unit} />
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
