import type { ParsedLog } from './types';

/**
 * The channel registry: our canonical channel names (shared/log/FORMAT.md), the units each accepts
 * and how a value in that unit becomes the canonical unit.
 */

/** Unit spellings as we write them; the first unit of a family is its default. */
export type Unit =
  | 's'
  | 'ms'
  | 'us'
  | 'frac'
  | '%'
  | 'raw'
  | 'rpm'
  | 'erpm'
  | 'Hz'
  | 'deg/s'
  | 'rad/s'
  | 'g'
  | 'm/s2'
  | 'V'
  | 'mV'
  | 'A'
  | 'mA';

export interface ChannelFamily {
  /** 'motor' for motor1…motorN; the full name for single channels. */
  id: string;
  /** Channel names this family covers (indexed families list the pattern). */
  names: readonly string[];
  indexed: boolean;
  /** Accepted units, default first. */
  units: readonly Unit[];
  /** Unit the column holds after import. */
  canonicalUnit: Unit;
  meaning: string;
}

/** Highest index accepted for motorN, rpmN, imotorN (an octocopter needs 8; coaxial X8 too). */
export const MAX_MOTORS = 16;

export const CHANNEL_FAMILIES: readonly ChannelFamily[] = [
  {
    id: 'time',
    names: ['time'],
    indexed: false,
    units: ['s', 'ms', 'us'],
    canonicalUnit: 's',
    meaning: 'sample time',
  },
  {
    id: 'motor',
    names: ['motorN'],
    indexed: true,
    units: ['frac', '%', 'us', 'raw'],
    canonicalUnit: 'frac',
    meaning: 'motor output command',
  },
  {
    id: 'rpm',
    names: ['rpmN'],
    indexed: true,
    units: ['rpm', 'erpm', 'Hz'],
    canonicalUnit: 'rpm',
    meaning: 'rotor speed',
  },
  {
    id: 'gyro',
    names: ['gyro_x', 'gyro_y', 'gyro_z'],
    indexed: false,
    units: ['deg/s', 'rad/s'],
    canonicalUnit: 'deg/s',
    meaning: 'body rate (roll, pitch, yaw)',
  },
  {
    id: 'acc',
    names: ['acc_x', 'acc_y', 'acc_z'],
    indexed: false,
    units: ['g', 'm/s2'],
    canonicalUnit: 'g',
    meaning: 'specific force',
  },
  {
    id: 'sp',
    names: ['sp_roll', 'sp_pitch', 'sp_yaw'],
    indexed: false,
    units: ['deg/s', 'rad/s'],
    canonicalUnit: 'deg/s',
    meaning: 'rate setpoint',
  },
  {
    id: 'throttle',
    names: ['throttle'],
    indexed: false,
    units: ['frac', '%', 'us', 'raw'],
    canonicalUnit: 'frac',
    meaning: 'pilot throttle',
  },
  {
    id: 'vbat',
    names: ['vbat'],
    indexed: false,
    units: ['V', 'mV'],
    canonicalUnit: 'V',
    meaning: 'pack voltage',
  },
  {
    id: 'ibat',
    names: ['ibat'],
    indexed: false,
    units: ['A', 'mA'],
    canonicalUnit: 'A',
    meaning: 'pack current',
  },
  {
    id: 'imotor',
    names: ['imotorN'],
    indexed: true,
    units: ['A', 'mA'],
    canonicalUnit: 'A',
    meaning: 'per-ESC current',
  },
];

const byName = new Map<string, ChannelFamily>();
const indexedFamilies: ChannelFamily[] = [];
for (const f of CHANNEL_FAMILIES) {
  if (f.indexed) indexedFamilies.push(f);
  else for (const n of f.names) byName.set(n, f);
}

/** The family of a canonical channel name ('motor3' → motor), or null when it is not ours. */
export function channelFamily(name: string): ChannelFamily | null {
  const direct = byName.get(name);
  if (direct) return direct;
  const m = /^([a-z]+)([1-9][0-9]?)$/.exec(name);
  if (!m) return null;
  const index = Number(m[2]);
  if (index > MAX_MOTORS) return null;
  return indexedFamilies.find((f) => f.id === m[1]) ?? null;
}

export function isChannelName(name: string): boolean {
  return channelFamily(name) !== null;
}

/** Every canonical name a pilot can pick in a column map, for up to `motors` motors. */
export function channelNames(motors = 8): string[] {
  const out: string[] = [];
  for (const f of CHANNEL_FAMILIES) {
    if (!f.indexed) out.push(...f.names);
    else for (let i = 1; i <= motors; i++) out.push(`${f.id}${i}`);
  }
  return out;
}

