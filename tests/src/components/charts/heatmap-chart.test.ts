import { describe, expect, it } from 'vitest';
import * as echarts from 'echarts/core';
import { CustomChart, LineChart } from 'echarts/charts';
import { GridComponent, LegendComponent, VisualMapComponent } from 'echarts/components';
import { SVGRenderer } from 'echarts/renderers';
import { heatmapOption } from '../../../../src/components/charts/heatmap-chart';
import { palette } from '../../../../src/components/ui/palette';
import { outlineFor } from '../../../../src/components/charts/palette';

echarts.use([
  CustomChart,
  LineChart,
  GridComponent,
  LegendComponent,
  VisualMapComponent,
  SVGRenderer,
]);

const ink = palette.ink.DEFAULT;

/** The Campbell diagram's three order lines as the vibration section colours them. */
const option = heatmapOption({
  x: [100, 200, 300],
  y: [4000, 8000],
  z: [
    [-40, -30, -20],
    [-35, -25, -15],
  ],
  xName: 'Hz',
  yName: 'rotor speed, rpm',
  zName: 'dB',
  lines: [
    {
      label: 'rotor 1×',
      points: [
        [4000, 67],
        [8000, 133],
      ],
      color: palette.accent.DEFAULT,
    },
    {
      label: 'rotor 2×',
      points: [
        [4000, 133],
        [8000, 267],
      ],
      color: palette.sev.act,
    },
    {
      label: 'blade pass',
      points: [
        [4000, 133],
        [8000, 267],
      ],
      color: palette.paper.DEFAULT,
    },
    // No colour given: the fourth line takes motor 4's yellow, one of the faint Okabe–Ito colours.
    {
      label: 'motor 4',
      points: [
        [4000, 100],
        [8000, 200],
      ],
    },
  ],
});

/** The legend's circles as echarts draws them, by fill colour. */
function legendCircles(): Map<string, string | null> {
  const chart = echarts.init(null, null, { renderer: 'svg', ssr: true, width: 600, height: 320 });
  chart.setOption(option);
  const svg = chart.renderToSVGString();
  chart.dispose();
  const out = new Map<string, string | null>();
  // Legend circles are the arcs filled with a line's colour; their stroke is the outline.
  for (const [path] of svg.matchAll(/<path d="[^"]*A[^"]*"[^>]*>/g)) {
    const fill = /fill="(#[0-9a-fA-F]{6})"/.exec(path)?.[1]?.toLowerCase();
    if (fill && !out.has(fill)) out.set(fill, /stroke="([^"]+)"/.exec(path)?.[1] ?? null);
  }
  return out;
}

describe('heatmap order lines', () => {
  it('outline the legend circle of a colour that is faint on paper, and only that', () => {
    const circles = legendCircles();
    expect(circles.size).toBe(4);
    // Paper (1:1) and yellow are under 3:1 on paper; the dark red reads at 4.5:1 and more.
    expect(circles.get(palette.paper.DEFAULT)).toBe(ink);
    expect(circles.get('#f0e442')).toBe(ink);
    expect(circles.get(palette.sev.act)).toBeNull();
    // The amber accent reads at 3:1 on paper and white but not on the sunk tone, so it is outlined.
    expect(circles.get(palette.accent.DEFAULT)).toBe(outlineFor(palette.accent.DEFAULT));
  });
});
