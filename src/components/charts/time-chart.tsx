import { useEffect, useMemo, useRef, useState } from 'react';
import ReactEChartsCore from 'echarts-for-react/esm/core';
import type { EChartsType } from 'echarts/core';
import { echarts } from './echarts';
import { useAfterPaint } from './use-after-paint';
import { inkSeries, seriesMarker } from './palette';

export interface TimeSeries {
  name: string;
  data: ArrayLike<number>;
  color: string;
  width?: number;
  dashed?: boolean;
  /** Draw as a filled area under the line. */
  area?: boolean;
}

export interface TimePin {
  id: string;
  tS: number;
  resolved?: boolean;
}

export interface TimeChartProps {
  /** Seconds from the start of the log, ascending. */
  t: ArrayLike<number>;
  series: TimeSeries[];
  /** Shared cursor, s. */
  cursorT: number | null;
  onCursor?: (tS: number) => void;
  /** Stretches to shade, [t0, t1] in s (hover segments). */
  bands?: [number, number][];
  /** Stretches to mark as events (saturation), drawn in the act colour. */
  events?: [number, number][];
  pins?: TimePin[];
  onPin?: (id: string) => void;
  /** Charts with the same group zoom and pan together. */
  group?: string;
  height?: number;
  yName?: string;
  yMin?: number;
  yMax?: number;
  /** Show the zoom slider under the chart (the flight strip has it; others follow it). */
  slider?: boolean;
  /**
   * Let echarts thin the series to the plot's width (LTTB) on every draw. Off for traces the
   * worker has already thinned, which then cost the page no sampling work at all.
   */
  sampling?: boolean;
  legend?: boolean;
  ariaLabel: string;
}

const CURSOR_ID = 'cursor';

/**
 * Time and value interleaved in one typed array (echarts reads it with two dimensions): one
 * allocation per series instead of a small array per point, so a chart's first build makes
 * little garbage. Non-finite values stay NaN, which echarts draws as a gap in the line.
 */
function interleave(t: ArrayLike<number>, y: ArrayLike<number>): Float64Array {
  const n = Math.min(t.length, y.length);
  const out = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const v = y[i]!;
    out[2 * i] = t[i]!;
    out[2 * i + 1] = Number.isFinite(v) ? v : NaN;
  }
  return out;
}

/**
 * A line chart over flight time that shares the review's cursor: clicking the plot moves the
 * cursor, the cursor is drawn as a vertical line, and charts in one group zoom together.
 * Series use LTTB sampling (unless already thinned) so long traces stay light when zoomed out.
 */
