import type { Unit } from './channels';
import {
  canonicalReading,
  cellNumber,
  impliedUnit,
  splitHeader,
  type ColumnMap,
} from './column-map';
import type { LikelyUnit } from './unit-from-values';
import { doubtMessage, doubtUnit } from './unit-fit';

/** A mapped column whose first values do not fit the unit the map reads it in. */
export interface MapUnitDoubt {
  header: string;
  /** 1-based column in the file. */
  column: number;
  channel: string;
  unit: Unit;
  /** What looks wrong and what to do, in a pilot's words. */
  message: string;
  /** The unit the values fit, to offer as a one-click fix; null when none does. */
  likely: LikelyUnit | null;
}

/**
 * Checks a column map against a file's first rows (as `inspectHeader` gives them) before
 * anything is read: every mapped column, and every header in our own form the map leaves out.
 */
export function doubtsAboutMap(
  map: ColumnMap,
  preview: { headers: string[]; sampleRows: string[][]; delimiter?: string },
): MapUnitDoubt[] {
  const doubts: MapUnitDoubt[] = [];
  preview.headers.forEach((header, i) => {
    const entry = map.columns[header];
    const own = entry ? null : canonicalReading(header);
    const channel = entry?.channel ?? own?.channel;
    const unit = entry ? impliedUnit(entry) : (own?.unit ?? null);
    if (!channel || !unit) return;
    const scale = entry?.scale ?? 1;
    const offset = entry?.offset ?? 0;
    const values = preview.sampleRows.map(
      (row) => cellNumber(row[i], preview.delimiter) * scale + offset,
    );
    const range = { min: entry?.min, max: entry?.max };
    const doubt = doubtUnit(channel, unit, values, range);
    if (!doubt) return;
    doubts.push({
      header,
      column: i + 1,
      channel,
      unit,
      message: doubtMessage(
        channel,
        unit,
        doubt,
        !entry && splitHeader(header).unit === null ? 'assumed' : 'stated',
        header,
        range,
      ),
      likely: doubt.likely,
    });
  });
  return doubts;
}
