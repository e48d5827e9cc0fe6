import {
  ColumnMap,
  type ColumnMapEntry,
  type ProposedColumnMap,
} from '../../../../shared/log/column-map';
import { channelFamily } from '../../../../shared/log/channels';

/** One row of the column-map table as the person edits it (strings, as form fields hold them). */
export interface DraftRow {
  header: string;
  /** '' = leave this column out. */
  channel: string;
  unit: string;
  /** Raw range for unit 'raw': value at 0 % and at 100 %. */
  min: string;
  max: string;
  reason: string;
}

export function draftFromProposal(proposal: ProposedColumnMap, preset?: ColumnMap): DraftRow[] {
  return proposal.entries.map((e) => {
    const saved = preset?.columns[e.header];
    if (saved)
      return {
        header: e.header,
        channel: saved.channel,
        unit: saved.unit ?? channelFamily(saved.channel)?.units[0] ?? '',
        min: saved.min === undefined ? '' : String(saved.min),
        max: saved.max === undefined ? '' : String(saved.max),
        reason: 'from the team preset',
      };
    return {
      header: e.header,
      channel: e.channel ?? '',
      unit: e.unit ?? (e.channel ? (channelFamily(e.channel)?.units[0] ?? '') : ''),
      min: e.min === undefined ? '' : String(e.min),
      max: e.max === undefined ? '' : String(e.max),
      reason: e.reason,
    };
  });
}

/** A raw row's range as numbers, or null while it is missing, not a number, or empty. */
function rawRange(r: DraftRow): { min: number; max: number } | null {
  const min = Number(r.min);
  const max = Number(r.max);
  if (r.min.trim() === '' || r.max.trim() === '') return null;
  if (!Number.isFinite(min) || !Number.isFinite(max) || min === max) return null;
  return { min, max };
}

/**
 * The rows as far as they are filled in, as a column map to check the values against while the
 * person edits (rows left out, or raw without a usable range, are skipped).
 */
export function draftAsFarAsFilled(rows: DraftRow[]): ColumnMap {
  const columns: Record<string, ColumnMapEntry> = {};
  for (const r of rows) {
    if (r.channel === '' || r.unit === '') continue;
    const entry: ColumnMapEntry = { channel: r.channel, unit: r.unit };
    if (r.unit === 'raw') {
      const range = rawRange(r);
      if (!range) continue;
      Object.assign(entry, range);
    }
    columns[r.header] = entry;
  }
  return { columns };
}

export type DraftCheck = { ok: true; map: ColumnMap } | { ok: false; problems: string[] };

/**
 * Turns the edited rows into a column map, or says in plain words what is still wrong: a
 * channel used twice, time or motor1 missing, a raw range missing, a unit the channel does not
 * take (the shared schema has the last word).
 */
export function checkDraft(rows: DraftRow[]): DraftCheck {
  const problems: string[] = [];
  const seen = new Map<string, string>();
  const columns: Record<string, ColumnMapEntry> = {};
  for (const r of rows) {
    if (r.channel === '') continue;
    const other = seen.get(r.channel);
    if (other !== undefined) {
      problems.push(`${r.channel} is chosen for both "${other}" and "${r.header}".`);
      continue;
    }
    seen.set(r.channel, r.header);
    const entry: ColumnMapEntry = { channel: r.channel };
    if (r.unit !== '') entry.unit = r.unit;
    if (r.unit === 'raw') {
      const range = rawRange(r);
      if (!range) {
        problems.push(`"${r.header}" is raw: give the value at 0 % and at 100 % output.`);
        continue;
      }
      Object.assign(entry, range);
    }
    columns[r.header] = entry;
  }
  if (!seen.has('time')) problems.push('No column is mapped to time.');
  if (!seen.has('motor1'))
    problems.push('No column is mapped to motor1; at least one motor output is needed.');
  if (problems.length > 0) return { ok: false, problems };
  const parsed = ColumnMap.safeParse({ columns });
  if (!parsed.success) {
    return {
      ok: false,
      problems: parsed.error.issues.map((i) => {
        const header = typeof i.path[1] === 'string' ? `"${i.path[1]}": ` : '';
        return header + i.message;
      }),
    };
  }
  return { ok: true, map: parsed.data };
}
