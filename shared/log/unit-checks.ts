import { doubtMessage, doubtUnit } from './unit-fit';
import type { ColumnPlan } from './resolve-columns';
import type { Column, LogWarning } from './types';

/**
 * `unit-suspect` warnings for columns whose values do not fit the unit they were read in,
 * assumed or written: a pilot who forgot `[us]` on a time column, or mapped µs motor outputs
 * as fractions, should hear so before reading a verdict built on them.
 */

/**
 * Up to ~4096 evenly spaced values: a column in the wrong unit is off nearly everywhere, so a
 * sample tells as well as a full pass over a million rows.
 */
function sample(col: Column): number[] {
  const step = Math.max(1, Math.floor(col.length / 4096));
  const out: number[] = [];
  for (let i = 0; i < col.length; i += step) if (Number.isFinite(col[i]!)) out.push(col[i]!);
  return out;
}

/** Time needs consecutive samples: its steps are what tell the unit. */
const TIME_SAMPLES = 1024;

export function checkUnits(
  plans: ColumnPlan[],
  columns: Record<string, Column>,
  headerLine: number,
): LogWarning[] {
  const warnings: LogWarning[] = [];
  for (const p of plans) {
    if (p.channel === null || p.unit === null) continue;
    const col = columns[p.channel];
    if (!col) continue;
    const canonical =
      p.channel === 'time' ? Array.from(col.subarray(0, TIME_SAMPLES)) : sample(col);
    // Back to the unit the column was read in: canonical = (v + shift) × mul ÷ div.
    const { shift, mul, div } = p.conversion;
    const inUnit = canonical.map((c) => (c * div) / mul - shift);
    const range = p.unit === 'raw' ? { min: -shift, max: div - shift } : {};
    const doubt = doubtUnit(p.channel, p.unit, inUnit, range);
    // Time that stands still or runs back has warnings of its own (time-base.ts).
    if (!doubt || doubt.kind === 'stalled') continue;
    warnings.push({
      code: 'unit-suspect',
      message: doubtMessage(
        p.channel,
        p.unit,
        doubt,
        p.unitStated ? 'stated' : 'assumed',
        p.header,
        range,
      ),
      line: headerLine,
    });
  }
  return warnings;
}
