import { z } from 'zod';
import { channelFamily, conversionFor, normalizeUnit, type Unit } from './channels';

/**
 * Column maps: how a CSV's headers map to our channels. Canonical headers map themselves; any
 * other layout needs a map a person has confirmed. Teams save them as import presets, so the
 * schema is shared with the server. Proposing a map from foreign headers is
 * `propose-column-map.ts`.
 */

export const ColumnMapEntry = z
  .object({
    channel: z.string().refine((c) => channelFamily(c) !== null, {
      message: 'not one of our channels (time, motorN, rpmN, gyro_x, …)',
    }),
    unit: z
      .string()
      .refine((u) => normalizeUnit(u) !== null, { message: 'unknown unit' })
      .optional(),
    /** Raw value at 0 % and at 100 %, for unit 'raw'. */
    min: z.number().finite().optional(),
    max: z.number().finite().optional(),
    /** Applied first: value in `unit` = file value × scale + offset. */
    scale: z
      .number()
      .finite()
      .refine((s) => s !== 0, { message: 'scale cannot be 0' })
      .optional(),
    offset: z.number().finite().optional(),
  })
  .superRefine((entry, ctx) => {
    const unit = entry.unit === undefined ? undefined : normalizeUnit(entry.unit);
    if (entry.unit !== undefined && unit === null) return;
    const effective = unit ?? impliedUnit(entry);
    if (!effective || effective === 'erpm') return; // erpm needs the pole count, known later
    const c = conversionFor(entry.channel, effective, entry);
    if (typeof c === 'string') ctx.addIssue({ code: 'custom', message: c, path: ['unit'] });
  });
export type ColumnMapEntry = z.infer<typeof ColumnMapEntry>;

export const ColumnMap = z.object({
  /** Keyed by the header exactly as written in the file (trimmed, without quotes). */
  columns: z.record(z.string(), ColumnMapEntry),
});
export type ColumnMap = z.infer<typeof ColumnMap>;

/** The unit an entry means: its own, 'raw' when only a range is given, else the default. */
export function impliedUnit(entry: ColumnMapEntry): Unit | null {
  if (entry.unit !== undefined) return normalizeUnit(entry.unit);
  const family = channelFamily(entry.channel);
  if (!family) return null;
  if (entry.min !== undefined && entry.max !== undefined && family.units.includes('raw')) {
    return 'raw';
  }
  return family.units[0] ?? null;
}

export interface ProposedColumn {
  header: string;
  /** Suggested canonical channel, or null when the header gave no usable clue. */
  channel: string | null;
  /** Suggested unit, or null when the header does not say (the person picks one). */
  unit: Unit | null;
  /** Raw value at 0 % and at 100 %, when the unit is 'raw'. */
  min?: number;
  max?: number;
  /** Why, in plain words, for the person confirming it. */
  reason: string;
}

export interface ProposedColumnMap {
  /** One entry per header, in file order. */
  entries: ProposedColumn[];
  /** Required channels nothing maps to yet ('time', 'motor1'). */
  missing: string[];
}

/**
 * Splits a header into its name and `[unit]` (brackets or parentheses). A number in brackets
 * is an index, part of the name: `esc_out[0]` is the first of a set, `rpm[2] [erpm]` the third
 * in eRPM.
 */
export function splitHeader(header: string): { name: string; unit: string | null } {
  const m = /^(.*?)\s*[[(]\s*([^\])]*?)\s*[\])]\s*$/.exec(header.trim());
  if (m && m[1] !== undefined && m[1] !== '' && !/^[0-9]+$/.test(m[2] ?? ''))
    return { name: m[1].trim(), unit: m[2] ?? '' };
  return { name: header.trim(), unit: null };
}

/**
 * The confirmed part of a proposal as a column map: entries with a channel and a unit (and, for
 * 'raw', its range).
 */
export function proposalToColumnMap(proposal: ProposedColumnMap): ColumnMap {
  const columns: ColumnMap['columns'] = {};
  for (const e of proposal.entries) {
    if (e.channel === null || e.unit === null) continue;
    if (e.unit !== 'raw') columns[e.header] = { channel: e.channel, unit: e.unit };
    else if (e.min !== undefined && e.max !== undefined)
      columns[e.header] = { channel: e.channel, unit: 'raw', min: e.min, max: e.max };
  }
  return { columns };
}

/** A cell's number as the reader would take it (a decimal comma when `;` or tab delimits). */
export function cellNumber(text: string | undefined, delimiter = ','): number {
  if (text === undefined) return NaN;
  let t = text
    .trim()
    .replace(/^"(.*)"$/, '$1')
    .trim();
  if (t === '') return NaN;
  if (delimiter !== ',') t = t.replace(',', '.');
  return Number(t);
}

/** Reads a header written in our canonical form ('gyro_x [rad/s]'), or null. */
export function canonicalReading(header: string): { channel: string; unit: Unit } | null {
  const { name, unit: unitText } = splitHeader(header);
  const channel = name.toLowerCase();
  const family = channelFamily(channel);
  if (!family) return null;
  if (unitText === null) return { channel, unit: family.units[0]! };
  const unit = normalizeUnit(unitText);
  if (unit === null || !family.units.includes(unit)) return null;
  return { channel, unit };
}

/**
 * The first saved map that names every one of these headers, so a file laid out like an
 * earlier one reads without asking again; none for an empty header list.
 */
export function mapCoveringHeaders(
  maps: readonly { columnMap: ColumnMap }[] | undefined,
  headers: readonly string[],
): ColumnMap | undefined {
  if (!maps || headers.length === 0) return undefined;
  return maps.find((m) => headers.every((h) => h in m.columnMap.columns))?.columnMap;
}
