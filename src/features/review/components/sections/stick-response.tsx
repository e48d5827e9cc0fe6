import { useMemo } from 'react';
import type { FlightReport } from '../../../../../shared/schemas/report';
import type { ResponseCurve } from '../../../../../shared/analysis/review-detail';
import { USABLE_COHERENCE } from '../../../../../shared/analysis/stick-response';
import { PaintedChart } from '../../../../components/charts/painted-chart';
import { inkSeries } from '../../../../components/charts/palette';

type Axis = 'roll' | 'pitch' | 'yaw';
type Curves = Partial<Record<Axis, ResponseCurve | null>>;
type AxisFigures = NonNullable<FlightReport['tracking']>[Axis];

const AXES: { key: Axis; label: string }[] = [
  { key: 'roll', label: 'Roll' },
  { key: 'pitch', label: 'Pitch' },
  { key: 'yaw', label: 'Yaw' },
];

const fmt = (v: number | null | undefined, digits: number, unit: string) =>
  v === null || v === undefined ? null : `${v.toFixed(digits)} ${unit}`;

/** The three figures of one axis in words, for the table and the chart's text alternative. */
export function axisFigures(t: AxisFigures): string {
  if (t.peakGainDb === null || t.peakGainDb === undefined)
    return 'too little stick movement to read';
  const bw = fmt(t.bandwidthHz, 1, 'Hz');
  return [
    bw ? `bandwidth ${bw}` : 'bandwidth beyond what the sticks reached',
    `peak gain ${fmt(t.peakGainDb, 1, 'dB')}`,
    `phase delay ${fmt(t.phaseDelayMs, 1, 'ms') ?? 'unread'}`,
  ].join(', ');
}

/** [x, y] pairs, y null where the bin is not drawn (unreadable, or faded out). */
function pairs(c: ResponseCurve, y: number[], keep: (i: number) => boolean) {
  return c.hz.map((hz, i) => [hz, keep(i) ? y[i]! : null] as [number, number | null]);
}

function responseOption(curves: Curves) {
  const series: object[] = [];
  for (const { key, label } of AXES) {
    const c = curves[key];
    if (!c) continue;
    const color = inkSeries[key];
    const readable = (i: number) => c.coherence[i]! >= USABLE_COHERENCE;
    for (const [axisIndex, y] of [
      [0, c.gainDb],
      [1, c.phaseDeg],
    ] as const) {
      const base = {
        type: 'line',
        xAxisIndex: axisIndex,
        yAxisIndex: axisIndex,
        showSymbol: false,
        color,
        emphasis: { disabled: true },
      };
      // The whole curve faint, and over it the bins whose coherence makes them readable.
      series.push({
        ...base,
        name: `${label} (low coherence)`,
        data: pairs(c, y, () => true),
        lineStyle: { width: 1, opacity: 0.25 },
        tooltip: { show: false },
      });
      series.push({
        ...base,
        name: label,
        data: pairs(c, y, readable),
        lineStyle: { width: 1.5 },
      });
    }
  }
  const xAxis = (gridIndex: number, name: string) => ({
    type: 'log',
    gridIndex,
    min: 'dataMin',
    max: 'dataMax',
    name,
    nameLocation: 'middle',
    nameGap: 22,
    nameTextStyle: { fontSize: 10, color: inkSeries.axis },
    axisLabel: {
      color: inkSeries.axis,
      fontSize: 10,
      hideOverlap: true,
      formatter: (v: number) => String(Number(v.toPrecision(2))),
    },
    splitLine: { lineStyle: { color: inkSeries.grid } },
  });
  const yAxis = (gridIndex: number, name: string) => ({
    type: 'value',
    gridIndex,
    name,
    nameLocation: 'middle',
    nameGap: 38,
    scale: true,
    nameTextStyle: { fontSize: 10, color: inkSeries.axis },
    axisLabel: { color: inkSeries.axis, fontSize: 10 },
    splitLine: { lineStyle: { color: inkSeries.grid } },
  });
  return {
    animation: false,
    legend: {
      top: 0,
      left: 48,
      itemWidth: 14,
      itemHeight: 3,
      data: AXES.filter((a) => curves[a.key]).map((a) => a.label),
      textStyle: { fontSize: 11, color: inkSeries.axis },
    },
    tooltip: {
      trigger: 'axis',
      textStyle: { fontSize: 11 },
      valueFormatter: (v: unknown) => (typeof v === 'number' ? v.toFixed(1) : String(v)),
    },
    axisPointer: { link: [{ xAxisIndex: 'all' }] },
    grid: [
      { left: 54, right: 14, top: 28, height: '34%' },
      { left: 54, right: 14, bottom: 36, height: '34%' },
    ],
    xAxis: [xAxis(0, ''), xAxis(1, 'Hz')],
    yAxis: [yAxis(0, 'gain dB'), yAxis(1, 'phase °')],
    series,
  };
}

