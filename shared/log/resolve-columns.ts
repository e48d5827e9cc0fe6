import {
  channelFamily,
  conversionFor,
  IDENTITY,
  normalizeUnit,
  type Conversion,
  type Unit,
} from './channels';
import { canonicalReading, ColumnMap, impliedUnit, splitHeader } from './column-map';
import { LogFormatError } from './errors';
import { proposeColumnMap } from './propose-column-map';
import type { LogWarning } from './types';

/** What the reader does with one field of each row. */
export interface ColumnPlan {
  header: string;
  /** Canonical channel, or null when the field is skipped. */
  channel: string | null;
  unit: Unit | null;
  /** File value → value in `unit`: v × scale + offset (from a column map). */
  scale: number;
  offset: number;
  /** Value in `unit` → canonical unit. */
  conversion: Conversion;
  /** The unit was written (header brackets or column map), not assumed as the default. */
  unitStated: boolean;
}

export interface ReadOptions {
  /** How non-canonical headers map to channels; canonical headers map themselves. */
  columnMap?: ColumnMap;
  /** Motor pole count, for rpm columns written in eRPM. */
  poles?: number;
  /**
   * Expected decoded size in bytes (e.g. a file's size), used only to size the columns once
   * instead of growing them; a wrong guess costs memory or a copy, never correctness.
   */
  expectedBytes?: number;
}

export interface ResolvedColumns {
  plans: ColumnPlan[];
  warnings: LogWarning[];
  /** The last field is a trailing delimiter's empty cell and may be absent in rows. */
  optionalLast: boolean;
}

const place = (line: number, column: number, header: string) =>
  `Line ${line}, column ${column}${header === '' ? '' : ` ("${header}")`}`;

/** Maps header cells to channels, or throws a LogFormatError a pilot can act on. */
export function resolveColumns(
  headers: string[],
  headerLine: number,
  options: ReadOptions,
): ResolvedColumns {
  let map: ColumnMap | undefined;
  if (options.columnMap !== undefined) {
    const parsed = ColumnMap.safeParse(options.columnMap);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const where = issue ? issue.path.filter((p) => p !== 'columns').join(' → ') : '';
      throw new LogFormatError(
        'bad-column-map',
        `The column map cannot be used: ${where ? `${where}: ` : ''}${issue?.message ?? 'invalid'}.`,
        { line: headerLine, headers },
      );
    }
    map = parsed.data;
  }
  const warnings: LogWarning[] = [];
  const plans: ColumnPlan[] = [];
  const unknown: number[] = [];
  const skipped: string[] = [];
  let optionalLast = false;

  headers.forEach((header, i) => {
    const column = i + 1;
    const skip: ColumnPlan = {
      unitStated: false,
      header,
      channel: null,
      unit: null,
      scale: 1,
      offset: 0,
      conversion: IDENTITY,
    };
    if (header === '') {
      if (i === headers.length - 1 && i > 0) {
        optionalLast = true;
        plans.push(skip);
        return;
      }
      if (map) {
        skipped.push(`column ${column} (no name)`);
        plans.push(skip);
        return;
      }
      throw new LogFormatError(
        'empty-header',
        `${place(headerLine, column, '')}: this column has no name in the header row. Name it, or import the file with a column map.`,
        { line: headerLine, column, headers },
      );
    }
    const entry = map && Object.hasOwn(map.columns, header) ? map.columns[header] : undefined;
    if (entry) {
      const unit = impliedUnit(entry)!;
      plans.push(
        plan(
          header,
          entry.channel,
          unit,
          entry.scale ?? 1,
          entry.offset ?? 0,
          { ...entry, poles: options.poles },
          headerLine,
          column,
          entry.unit !== undefined || entry.min !== undefined,
        ),
      );
      return;
    }
    const canonical = canonicalReading(header);
    if (canonical) {
      plans.push(
        plan(
          header,
          canonical.channel,
          canonical.unit,
          1,
          0,
          { poles: options.poles },
          headerLine,
          column,
          splitHeader(header).unit !== null,
        ),
      );
      return;
    }
    const { name, unit: unitText } = splitHeader(header);
    const family = channelFamily(name.toLowerCase());
    if (family && unitText !== null) {
      const unit = normalizeUnit(unitText);
      throw new LogFormatError(
        'unknown-unit',
        `${place(headerLine, column, header)}: ${unit === null ? `"${unitText}" is not a unit we know` : `${name.toLowerCase()} cannot be in ${unit}`}; ${name.toLowerCase()} can be written in ${family.units.join(', ')}.`,
        { line: headerLine, column, header, headers },
      );
    }
    if (map) {
      skipped.push(`"${header}"`);
      plans.push(skip);
      return;
    }
    unknown.push(i);
    plans.push(skip);
  });

  if (unknown.length > 0) {
    const first = unknown[0]!;
    const names = unknown.map((i) => `"${headers[i]}"`);
    const listed =
      names.length > 4
        ? `${names.slice(0, 4).join(', ')} and ${names.length - 4} more`
        : names.join(', ');
    throw new LogFormatError(
      'needs-column-map',
      `${place(headerLine, first + 1, headers[first]!)}: ${unknown.length === 1 ? 'this header is' : `${unknown.length} headers are`} not our channel names (${listed}). Confirm a column map to say which channel each column holds.`,
      {
        line: headerLine,
        column: first + 1,
        header: headers[first]!,
        headers,
        proposal: proposeColumnMap(headers),
      },
    );
  }
  if (skipped.length > 0) {
    warnings.push({
      code: 'skipped-columns',
      message: `Not imported (not in the column map): ${skipped.join(', ')}.`,
      line: headerLine,
    });
  }
  checkChannels(plans, headers, headerLine);
  return { plans, warnings, optionalLast };
}