const unitAliases: Record<string, Unit> = {
  s: 's',
  sec: 's',
  ms: 'ms',
  us: 'us',
  µs: 'us',
  μs: 'us',
  frac: 'frac',
  '%': '%',
  pct: '%',
  percent: '%',
  raw: 'raw',
  rpm: 'rpm',
  erpm: 'erpm',
  hz: 'Hz',
  'deg/s': 'deg/s',
  '°/s': 'deg/s',
  dps: 'deg/s',
  'rad/s': 'rad/s',
  g: 'g',
  'm/s2': 'm/s2',
  'm/s^2': 'm/s2',
  'm/s²': 'm/s2',
  v: 'V',
  mv: 'mV',
  a: 'A',
  ma: 'mA',
};

/** Our spelling of a unit as written in a header or column map ('RAD/S' → 'rad/s'), or null. */
export function normalizeUnit(text: string): Unit | null {
  const key = text.trim().toLowerCase();
  return Object.hasOwn(unitAliases, key) ? unitAliases[key]! : null;
}

/**
 * canonical = (value + shift) × mul ÷ div. Division is kept separate so that definitions
 * such as "1 ms = 1/1000 s" are applied exactly as written.
 */
export interface Conversion {
  shift: number;
  mul: number;
  div: number;
}

export const IDENTITY: Conversion = { shift: 0, mul: 1, div: 1 };

/** Standard acceleration of gravity, m/s² (ISO 80000-3; 3rd CGPM, 1901). */
export const STANDARD_GRAVITY = 9.80665;

export interface ConversionInput {
  /** Motor pole count, needed for erpm (electrical rpm = mechanical rpm × poles / 2). */
  poles?: number;
  /** Raw range mapped to 0–1 for unit 'raw'. */
  min?: number;
  max?: number;
}

/**
 * How to turn `unit` into the canonical unit of `channel`; a string says what is missing or
 * wrong, in a pilot's words.
 */
export function conversionFor(
  channel: string,
  unit: Unit,
  input: ConversionInput = {},
): Conversion | string {
  const family = channelFamily(channel);
  if (!family) return `"${channel}" is not one of our channels`;
  if (!family.units.includes(unit)) {
    return `${channel} can be written in ${family.units.join(', ')}, not ${unit}`;
  }
  switch (unit) {
    case 's':
    case 'frac':
    case 'rpm':
    case 'deg/s':
    case 'g':
    case 'V':
    case 'A':
      return IDENTITY;
    case 'ms':
    case 'mV':
    case 'mA':
      return { shift: 0, mul: 1, div: 1000 };
    case 'us':
      // On a time column µs are microseconds; on an output they are a 1000–2000 µs pulse.
      return family.id === 'time'
        ? { shift: 0, mul: 1, div: 1_000_000 }
        : { shift: -1000, mul: 1, div: 1000 };
    case '%':
      return { shift: 0, mul: 1, div: 100 };
    case 'raw': {
      const { min, max } = input;
      if (
        min === undefined ||
        max === undefined ||
        !Number.isFinite(min) ||
        !Number.isFinite(max)
      ) {
        return `${channel} is in raw units: give the raw value at 0 % (min) and at 100 % (max) in the column map`;
      }
      if (max === min) return `${channel}: the raw range min and max must differ`;
      return { shift: -min, mul: 1, div: max - min };
    }
    case 'erpm': {
      const poles = input.poles;
      if (poles === undefined || !Number.isInteger(poles) || poles < 2 || poles % 2 !== 0) {
        return `${channel} is in eRPM: enter the motor's pole count (an even number, e.g. 14) to get rotor rpm`;
      }
      return { shift: 0, mul: 2, div: poles };
    }
    case 'Hz':
      return { shift: 0, mul: 60, div: 1 };
    case 'rad/s':
      return { shift: 0, mul: 180, div: Math.PI };
    case 'm/s2':
      return { shift: 0, mul: 1, div: STANDARD_GRAVITY };
  }
}

export function isIdentity(c: Conversion): boolean {
  return c.shift === 0 && c.mul === 1 && c.div === 1;
}

/** Applies a conversion to one value. */
export function convert(value: number, c: Conversion): number {
  return ((value + c.shift) * c.mul) / c.div;
}

/** Number of motor output columns (motor1…motorN; the reader guarantees no holes). */
export function motorCount(log: Pick<ParsedLog, 'channels'>): number {
  let n = 0;
  for (const c of log.channels) if (/^motor[1-9][0-9]?$/.test(c)) n++;
  return n;
}

export function hasChannel(log: Pick<ParsedLog, 'channels'>, name: string): boolean {
  return log.channels.includes(name);
}
