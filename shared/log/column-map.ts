import { z } from 'zod';
import { channelFamily, conversionFor, normalizeUnit, type Unit } from './channels';

/**
 * Column maps: how a CSV's headers map to our channels. Canonical headers map themselves; any
 * other layout needs a map a person has confirmed. Teams save them as import presets, so the
 * schema is shared with the server.
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
  /** Why, in plain words, for the person confirming it. */
  reason: string;
}

export interface ProposedColumnMap {
  /** One entry per header, in file order. */
  entries: ProposedColumn[];
  /** Required channels nothing maps to yet ('time', 'motor1'). */
  missing: string[];
}

interface ParsedHeader {
  /** Lower-case words, numbers split off: "GyroX (rad/s)" → ['gyro', 'x']. */
  words: string[];
  /** Unit found in brackets or as a trailing word, if any. */
  unit: Unit | null;
  unitText: string | null;
}

/** Splits a header into its name and `[unit]` (brackets or parentheses). */
export function splitHeader(header: string): { name: string; unit: string | null } {
  const m = /^(.*?)\s*[[(]\s*([^\])]*?)\s*[\])]\s*$/.exec(header.trim());
  if (m && m[1] !== undefined && m[1] !== '') return { name: m[1].trim(), unit: m[2] ?? '' };
  return { name: header.trim(), unit: null };
}

const unitWords: Record<string, Unit> = {
  sec: 's',
  seconds: 's',
  ms: 'ms',
  millis: 'ms',
  us: 'us',
  micros: 'us',
  pct: '%',
  percent: '%',
  erpm: 'erpm',
  hz: 'Hz',
  dps: 'deg/s',
  degs: 'deg/s',
  rads: 'rad/s',
  mps2: 'm/s2',
  mv: 'mV',
  ma: 'mA',
};

function parseWords(header: string): ParsedHeader {
  const { name, unit: bracketUnit } = splitHeader(header);
  let unit: Unit | null = bracketUnit === null ? null : normalizeUnit(bracketUnit);
  let unitText = bracketUnit;
  const words = name
    .replace(/erpm/gi, ' erpm ')
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/([A-Za-z])([0-9])/g, '$1 $2')
    .replace(/([0-9])([A-Za-z])/g, '$1 $2')
    .toLowerCase()
    .split(/[^a-z0-9%]+/)
    .filter((w) => w !== '');
  if (unit === null) {
    for (const w of words) {
      const u = Object.hasOwn(unitWords, w) ? unitWords[w] : undefined;
      if (u) {
        unit = u;
        unitText = w;
      }
    }
  }
  return { words, unit, unitText };
}

const axisWords: Record<string, 0 | 1 | 2> = {
  x: 0,
  roll: 0,
  y: 1,
  pitch: 1,
  z: 2,
  yaw: 2,
};

function findAxis(words: string[]): 0 | 1 | 2 | null {
  for (const w of words) {
    if (Object.hasOwn(axisWords, w)) return axisWords[w]!;
  }
  return null;
}

function findIndex(words: string[]): number | null {
  for (const w of words) if (/^[0-9]{1,2}$/.test(w)) return Number(w);
  return null;
}

const has = (words: string[], ...keys: string[]) => keys.some((k) => words.includes(k));

interface Guess {
  family: string;
  /** Axis or 1-based index (before zero-based correction); null when not needed. */
  slot: number | null;
  zeroBasedPossible: boolean;
  clue: string;
}

