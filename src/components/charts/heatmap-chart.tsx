import { useMemo } from 'react';
import { PaintedChart } from './painted-chart';
import { inkSeries, motorColor, seriesMarker } from './palette';

export interface HeatmapLine {
  label: string;
  /** [row value, x value] pairs, in the units of the axes. */
  points: [number, number][];
  color?: string;
}

export interface HeatmapChartProps {
  /** Column centres (x axis), e.g. Hz. */
  x: number[];
  /** Row centres (y axis), e.g. rpm or throttle. */
  y: number[];
  /** z[row][col]; NaN cells are left empty. */
  z: number[][];
  xName: string;
  yName: string;
  zName: string;
  lines?: HeatmapLine[];
  height?: number;
  ariaLabel: string;
}

/** Cell edges from centres, so cells tile the plane even when rows are unevenly spaced. */
function edges(centres: number[]): number[] {
  if (centres.length === 0) return [];
  if (centres.length === 1) return [centres[0]! - 0.5, centres[0]! + 0.5];
  const out = [centres[0]! - (centres[1]! - centres[0]!) / 2];
  for (let i = 0; i < centres.length - 1; i++) out.push((centres[i]! + centres[i + 1]!) / 2);
  const n = centres.length;
  out.push(centres[n - 1]! + (centres[n - 1]! - centres[n - 2]!) / 2);
  return out;
}

/**
 * A value axis spanning the cell edges. Edges are fractional; only the round ticks between them
 * are labelled.
 */
function edgeAxis(name: string, nameGap: number, e: number[]) {
  return {
    type: 'value',
    name,
    nameLocation: 'middle',
    nameGap,
    min: e[0],
    max: e[e.length - 1],
    nameTextStyle: { fontSize: 10, color: inkSeries.axis },
    axisLabel: { color: inkSeries.axis, fontSize: 10, showMinLabel: false, showMaxLabel: false },
    splitLine: { show: false },
  };
}

/** The echarts option for the heatmap and its order lines (kept apart so tests can read it). */
export function heatmapOption(props: Omit<HeatmapChartProps, 'height' | 'ariaLabel'>) {
  const { x, y, z, xName, yName, zName, lines } = props;
  const xe = edges(x);
  const ye = edges(y);
  const data: [number, number, number, number, number][] = [];
  let lo = Infinity;
  let hi = -Infinity;
  for (let r = 0; r < y.length; r++) {
    const row = z[r];
    if (!row) continue;
    for (let c = 0; c < x.length; c++) {
      const v = row[c];
      if (v === undefined || !Number.isFinite(v)) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
      data.push([xe[c]!, ye[r]!, xe[c + 1]!, ye[r + 1]!, v]);
    }
  }
  if (!Number.isFinite(lo)) {
    lo = 0;
    hi = 1;
  }
  return {
    animation: false,
    grid: { left: 60, right: 70, top: 24, bottom: 42 },
    tooltip: { show: false },
    visualMap: {
      min: lo,
      max: hi,
      dimension: 4,
      seriesIndex: 0,
      calculable: false,
      orient: 'vertical',
      right: 4,
      top: 24,
      itemHeight: 160,
      text: [zName, ''],
      textStyle: { fontSize: 10, color: inkSeries.axis },
      // Light paper to deep slate: a single-hue ramp reads as "more" without a rainbow.
      inRange: { color: ['#f7f5f0', '#c9d6df', '#6f93aa', '#1f3a4d', '#0d1a24'] },
    },
    xAxis: edgeAxis(xName, 26, xe),
    yAxis: edgeAxis(yName, 46, ye),
    legend: {
      top: 0,
      right: 70,
      textStyle: { fontSize: 11, color: inkSeries.axis },
      data: (lines ?? []).map((l) => l.label),
    },
    series: [
      {
        type: 'custom',
        renderItem: (
          _params: unknown,
          api: {
            value: (i: number) => number;
            coord: (p: [number, number]) => [number, number];
            visual: (k: string) => string;
          },
        ) => {
          const a = api.coord([api.value(0), api.value(1)]);
          const b = api.coord([api.value(2), api.value(3)]);
          return {
            type: 'rect',
            shape: { x: a[0], y: b[1], width: b[0] - a[0] + 0.5, height: a[1] - b[1] + 0.5 },
            style: { fill: api.visual('color') },
          };
        },
        data,
        encode: { x: [0, 2], y: [1, 3] },
        silent: true,
      },
      ...(lines ?? []).map((l, i) => {
        const colour = l.color ?? motorColor(i + 1);
        // The legend draws each line's circle on paper: a faint colour gets the ink outline.
        return {
          type: 'line',
          name: l.label,
          data: l.points.map(([row, hz]) => [hz, row]),
          showSymbol: false,
          color: colour,
          ...seriesMarker(colour),
          lineStyle: { width: 1.5, type: 'dashed' },
          silent: true,
        };
      }),
    ],
  };
}

/**
 * A heatmap on value axes (custom rectangles via a scatter of cells would be heavier): rows and
 * columns are drawn as rectangles between their edges, with order lines laid over it. Used for
 * the Campbell diagram.
 */
export function HeatmapChart(props: HeatmapChartProps) {
  const { x, y, z, xName, yName, zName, lines, height = 300, ariaLabel } = props;
  const option = useMemo(
    () => heatmapOption({ x, y, z, xName, yName, zName, lines }),
    [x, y, z, xName, yName, zName, lines],
  );
  return <PaintedChart option={option} height={height} ariaLabel={ariaLabel} />;
}