/**
 * Stick response inside Tracking: gain and phase of setpoint → gyro against frequency per axis
 * (bins with low coherence faded, since the sticks said too little there to read them), and
 * bandwidth, peak gain and phase delay as text.
 */
export function StickResponse({
  tracking,
  curves,
}: {
  tracking: NonNullable<FlightReport['tracking']>;
  curves: Curves | null | undefined;
}) {
  const option = useMemo(() => (curves ? responseOption(curves) : null), [curves]);
  const summary = AXES.map((a) => `${a.label}: ${axisFigures(tracking[a.key])}`).join('; ');
  return (
    <div className="flex flex-col gap-2">
      <h3 className="text-sm font-medium text-ink">Stick response</h3>
      <p className="text-xs text-ink-soft">
        How the rate loop follows the sticks across frequency. Bandwidth is where the gain first
        falls 3 dB below its low-frequency level; a peak gain above 0 dB means the aircraft
        overshoots the sticks; phase delay is read at low frequency and should agree with the lag
        above. Faded stretches had too little stick movement to be read.
      </p>
      <table className="w-full max-w-md text-sm" aria-label="Stick response per axis">
        <thead>
          <tr className="border-b border-line text-left text-xs uppercase tracking-wide text-ink-faint">
            <th className="py-1 pr-3 font-medium">Axis</th>
            <th className="py-1 pr-3 text-right font-medium">Bandwidth</th>
            <th className="py-1 pr-3 text-right font-medium">Peak gain</th>
            <th className="py-1 pr-3 text-right font-medium">Phase delay</th>
          </tr>
        </thead>
        <tbody>
          {AXES.map((a) => {
            const t = tracking[a.key];
            const unread = t.peakGainDb === null || t.peakGainDb === undefined;
            return (
              <tr key={a.key} className="border-b border-line/60">
                <td className="py-1 pr-3">{a.label}</td>
                {unread ? (
                  <td colSpan={3} className="py-1 pr-3 text-right text-xs text-ink-soft">
                    too little stick movement
                  </td>
                ) : (
                  <>
                    <td className="num py-1 pr-3 text-right">
                      {fmt(t.bandwidthHz, 1, 'Hz') ?? 'beyond input'}
                    </td>
                    <td className="num py-1 pr-3 text-right">{fmt(t.peakGainDb, 1, 'dB')}</td>
                    <td className="num py-1 pr-3 text-right">
                      {fmt(t.phaseDelayMs, 1, 'ms') ?? '—'}
                    </td>
                  </>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
      {option ? (
        <PaintedChart
          option={option}
          height={300}
          ariaLabel={`Stick response, gain and phase against frequency. ${summary}.`}
        />
      ) : (
        <p className="text-xs text-ink-soft">
          This flight was stored before the Stick response curves were kept; the figures above are
          from its report.
        </p>
      )}
    </div>
  );
}