function guessFamily(words: string[]): Guess | null {
  const index = findIndex(words);
  const axis = findAxis(words);
  const clueOf = (...keys: string[]) => keys.find((k) => words.includes(k)) ?? keys[0]!;
  if (has(words, 'setpoint', 'sp', 'target', 'desired', 'demand')) {
    const slot = axis ?? (index !== null && index <= 2 ? index : null);
    return {
      family: 'sp',
      slot,
      zeroBasedPossible: false,
      clue: clueOf('setpoint', 'sp', 'target', 'desired', 'demand'),
    };
  }
  if (has(words, 'gyro', 'gyr', 'rate', 'rates', 'angular')) {
    const slot = axis ?? (index !== null && index <= 2 ? index : null);
    return {
      family: 'gyro',
      slot,
      zeroBasedPossible: false,
      clue: clueOf('gyro', 'gyr', 'rate', 'rates', 'angular'),
    };
  }
  if (has(words, 'acc', 'accel', 'accelerometer', 'acceleration')) {
    const slot = axis ?? (index !== null && index <= 2 ? index : null);
    return {
      family: 'acc',
      slot,
      zeroBasedPossible: false,
      clue: clueOf('acc', 'accel', 'accelerometer', 'acceleration'),
    };
  }
  if (has(words, 'rpm', 'erpm')) {
    return { family: 'rpm', slot: index, zeroBasedPossible: true, clue: clueOf('rpm', 'erpm') };
  }
  if (has(words, 'imotor') && index !== null) {
    return { family: 'imotor', slot: index, zeroBasedPossible: true, clue: 'imotor' };
  }
  if (has(words, 'current', 'curr', 'amps', 'amp', 'ibat', 'ma')) {
    if (has(words, 'motor', 'esc', 'mot') && index !== null) {
      return {
        family: 'imotor',
        slot: index,
        zeroBasedPossible: true,
        clue: clueOf('current', 'curr', 'amps', 'amp'),
      };
    }
    return {
      family: 'ibat',
      slot: null,
      zeroBasedPossible: false,
      clue: clueOf('current', 'curr', 'amps', 'amp', 'ibat', 'ma'),
    };
  }
  if (has(words, 'vbat', 'volt', 'volts', 'voltage', 'battery', 'bat', 'mv')) {
    return {
      family: 'vbat',
      slot: null,
      zeroBasedPossible: false,
      clue: clueOf('vbat', 'volt', 'volts', 'voltage', 'battery', 'bat', 'mv'),
    };
  }
  if (has(words, 'throttle', 'thr', 'collective')) {
    return {
      family: 'throttle',
      slot: null,
      zeroBasedPossible: false,
      clue: clueOf('throttle', 'thr', 'collective'),
    };
  }
  if (has(words, 'motor', 'mot', 'esc', 'output', 'out', 'pwm')) {
    return {
      family: 'motor',
      slot: index,
      zeroBasedPossible: true,
      clue: clueOf('motor', 'mot', 'esc', 'output', 'out', 'pwm'),
    };
  }
  if (has(words, 'time', 'timestamp', 't', 'elapsed')) {
    return {
      family: 'time',
      slot: null,
      zeroBasedPossible: false,
      clue: clueOf('time', 'timestamp', 't', 'elapsed'),
    };
  }
  return null;
}

/** Headers of one numbered set share a family and their words, all but the number. */
const numberedSet = (family: string, words: string[]) =>
  `${family}:${words.map((w) => (/^[0-9]{1,2}$/.test(w) ? '#' : w)).join(' ')}`;

const axisNames: Record<string, readonly string[]> = {
  gyro: ['gyro_x', 'gyro_y', 'gyro_z'],
  acc: ['acc_x', 'acc_y', 'acc_z'],
  sp: ['sp_roll', 'sp_pitch', 'sp_yaw'],
};

/**
 * Suggests a column map from the words and units in the headers, for a person to confirm.
 * It never applies itself: the reader only uses a map it is given.
 */
