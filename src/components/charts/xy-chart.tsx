import { useMemo } from 'react';
import { PaintedChart } from './painted-chart';
import { inkSeries, seriesMarker } from './palette';

export interface XySeries {
  name: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  color: string;
  dashed?: boolean;
  width?: number;
}

export interface XyMarker {
  x: number;
  /** Empty for a line without a label. */
  label: string;
  color?: string;
  /** Label row above the plot, 0 nearest to it, so close lines' labels can stagger. */
  row?: number;
}

/** Plot margins, px: label layouts need the plot's own width. */
export const XY_GRID = { left: 58, right: 18, top: 30, bottom: 40 } as const;
/** Height of one marker-label row, px. */
const LABEL_ROW_PX = 12;

export interface XyChartProps {
  series: XySeries[];
  xName: string;
  yName: string;
  /** Logarithmic frequency axis; points at x ≤ 0 are dropped since log(0) has no place. */
  xLog?: boolean;
  xMin?: number;
  xMax?: number;
  yMin?: number;
  yMax?: number;
  markers?: XyMarker[];
  height?: number;
  ariaLabel: string;
}

function points(s: XySeries, xLog: boolean): [number, number | null][] {
  const n = Math.min(s.x.length, s.y.length);
  const out: [number, number | null][] = [];
  for (let i = 0; i < n; i++) {
    const x = s.x[i]!;
    if (xLog && !(x > 0)) continue;
    const y = s.y[i]!;
    out.push([x, Number.isFinite(y) ? y : null]);
  }
  return out;
}

/** A plain x–y line chart: spectra, filter responses, voltage against current. */
export function XyChart(props: XyChartProps) {
  const {
    series,
    xName,
    yName,
    xLog = false,
    xMin,
    xMax,
    yMin,
    yMax,
    markers,
    height = 220,
    ariaLabel,
  } = props;
  const labelRows = Math.max(0, ...(markers ?? []).map((m) => m.row ?? 0));
  const option = useMemo(
    () => ({
      animation: false,
      grid: { ...XY_GRID, top: XY_GRID.top + labelRows * LABEL_ROW_PX },
      legend: {
        top: 0,
        left: 48,
        itemWidth: 18,
        itemHeight: 8,
        textStyle: { fontSize: 11, color: inkSeries.axis },
      },
      tooltip: {
        trigger: 'axis',
        textStyle: { fontSize: 11 },
        valueFormatter: (v: unknown) => (typeof v === 'number' ? v.toFixed(2) : String(v)),
      },
      xAxis: {
        type: xLog ? 'log' : 'value',
        name: xName,
        nameLocation: 'middle',
        nameGap: 24,
        nameTextStyle: { fontSize: 10, color: inkSeries.axis },
        // A log axis otherwise widens to whole decades (1 Hz … 10 kHz) and wastes half the width.
        min: xMin ?? (xLog ? 'dataMin' : undefined),
        max: xMax ?? (xLog ? 'dataMax' : undefined),
        // The data-bound ends of a log axis fall between ticks (3.90625 Hz …); three
        // significant figures keep every label short.
        axisLabel: {
          color: inkSeries.axis,
          fontSize: 10,
          hideOverlap: true,
          formatter: (v: number) => String(Number(v.toPrecision(3))),
        },
        splitLine: { lineStyle: { color: inkSeries.grid } },
      },
      yAxis: {
        type: 'value',
        name: yName,
        nameLocation: 'middle',
        nameGap: 40,
        min: yMin,
        max: yMax,
        scale: yMin === undefined,
        nameTextStyle: { fontSize: 10, color: inkSeries.axis },
        axisLabel: { color: inkSeries.axis, fontSize: 10 },
        splitLine: { lineStyle: { color: inkSeries.grid } },
      },
      dataZoom: [{ type: 'inside', xAxisIndex: 0, filterMode: 'none' }],
      series: series.map((s, i) => ({
        type: 'line',
        name: s.name,
        data: points(s, xLog),
        showSymbol: false,
        sampling: 'lttb',
        color: s.color,
        ...seriesMarker(s.color),
        lineStyle: { width: s.width ?? 1.3, type: s.dashed ? 'dashed' : 'solid' },
        emphasis: { disabled: true },
        markLine:
          i === 0 && markers && markers.length > 0
            ? {
                symbol: 'none',
                silent: true,
                animation: false,
                label: { fontSize: 10, formatter: '{b}', color: inkSeries.axis },
                data: markers.map((m) => ({
                  xAxis: m.x,
                  name: m.label,
                  label: { show: m.label !== '', distance: 5 + (m.row ?? 0) * LABEL_ROW_PX },
                  lineStyle: { color: m.color ?? inkSeries.cursor, type: 'dotted', width: 1 },
                })),
              }
            : undefined,
      })),
    }),
    [series, xName, yName, xLog, xMin, xMax, yMin, yMax, markers, labelRows],
  );
  return <PaintedChart option={option} height={height} ariaLabel={ariaLabel} />;
}
