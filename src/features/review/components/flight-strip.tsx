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
  const endS = effort.t.length > 0 ? effort.t[effort.t.length - 1]! : 0;
  const thr = at === null ? null : valueAt(effort.t, effort.series['throttle'], at);
  const col = at === null ? null : valueAt(effort.t, effort.series['collective'], at);
  const readout =
    at === null
      ? null
      : `t ${at.toFixed(2)} s` +
        (thr !== null ? ` · throttle ${(thr * 100).toFixed(0)} %` : '') +
        (col !== null ? ` · collective ${(col * 100).toFixed(0)} %` : '');
  return (
    <section
      aria-label="Flight strip"
      className="rounded border border-line bg-paper-raised px-2 pt-2"
    >
      <div className="flex flex-wrap items-baseline gap-x-4 px-2 text-xs text-ink-soft">
        <span className="font-medium text-ink">Flight strip</span>
        {/* The cursor as a slider: Tab reaches it, ← → (Shift for bigger steps) move it from
            anywhere on the page, Home and End jump to the ends. */}
        <span
          role="slider"
          tabIndex={0}
          aria-label="Flight cursor"
          aria-valuemin={0}
          aria-valuemax={Number(endS.toFixed(2))}
          aria-valuenow={at === null ? 0 : Number(at.toFixed(2))}
          aria-valuetext={readout ?? 'not placed'}
          data-testid="cursor-readout"
          className="num -mx-1 rounded px-1"
          onKeyDown={(e) => {
            if (e.key !== 'Home' && e.key !== 'End') return;
            time.onCursor(e.key === 'Home' ? 0 : endS);
            e.preventDefault();
          }}
        >
          {readout ?? (
            <>
              <span className="pointer-coarse:hidden">
                click the strip or use ← → to place the cursor
              </span>
              <span className="hidden pointer-coarse:inline">
                tap the strip to place the cursor
              </span>
            </>
          )}
        </span>
        <span className="ml-auto text-ink-faint">
          shaded: hover · pins: comments
          <span className="pointer-coarse:hidden"> · ← → move · c: comment here</span>
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
      {pins.length > 0 && (
        // The pins on the canvas answer a pointer; these answer Tab and Enter, and say the same.
        <ul aria-label="Comment pins" className="flex flex-wrap gap-1 px-2 pb-2 text-xs">
          {[...pins]
            .sort((a, b) => a.tS - b.tS)
            .map((p) => (
              <li key={p.id}>
                <button
                  type="button"
                  className={
                    'num rounded border px-1.5 py-0.5 hover:bg-paper-sunk ' +
                    (p.resolved
                      ? 'border-dashed border-line-strong text-ink-soft'
                      : 'border-accent text-ink')
                  }
                  aria-label={`Comment pinned at ${p.tS.toFixed(2)} s${p.resolved ? ', resolved' : ''}`}
                  onClick={() => {
                    time.onCursor(p.tS);
                    onPin(p.id);
                  }}
                >
                  <span aria-hidden className="text-accent-ink">
                    ◆{' '}
                  </span>
                  {p.tS.toFixed(2)} s
                </button>
              </li>
            ))}
        </ul>
      )}
    </section>
  );
}