export function proposeColumnMap(
  headers: string[],
  sampleRows: string[][] = [],
): ProposedColumnMap {
  const parsed = headers.map(parseWords);
  const guesses = parsed.map((p) => guessFamily(p.words));
  // A numbered set that starts at 0 in the file (Motor0…Motor3) becomes motor1…motor4 as a
  // whole, so its "Motor1" is not read as our own motor1.
  const sets = guesses.map((g, i) =>
    g && g.zeroBasedPossible && g.slot !== null ? numberedSet(g.family, parsed[i]!.words) : null,
  );
  const zeroBasedSets = new Set(sets.filter((k, i) => k !== null && guesses[i]!.slot === 0));
  const shiftedByOne = (i: number) => sets[i] != null && zeroBasedSets.has(sets[i]);
  const taken = new Map<string, string>();
  const entries: ProposedColumn[] = headers.map((header, i) => {
    const direct = shiftedByOne(i) ? null : canonicalReading(header);
    if (direct) {
      if (taken.has(direct.channel)) {
        return {
          header,
          channel: null,
          unit: null,
          reason: `${direct.channel} is already taken by "${taken.get(direct.channel)}"`,
        };
      }
      taken.set(direct.channel, header);
      return { header, channel: direct.channel, unit: direct.unit, reason: 'our own channel name' };
    }
    const g = guesses[i];
    const p = parsed[i]!;
    if (!g)
      return {
        header,
        channel: null,
        unit: null,
        reason: 'no word we recognise; pick a channel or leave it out',
      };
    let channel: string | null;
    const axes = axisNames[g.family];
    if (axes) {
      channel = g.slot === null ? null : (axes[g.slot] ?? null);
      if (!channel)
        return {
          header,
          channel: null,
          unit: null,
          reason: `"${g.clue}" suggests ${g.family}, but no axis (x/y/z or roll/pitch/yaw) was found`,
        };
    } else if (g.family === 'motor' || g.family === 'rpm' || g.family === 'imotor') {
      if (g.slot === null)
        return {
          header,
          channel: null,
          unit: null,
          reason: `"${g.clue}" suggests ${g.family}, but no motor number was found`,
        };
      const n = g.slot + (shiftedByOne(i) ? 1 : 0);
      channel = `${g.family}${n}`;
    } else {
      channel = g.family;
    }
    if (!channelFamily(channel))
      return {
        header,
        channel: null,
        unit: null,
        reason: `"${header}" looks like ${g.family}, but ${channel} is out of range`,
      };
    if (taken.has(channel)) {
      return {
        header,
        channel: null,
        unit: null,
        reason: `also looks like ${channel}, already taken by "${taken.get(channel)}"; pick one`,
      };
    }
    taken.set(channel, header);
    const family = channelFamily(channel)!;
    let unit: Unit | null = null;
    let unitReason = 'no unit in the header: check it';
    if (p.unit !== null && family.units.includes(p.unit)) {
      unit = p.unit;
      unitReason = `unit ${p.unit} read from "${p.unitText}"`;
    } else if (g.family === 'rpm' && p.words.includes('erpm')) {
      unit = 'erpm';
      unitReason = 'unit erpm read from the name';
    } else if (p.unit !== null) {
      unitReason = `"${p.unitText}" is not a unit ${channel} accepts (${family.units.join(', ')})`;
    }
    const shifted = shiftedByOne(i) ? ' (numbered from 0 in the file, from 1 here)' : '';
    return {
      header,
      channel,
      unit,
      reason: `the word "${g.clue}" suggests ${channel}${shifted}; ${unitReason}`,
    };
  });
  entries.forEach((e, i) => {
    if (e.channel === null || e.unit !== null || sampleRows.length === 0) return;
    const values = sampleRows.map((r) => Number(r[i])).filter((v) => Number.isFinite(v));
    const guess = unitFromValues(e.channel, values);
    if (guess) {
      e.unit = guess.unit;
      e.reason = e.reason.replace('no unit in the header: check it', `${guess.why}: check it`);
    }
  });
  const mapped = new Set(entries.map((e) => e.channel).filter((c): c is string => c !== null));
  const missing: string[] = [];
  if (!mapped.has('time')) missing.push('time');
  if (!mapped.has('motor1')) missing.push('motor1');
  return { entries, missing };
}

/**
 * A unit suggested by the first values of a column whose header names none (common practice
 * for flight logs: a 1000–2000 µs pulse, a step of hundreds of µs or a few ms, pack voltage in
 * mV above 100).
 */
function unitFromValues(channel: string, values: number[]): { unit: Unit; why: string } | null {
  if (values.length === 0) return null;
  const min = Math.min(...values);
  const max = Math.max(...values);
  const range = `values ${min}…${max}`;
  if (/^motor[0-9]+$|^throttle$/.test(channel)) {
    if (min >= 900 && max <= 2100)
      return { unit: 'us', why: `${range} look like a 1000–2000 µs pulse` };
    if (min >= 0 && max <= 1) return { unit: 'frac', why: `${range} look like a 0–1 fraction` };
    if (min >= 0 && max <= 100) return { unit: '%', why: `${range} look like a percentage` };
    return null;
  }
  if (channel === 'time' && values.length >= 2) {
    const steps = values
      .slice(1)
      .map((v, i) => v - values[i]!)
      .sort((a, b) => a - b);
    const step = steps[steps.length >> 1]!;
    if (!(step > 0)) return null;
    const unit: Unit = step >= 50 ? 'us' : step >= 0.5 ? 'ms' : 's';
    return {
      unit,
      why: `samples ${step} apart look like ${unit === 'us' ? 'microseconds' : unit === 'ms' ? 'milliseconds' : 'seconds'}`,
    };
  }
  if (channel === 'vbat') {
    return max > 100
      ? { unit: 'mV', why: `${range} look like millivolts` }
      : { unit: 'V', why: `${range} look like volts` };
  }
  return null;
}

/** The confirmed part of a proposal as a column map (entries with a channel and a unit). */
export function proposalToColumnMap(proposal: ProposedColumnMap): ColumnMap {
  const columns: ColumnMap['columns'] = {};
  for (const e of proposal.entries) {
    if (e.channel !== null && e.unit !== null && e.unit !== 'raw') {
      columns[e.header] = { channel: e.channel, unit: e.unit };
    }
  }
  return { columns };
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
