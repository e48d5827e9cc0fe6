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

/**
 * Up to ~4096 evenly spaced finite values: a column in the wrong unit is off nearly
 * everywhere, so a sample tells as well as a full pass over a million rows.
 */
function sample(col: Column): number[] {
  const step = Math.max(1, Math.floor(col.length / 4096));
  const out: number[] = [];
  for (let i = 0; i < col.length; i += step) if (Number.isFinite(col[i]!)) out.push(col[i]!);
  return out;
}

function maxOf(col: Column): number {
  return sample(col).reduce((a, b) => (b > a ? b : a), -Infinity);
}

function medianOf(col: Column): number {
  const picks = sample(col).sort((a, b) => a - b);
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
      const max = maxOf(col);
      if (max > MAX_PLAUSIBLE_FRACTION) {
        warnings.push({
          code: 'unit-suspect',
          message: `${name} has no unit, so it was read as a 0–1 fraction, but it reaches ${fmt(max)}. If it is a percentage or a 1000–2000 µs pulse, say so in the header: "${name} [%]" or "${name} [us]".`,
          line: headerLine,
        });
      }
    } else if (name === 'vbat') {
      const median = medianOf(col);
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
