import { inkSeries } from '../../../components/charts/palette';

/**
 * Axes for the trend charts. A trend of a few flights whose values differ by noise alone would
 * fill the whole axis and read as a steep change; each metric gets a minimum span instead, and
 * the time axis names every month it crosses.
 */

/** Rounds off binary noise from multiples of a decimal step (0.1 · 3 = 0.30000000000000004). */
const tidy = (v: number) => Number(v.toPrecision(12));

/** A 1, 2 or 5 × 10ⁿ step near `target`. */
function roundStep(target: number): number {
  const p = 10 ** Math.floor(Math.log10(target));
  for (const m of [5, 2, 1]) if (m * p <= target) return m * p;
  return p;
}

/**
 * A value-axis range at least `minSpan` wide, centred on the data and ending on round numbers,
 * or undefined when the data already spans that much (the chart then fits the axis itself) or
 * there is no finite value.
 */
export function trendValueRange(
  values: Iterable<number | null>,
  minSpan: number,
): { min: number; max: number } | undefined {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values)
    if (v !== null && Number.isFinite(v)) {
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  if (!Number.isFinite(lo) || hi - lo >= minSpan) return undefined;
  const mid = (lo + hi) / 2;
  const step = roundStep(minSpan / 4);
  return {
    min: tidy(Math.floor((mid - minSpan / 2) / step) * step),
    max: tidy(Math.ceil((mid + minSpan / 2) / step) * step),
  };
}

/** The start (local midnight on the 1st) of every month after `fromMs` up to `toMs`, ms. */
export function monthStarts(fromMs: number, toMs: number): number[] {
  const out: number[] = [];
  const from = new Date(fromMs);
  // Date counts month 12 as January of the next year, so stepping the month is enough.
  for (let k = 1; ; k++) {
    const t = new Date(from.getFullYear(), from.getMonth() + k, 1).getTime();
    if (t > toMs) return out;
    out.push(t);
  }
}

/** "Jan 2027" on a January or the first label, else "Feb". */
export function monthLabel(ms: number, first: boolean): string {
  const d = new Date(ms);
  return d.toLocaleDateString('en', {
    month: 'short',
    ...(first || d.getMonth() === 0 ? { year: 'numeric' } : {}),
  });
}

/**
 * Both axes of a trend chart: the time axis from a little before the first flight to a little
 * after the last, with a tick and a label on every month boundary in view (echarts' own ticks
 * skip months once they get crowded; within one month its day ticks stay), and the value range
 * from `trendValueRange`.
 */
export function trendAxes(series: { points: [number, number | null][] }[], minSpan: number) {
  const times = series.flatMap((s) => s.points.map((p) => p[0]));
  const y = trendValueRange(
    series.flatMap((s) => s.points.map((p) => p[1])),
    minSpan,
  );
  const base = { type: 'time', axisLabel: { color: inkSeries.axis, fontSize: 10 } } as const;
  if (times.length === 0) return { x: { ...base, splitLine: { show: false } }, y };
  const t0 = Math.min(...times);
  const t1 = Math.max(...times);
  const pad = Math.max(t1 - t0, DAY_MS) * 0.04;
  const months = monthStarts(t0 - pad, t1 + pad);
  const x =
    months.length === 0
      ? { ...base, min: t0 - pad, max: t1 + pad, splitLine: { show: false } }
      : {
          ...base,
          min: t0 - pad,
          max: t1 + pad,
          axisLabel: {
            ...base.axisLabel,
            customValues: months,
            formatter: (v: number) => monthLabel(v, v === months[0]),
          },
          axisTick: { customValues: months },
          splitLine: { show: true, lineStyle: { color: inkSeries.grid } },
        };
  return { x, y };
}

const DAY_MS = 86_400_000;
