import type { ColumnPlan } from './resolve-columns';
import type { Column, LogWarning } from './types';

/**
 * Warnings for columns whose unit was assumed (no unit in the header) and whose values do not
 * fit it: a pilot who forgot `[us]` on a time column should hear so, not read a 4000-second
 * flight. Thresholds are common practice for multirotor logs, not a published standard.
 */

/** Flight logs sample at 10 Hz or faster; a step of half a second or more is not seconds. */
const MAX_PLAUSIBLE_STEP_S = 0.5;
/** A 0–1 output above this is a different unit (% or µs), not overshoot. */
const MAX_PLAUSIBLE_FRACTION = 1.5;
/** No multirotor pack reaches 100 V; millivolts do. */
const MAX_PLAUSIBLE_VOLTS = 100;

function maxFinite(col: Column): number {
  let max = -Infinity;
  for (let i = 0; i < col.length; i++) {
    const v = col[i]!;
    if (v > max) max = v;
  }
  return max;
}

function medianFinite(col: Column): number {
  // A sample of at most 1025 evenly spaced values is plenty to tell V from mV.
  const n = col.length;
  const step = Math.max(1, Math.floor(n / 1024));
  const picks: number[] = [];
  for (let i = 0; i < n; i += step) if (Number.isFinite(col[i]!)) picks.push(col[i]!);
  picks.sort((a, b) => a - b);
  return picks.length ? picks[picks.length >> 1]! : NaN;
}

const fmt = (v: number) => (Math.abs(v) >= 100 ? v.toFixed(0) : v.toPrecision(3));

export function checkAssumedUnits(
  plans: ColumnPlan[],
  columns: Record<string, Column>,
  medianStepS: number,
  headerLine: number,
): LogWarning[] {
  const warnings: LogWarning[] = [];
  for (const p of plans) {
    if (p.channel === null || p.unitStated) continue;
    const col = columns[p.channel];
    if (!col) continue;
    const name = p.channel;
    if (name === 'time' && medianStepS >= MAX_PLAUSIBLE_STEP_S) {
      warnings.push({
        code: 'unit-suspect',
        message: `time has no unit, so it was read in seconds, but samples are ${fmt(medianStepS)} s apart. If the logger writes milliseconds or microseconds, say so in the header: "time [ms]" or "time [us]".`,
        line: headerLine,
      });
    } else if (/^motor[0-9]+$|^throttle$/.test(name)) {
      const max = maxFinite(col);
      if (max > MAX_PLAUSIBLE_FRACTION) {
        warnings.push({
          code: 'unit-suspect',
          message: `${name} has no unit, so it was read as a 0–1 fraction, but it reaches ${fmt(max)}. If it is a percentage or a 1000–2000 µs pulse, say so in the header: "${name} [%]" or "${name} [us]".`,
          line: headerLine,
        });
      }
    } else if (name === 'vbat') {
      const median = medianFinite(col);
      if (median > MAX_PLAUSIBLE_VOLTS) {
        warnings.push({
          code: 'unit-suspect',
          message: `vbat has no unit, so it was read in volts, but it sits near ${fmt(median)} V. If the logger writes millivolts, say so in the header: "vbat [mV]".`,
          line: headerLine,
        });
      }
    }
  }
  return warnings;
}
