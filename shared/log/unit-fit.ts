import { channelFamily, conversionFor, convert, type Unit } from './channels';
import { medianStepOf, unitFromValues, type LikelyUnit } from './unit-from-values';

/**
 * Whether a column's values fit the unit it is read in. A 1000–2000 µs motor column read as a
 * 0–1 fraction imports without a single error and then says every motor was saturated all
 * flight; this catches such a map before anything is analysed. Limits are common practice for
 * multirotor logs, not a published standard.
 */

/** A 0–1 output above this is another unit (%, µs, a digital command), not overshoot. */
export const MAX_PLAUSIBLE_FRACTION = 1.2;
/** Logs sample at 2 Hz or faster; a step of half a second or more is not in seconds. */
const MAX_PLAUSIBLE_STEP_S = 0.5;
/** No flight controller logs faster than 100 kHz; a shorter step is in a smaller unit. */
const MIN_PLAUSIBLE_STEP_S = 1e-5;
/** An accelerometer's typical reading in g above this is m/s² (at rest it reads about 1 g). */
const MAX_PLAUSIBLE_TYPICAL_G = 4;
/** No multirotor pack reaches 100 V; millivolts do. Below 1 V a pack is not connected. */
const MAX_PLAUSIBLE_VOLTS = 100;
/** A gyro's range tops out near 2000 deg/s, about 35 rad/s. */
const MAX_PLAUSIBLE_RAD_S = 40;
/** No ESC or pack of ours passes 500 A; milliamps do. */
const MAX_PLAUSIBLE_AMPS = 500;

export interface UnitDoubt {
  /** 'stalled': a time that does not move forward; 'off-scale': values outside the unit's scale. */
  kind: 'stalled' | 'off-scale';
  /** What the values show against the unit, to follow "but …" in a sentence. */
  finding: string;
  /** The unit the values fit better, when they fit one. */
  likely: LikelyUnit | null;
}

const UNIT_WORDS: Partial<Record<Unit, string>> = {
  s: 'seconds',
  ms: 'milliseconds',
  us: 'µs',
  frac: 'a 0–1 fraction',
  '%': 'a percentage',
  raw: 'raw values',
  'deg/s': 'deg/s',
  'rad/s': 'rad/s',
  g: 'g',
  'm/s2': 'm/s²',
  V: 'volts',
  mV: 'millivolts',
  A: 'amps',
  mA: 'milliamps',
};

/** A unit in words for a channel: "a 0–1 fraction", "a 1000–2000 µs pulse", "microseconds". */
export function describeUnit(
  unit: Unit,
  channel: string,
  range?: { min?: number; max?: number },
): string {
  if (unit === 'raw' && range?.min !== undefined && range.max !== undefined)
    return `raw values ${range.min}–${range.max}`;
  if (unit === 'us') return channel === 'time' ? 'microseconds' : 'a 1000–2000 µs pulse';
  return UNIT_WORDS[unit] ?? unit;
}

const fmt = (v: number) => (Math.abs(v) >= 100 || v === 0 ? v.toFixed(0) : v.toPrecision(3));

function extent(values: number[]): { min: number; max: number; typical: number } {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const abs = values.map(Math.abs).sort((a, b) => a - b);
  return { min, max, typical: abs[abs.length >> 1]! };
}

/** Offers the values' own unit only when it differs from the one in use. */
function other(channel: string, inUnit: number[], unit: Unit): LikelyUnit | null {
  const likely = unitFromValues(channel, inUnit);
  return likely && likely.unit !== unit ? likely : null;
}

/**
 * Doubts about reading `inUnit` (values as written in `unit`, after any scale and offset) as
 * `unit` on `channel`; null when they fit or say nothing. Time values must be consecutive
 * samples; other channels may be any sample of the column.
 */
