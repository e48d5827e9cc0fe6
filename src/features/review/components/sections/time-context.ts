import type { Trace } from '../../../../../shared/analysis/review-detail';
import type { TimeSeries } from '../../../../components/charts/time-chart';
import { motorColor } from '../../../../components/charts/palette';

/** What every time chart of a review shares: the cursor, the zoom group and the hover stretches. */
export interface TimeContext {
  cursorT: number | null;
  onCursor: (tS: number) => void;
  group: string;
  hover: [number, number][];
}

/** TimeChart props that make a chart follow the review's cursor and zoom, with hover shaded. */
export function followReviewTime(time: TimeContext) {
  return { cursorT: time.cursorT, onCursor: time.onCursor, group: time.group, bands: time.hover };
}

export type SeriesPick = Omit<TimeSeries, 'data'> & { key: string };

/** The picked series that the trace holds, in the order picked; a log without one leaves it out. */
export function traceSeries(trace: Trace, picks: SeriesPick[]): TimeSeries[] {
  return picks.flatMap(({ key, ...style }) => {
    const data = trace.series[key];
    return data ? [{ ...style, data }] : [];
  });
}

/** Motor outputs 1…N of a trace in the motors' own colours. */
export function motorSeries(trace: Trace, motorCount: number): TimeSeries[] {
  return traceSeries(
    trace,
    Array.from({ length: motorCount }, (_, k) => ({
      key: `motor${k + 1}`,
      name: `Motor ${k + 1}`,
      color: motorColor(k + 1),
    })),
  );
}
