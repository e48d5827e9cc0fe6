import { useMemo } from 'react';
import { inkSeries, seriesMarker } from '../../../components/charts/palette';
import { PaintedChart } from '../../../components/charts/painted-chart';
import { trendAxes } from '../model/trend-axis';

export interface TrendSeries {
  name: string;
  color: string;
  /** [time ms, value or null] per flight, oldest first. */
  points: [number, number | null][];
  dashed?: boolean;
}

export interface TrendEvent {
  /** ms since epoch */
  t: number;
  label: string;
}

/**
 * One quantity across an aircraft's flights on a time axis, with service-log events drawn as
 * vertical lines so a step in the trend can be read against the repair that caused it. The
 * value axis spans at least `minSpan`, so noise between flights does not fill it, and every
 * month the time axis crosses is labelled.
 */
export function TrendChart({
  series,
  yName,
  minSpan,
  events = [],
  marks = [],
  band,
  height = 200,
  ariaLabel,
}: {
  series: TrendSeries[];
  yName: string;
  /** Smallest value-axis span, in the chart's unit. */
  minSpan: number;
  events?: TrendEvent[];
  /** Flights that raised drift against the aircraft's recent flights, drawn as solid lines. */
  marks?: TrendEvent[];
  /** Shaded range, e.g. the watch limits around zero deviation. */
  band?: { from: number; to: number; label: string };
  height?: number;
  ariaLabel: string;
}) {
  const axes = useMemo(() => trendAxes(series, minSpan), [series, minSpan]);
  const option = useMemo(
    () => ({
      animation: false,
      grid: { left: 52, right: 18, top: 44, bottom: 28 },
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
        valueFormatter: (v: unknown) => (typeof v === 'number' ? v.toFixed(2) : '–'),
      },
      xAxis: axes.x,
      yAxis: {
        type: 'value',
        name: yName,
        scale: true,
        min: axes.y?.min,
        max: axes.y?.max,
        nameTextStyle: { fontSize: 10, color: inkSeries.axis, align: 'left' },
        axisLabel: { color: inkSeries.axis, fontSize: 10 },
        splitLine: { lineStyle: { color: inkSeries.grid } },
      },
      series: series.map((s, i) => ({
        type: 'line',
        name: s.name,
        data: s.points,
        connectNulls: false,
        showSymbol: true,
        symbolSize: 5,
        color: s.color,
        ...seriesMarker(s.color),
        lineStyle: { width: 1.4, type: s.dashed ? 'dashed' : 'solid' },
        emphasis: { disabled: true },
        markArea:
          i === 0 && band
            ? {
                silent: true,
                itemStyle: { color: inkSeries.band },
                label: { show: false },
                data: [[{ yAxis: band.from, name: band.label }, { yAxis: band.to }]],
              }
            : undefined,
        markLine:
          i === 0 && events.length + marks.length > 0
            ? {
                symbol: 'none',
                silent: true,
                label: {
                  fontSize: 9,
                  formatter: '{b}',
                  color: inkSeries.axis,
                  position: 'insideEndTop',
                },
                data: [
                  ...events.map((e) => ({
                    xAxis: e.t,
                    name: e.label,
                    lineStyle: { color: inkSeries.cursor, type: 'dotted', width: 1 },
                  })),
                  ...marks.map((m) => ({
                    xAxis: m.t,
                    name: m.label,
                    lineStyle: { color: inkSeries.drift, type: 'solid', width: 1.5 },
                  })),
                ],
              }
            : undefined,
      })),
    }),
    [series, yName, events, marks, band, axes],
  );
  return <PaintedChart option={option} height={height} ariaLabel={ariaLabel} />;
}