export function doubtUnit(
  channel: string,
  unit: Unit,
  inUnit: number[],
  range: { min?: number; max?: number } = {},
): UnitDoubt | null {
  const family = channelFamily(channel);
  const values = inUnit.filter((v) => Number.isFinite(v));
  if (!family || values.length === 0) return null;
  const conversion = conversionFor(channel, unit, range);
  if (typeof conversion === 'string') return null; // the map itself is refused elsewhere
  const canonical = values.map((v) => convert(v, conversion));
  const { min, max, typical } = extent(canonical);
  const written = extent(values);
  switch (family.id) {
    case 'time': {
      if (values.length < 2) return null; // one sample has no step to judge
      const step = medianStepOf(canonical);
      if (!(step > 0))
        return {
          kind: 'stalled',
          finding: `it does not increase from one sample to the next (median step ${fmt(medianStepOf(values))})`,
          likely: null,
        };
      if (step >= MAX_PLAUSIBLE_STEP_S || step < MIN_PLAUSIBLE_STEP_S)
        return {
          kind: 'off-scale',
          finding: `samples are ${fmt(step)} s apart (${fmt(1 / step)} Hz)`,
          likely: other(channel, values, unit),
        };
      return null;
    }
    case 'motor':
    case 'throttle':
      if (max > MAX_PLAUSIBLE_FRACTION || min < -0.2)
        return {
          kind: 'off-scale',
          finding: `it reaches ${fmt(written.max)}, which is ${fmt(max * 100)} % of full output`,
          likely: other(channel, values, unit),
        };
      return null;
    case 'acc':
      if (typical > MAX_PLAUSIBLE_TYPICAL_G)
        return {
          kind: 'off-scale',
          finding: `it reads near ${fmt(typical)} g most of the time (at rest an accelerometer reads about 1 g)`,
          likely: other(channel, values, unit),
        };
      if (unit === 'm/s2' && typical > 0.06 && typical < 0.14)
        return {
          kind: 'off-scale',
          finding: `it reads near ${fmt(typical)} g most of the time, ten times too little if the board was level`,
          likely: other(channel, values, unit),
        };
      return null;
    case 'gyro':
    case 'sp':
      if (unit === 'rad/s' && Math.max(-written.min, written.max) > MAX_PLAUSIBLE_RAD_S)
        return {
          kind: 'off-scale',
          finding: `it reaches ${fmt(Math.max(-min, max))} deg/s, beyond any gyro's range`,
          likely: other(channel, values, unit),
        };
      return null;
    case 'vbat':
      if (typical > MAX_PLAUSIBLE_VOLTS || (unit === 'mV' && typical > 0.001 && typical < 1))
        return {
          kind: 'off-scale',
          finding: `it sits near ${fmt(typical)} V`,
          likely: other(channel, values, unit),
        };
      return null;
    case 'ibat':
    case 'imotor':
      if (max > MAX_PLAUSIBLE_AMPS)
        return {
          kind: 'off-scale',
          finding: `it reaches ${fmt(max)} A`,
          likely: other(channel, values, unit),
        };
      return null;
    default:
      return null;
  }
}

/** How the unit came about: assumed (no unit written), or written in the header or a map. */
export type UnitSource = 'assumed' | 'stated';

/** The doubt as a sentence a pilot can act on, with the likely unit offered. */
export function doubtMessage(
  channel: string,
  unit: Unit,
  doubt: UnitDoubt,
  source: UnitSource,
  header: string,
  range: { min?: number; max?: number } = {},
): string {
  const { finding, likely } = doubt;
  const named = header === channel ? channel : `${channel} ("${header}")`;
  if (source === 'assumed') {
    const first = `${named} has no unit, so it was read as ${describeUnit(unit, channel)}, but ${finding}.`;
    if (!likely) return `${first} Write its unit in the header, or map it in a column map.`;
    if (likely.unit === 'raw')
      return `${first} The ${likely.why}: map it as raw ${likely.min}–${likely.max} in a column map.`;
    return `${first} The ${likely.why}: say so in the header, "${channel} [${likely.unit}]".`;
  }
  const first = `${named} is read as ${describeUnit(unit, channel, range)}, but ${finding}.`;
  if (!likely)
    return channel === 'time'
      ? `${first} Check that this column is the sample time, and its unit.`
      : `${first} Check its unit.`;
  const instead = describeUnit(likely.unit, channel, likely);
  return `${first} The ${likely.why}: read it as ${instead} instead.`;
}