function plan(
  header: string,
  channel: string,
  unit: Unit,
  scale: number,
  offset: number,
  input: { poles?: number; min?: number; max?: number },
  line: number,
  column: number,
  unitStated: boolean,
): ColumnPlan {
  const conversion = conversionFor(channel, unit, input);
  if (typeof conversion === 'string') {
    const code =
      unit === 'erpm' ? 'needs-poles' : unit === 'raw' ? 'needs-column-map' : 'bad-column-map';
    throw new LogFormatError(code, `${place(line, column, header)}: ${conversion}.`, {
      line,
      column,
      header,
    });
  }
  return { header, channel, unit, scale, offset, conversion, unitStated };
}

function checkChannels(plans: ColumnPlan[], headers: string[], line: number): void {
  const seen = new Map<string, number>();
  plans.forEach((p, i) => {
    if (p.channel === null) return;
    const before = seen.get(p.channel);
    if (before !== undefined) {
      throw new LogFormatError(
        'duplicate-channel',
        `${place(line, i + 1, p.header)}: ${p.channel} appears twice (also column ${before + 1}, "${plans[before]!.header}"). Each channel may appear once; remove or rename one.`,
        { line, column: i + 1, header: p.header, headers },
      );
    }
    seen.set(p.channel, i);
  });
  if (!seen.has('time')) {
    throw new LogFormatError(
      'missing-channel',
      `Line ${line}: the header has no time column. Every log needs "time" (s, ms or us) to place samples.`,
      { line, headers },
    );
  }
  if (!seen.has('motor1')) {
    throw new LogFormatError(
      'missing-channel',
      `Line ${line}: the header has no motor1 column. Motor outputs (motor1…motorN) are what Hoverprint reads; at least motor1 is needed.`,
      { line, headers },
    );
  }
  for (const family of ['motor', 'rpm', 'imotor']) {
    let highest = 0;
    for (const ch of seen.keys()) {
      const m = new RegExp(`^${family}([0-9]+)$`).exec(ch);
      if (m) highest = Math.max(highest, Number(m[1]));
    }
    for (let n = 1; n < highest; n++) {
      if (!seen.has(`${family}${n}`)) {
        throw new LogFormatError(
          'missing-channel',
          `Line ${line}: ${family}${highest} is present but ${family}${n} is missing. Number ${family} columns 1 to N without gaps, as the motors are numbered on the airframe.`,
          { line, headers },
        );
      }
    }
  }
}