export function TimeChart(props: TimeChartProps) {
  const ready = useAfterPaint();
  const {
    t,
    series,
    cursorT,
    onCursor,
    bands,
    events,
    pins,
    onPin,
    group,
    height = 180,
    yName,
    yMin,
    yMax,
    slider = false,
    sampling = true,
    legend = true,
    ariaLabel,
  } = props;
  const chartRef = useRef<EChartsType | null>(null);
  // Built in two steps, a frame apart: axes and lines first, then legend, tooltip, zoom and
  // marks. A chart's first build runs much of echarts' code for the first time, and in one
  // step it is the longest task of the review's first paint (tests/bench/README.md: none over 100 ms).
  const [complete, setComplete] = useState(false);
  const onCursorRef = useRef(onCursor);
  const onPinRef = useRef(onPin);
  useEffect(() => {
    onCursorRef.current = onCursor;
    onPinRef.current = onPin;
  });

  const t0 = t.length > 0 ? t[0]! : 0;
  const t1 = t.length > 0 ? t[t.length - 1]! : 1;

  const option = useMemo(() => {
    const marks: unknown[] = [];
    if (complete) {
      if (bands && bands.length > 0)
        marks.push({
          type: 'line',
          id: 'bands',
          data: [],
          silent: true,
          markArea: {
            silent: true,
            itemStyle: { color: inkSeries.band },
            data: bands.map(([a, b]) => [{ xAxis: a }, { xAxis: b }]),
          },
        });
      if (events && events.length > 0)
        marks.push({
          type: 'line',
          id: 'events',
          data: [],
          silent: true,
          markArea: {
            silent: true,
            itemStyle: { color: 'rgba(180,68,60,0.16)' },
            data: events.map(([a, b]) => [
              { xAxis: a },
              { xAxis: Math.max(b, a + (t1 - t0) / 400) },
            ]),
          },
        });
      if (pins && pins.length > 0)
        marks.push({
          type: 'scatter',
          id: 'pins',
          name: 'Comments',
          symbol: 'pin',
          symbolSize: 18,
          itemStyle: { color: '#c7771a' },
          data: pins.map((p) => ({
            value: [p.tS, yMax ?? 1],
            id: p.id,
            itemStyle: p.resolved ? { color: '#9aa3ad' } : undefined,
          })),
          z: 10,
          tooltip: { show: false },
        });
    }
    return {
      animation: false,
      grid: { left: 56, right: 16, top: legend ? 28 : 10, bottom: slider ? 52 : 24 },
      legend:
        complete && legend
          ? {
              top: 0,
              right: 16,
              itemWidth: 18,
              itemHeight: 8,
              textStyle: { fontSize: 11, color: inkSeries.axis },
            }
          : undefined,
      tooltip: complete
        ? {
            trigger: 'axis',
            axisPointer: { type: 'line', lineStyle: { color: inkSeries.axis, width: 0.5 } },
            valueFormatter: (v: unknown) => (typeof v === 'number' ? v.toFixed(3) : String(v)),
            textStyle: { fontSize: 11 },
          }
        : undefined,
      xAxis: {
        type: 'value',
        min: t0,
        max: t1,
        axisLabel: {
          formatter: (v: number) => `${v.toFixed(v < 10 ? 1 : 0)} s`,
          color: inkSeries.axis,
          fontSize: 10,
        },
        splitLine: { lineStyle: { color: inkSeries.grid } },
      },
      yAxis: {
        type: 'value',
        name: yName,
        nameLocation: 'middle',
        nameGap: 38,
        nameTextStyle: { fontSize: 10, color: inkSeries.axis },
        min: yMin,
        max: yMax,
        scale: yMin === undefined,
        axisLabel: { color: inkSeries.axis, fontSize: 10 },
        splitLine: { lineStyle: { color: inkSeries.grid } },
      },
      dataZoom: !complete
        ? []
        : [
            { type: 'inside', xAxisIndex: 0, filterMode: 'none' },
            ...(slider
              ? [
                  {
                    type: 'slider',
                    xAxisIndex: 0,
                    height: 18,
                    bottom: 6,
                    filterMode: 'none',
                    showDataShadow: false,
                  },
                ]
              : []),
          ],
      series: [
        ...series.map((s) => ({
          type: 'line',
          name: s.name,
          data: interleave(t, s.data),
          dimensions: ['x', 'y'],
          showSymbol: false,
          sampling: sampling ? 'lttb' : undefined,
          color: s.color,
          ...seriesMarker(s.color),
          lineStyle: { width: s.width ?? 1.2, type: s.dashed ? 'dashed' : 'solid' },
          areaStyle: s.area ? { opacity: 0.12 } : undefined,
          emphasis: { disabled: true },
        })),
        ...marks,
        {
          type: 'line',
          id: CURSOR_ID,
          data: [],
          silent: true,
          markLine: { symbol: 'none', silent: true, animation: false, data: [] },
        },
      ],
    };
  }, [
    t,
    series,
    bands,
    events,
    pins,
    yName,
    yMin,
    yMax,
    slider,
    sampling,
    legend,
    t0,
    t1,
    complete,
  ]);

  // The cursor moves often; update only its mark instead of re-setting every series.
  useEffect(() => {
    const chart = chartRef.current;
    if (!chart) return;
    chart.setOption(
      {
        series: [
          {
            id: CURSOR_ID,
            markLine: {
              symbol: 'none',
              silent: true,
              animation: false,
              lineStyle: { color: inkSeries.cursor, width: 1.5, type: 'solid' },
              label: { show: false },
              data: cursorT === null ? [] : [{ xAxis: cursorT }],
            },
          },
        ],
      },
      // Drawn with the next frame: a synchronous update here would rebuild the whole chart in
      // the caller's task (the first build of a chart is the page's longest).
      { lazyUpdate: true },
    );
  }, [cursorT, option]);

  const onReady = (chart: EChartsType) => {
    chartRef.current = chart;
    // The second step waits until the first has been drawn (its draw runs in the next frame).
    requestAnimationFrame(() => setTimeout(() => setComplete(true), 0));
    if (group) {
      chart.group = group;
      echarts.connect(group);
    }
    chart.getZr().on('click', (e: { offsetX: number; offsetY: number; target?: unknown }) => {
      if (e.target) return; // a pin or other mark was clicked; its own handler acts
      const p = chart.convertFromPixel({ gridIndex: 0 }, [e.offsetX, e.offsetY]) as unknown;
      if (
        !Array.isArray(p) ||
        typeof p[0] !== 'number' ||
        !chart.containPixel({ gridIndex: 0 }, [e.offsetX, e.offsetY])
      )
        return;
      onCursorRef.current?.(Math.min(t1, Math.max(t0, p[0])));
    });
    chart.setOption(
      {
        series: [
          { id: CURSOR_ID, markLine: { data: cursorT === null ? [] : [{ xAxis: cursorT }] } },
        ],
      },
      { lazyUpdate: true },
    );
  };

  const onEvents = useMemo(
    () => ({
      click: (params: { seriesId?: string; data?: { id?: string; value?: [number, number] } }) => {
        if (params.seriesId === 'pins' && params.data?.id) {
          onPinRef.current?.(params.data.id);
          if (params.data.value) onCursorRef.current?.(params.data.value[0]);
        }
      },
    }),
    [],
  );

  return (
    <div role="img" aria-label={ariaLabel}>
      {ready ? (
        <ReactEChartsCore
          echarts={echarts}
          option={option}
          notMerge
          lazyUpdate
          style={{ height, width: '100%' }}
          onChartReady={onReady}
          onEvents={onEvents}
        />
      ) : (
        <div style={{ height, width: '100%' }} />
      )}
    </div>
  );
}
