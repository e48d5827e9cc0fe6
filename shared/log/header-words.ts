import { normalizeUnit, type Unit } from './channels';
import { splitHeader } from './column-map';

/**
 * Reading a foreign header for clues: its words, a unit it names, and the channel family and
 * axis or number those words suggest ("GyroX (rad/s)" → gyro, axis x, rad/s).
 */

export interface ParsedHeader {
  /** Lower-case words, numbers split off: "GyroX (rad/s)" → ['gyro', 'x']. */
  words: string[];
  /** Unit found in brackets or as a trailing word, if any. */
  unit: Unit | null;
  unitText: string | null;
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

export function parseWords(header: string): ParsedHeader {
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

export interface Guess {
  family: string;
  /** Axis or 1-based index (before zero-based correction); null when not needed. */
  slot: number | null;
  zeroBasedPossible: boolean;
  clue: string;
}

export function guessFamily(words: string[]): Guess | null {
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
export const numberedSet = (family: string, words: string[]) =>
  `${family}:${words.map((w) => (/^[0-9]{1,2}$/.test(w) ? '#' : w)).join(' ')}`;
