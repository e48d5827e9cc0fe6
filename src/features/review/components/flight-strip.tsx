import { useMemo } from 'react';
import type { Trace } from '../../../../shared/analysis/review-detail';
import { TimeChart, type TimePin } from '../../../components/charts/time-chart';
import { inkSeries } from '../../../components/charts/palette';
import { followReviewTime, traceSeries, type TimeContext } from './sections/time-context';

/** Value of a trace at time `tS` by linear interpolation (traces are time-ordered). */
export function valueAt(
  t: readonly number[],
  y: readonly number[] | undefined,
  tS: number,
): number | null {
  if (!y || t.length === 0) return null;
  let lo = 0;
  let hi = t.length - 1;
  if (tS <= t[0]!) return y[0] ?? null;
  if (tS >= t[hi]!) return y[hi] ?? null;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (t[mid]! <= tS) lo = mid;
    else hi = mid;
  }
  const w = (tS - t[lo]!) / (t[hi]! - t[lo]! || 1);
  return y[lo]! + w * (y[hi]! - y[lo]!);
}

const STRIP_HEIGHT = 150;

export interface FlightStripProps {
  /** The full effort trace, for the cursor readout. */
  effort: Trace;
  /** Throttle and collective already thinned for drawing; undefined while the worker thins them. */
  strip: Trace | undefined;
  time: TimeContext;
  pins: TimePin[];
  onPin: (id: string) => void;
}

/** Throttle and collective across the whole flight: hover shaded, comments pinned, the cursor shared. */
export function FlightStrip({ effort, strip, time, pins, onPin }: FlightStripProps) {
  const series = useMemo(
    () =>
      strip
        ? traceSeries(strip, [
            { key: 'throttle', name: 'Throttle', color: inkSeries.throttle },
            { key: 'collective', name: 'Collective', color: inkSeries.collective, width: 1.6 },
          ])
        : [],
    [strip],
  );
  const at = time.cursorT;
  const thr = at === null ? null : valueAt(effort.t, effort.series['throttle'], at);
  const col = at === null ? null : valueAt(effort.t, effort.series['collective'], at);
  return (
    <section
      aria-label="Flight strip"
      className="rounded border border-line bg-paper-raised px-2 pt-2"
    >
      <div className="flex flex-wrap items-baseline gap-x-4 px-2 text-xs text-ink-soft">
        <span className="font-medium text-ink">Flight strip</span>
        <span className="num" aria-live="polite" data-testid="cursor-readout">
          {at === null ? 'click the strip or use ← → to place the cursor' : `t ${at.toFixed(2)} s`}
          {thr !== null && ` · throttle ${(thr * 100).toFixed(0)} %`}
          {col !== null && ` · collective ${(col * 100).toFixed(0)} %`}
        </span>
        <span className="ml-auto text-ink-faint">
          shaded: hover · pins: comments · ← → move · c: comment here
        </span>
      </div>
      {strip ? (
        <TimeChart
          t={strip.t}
          series={series}
          {...followReviewTime(time)}
          pins={pins}
          onPin={onPin}
          height={STRIP_HEIGHT}
          yMin={0}
          yMax={1}
          slider
          sampling={false}
          ariaLabel="Throttle and collective over the flight"
        />
      ) : (
        <div style={{ height: STRIP_HEIGHT }} aria-busy="true" />
      )}
    </section>
  );
}
