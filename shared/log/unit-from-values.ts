import type { Unit } from './channels';

/** A unit the values of a column fit, with its range for 'raw', and why, in plain words. */
export interface LikelyUnit {
  unit: Unit;
  /** Raw value at 0 % and 100 %, for unit 'raw'. */
  min?: number;
  max?: number;
  why: string;
}

/**
 * The range digital ESC protocols use for a motor command: 48 is zero throttle, 2047 full
 * (values below 48 are reserved for commands; common practice, from memory).
 */
export const DIGITAL_COMMAND_RANGE = { min: 48, max: 2047 } as const;

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1]!;
};

/** Median step between consecutive values (NaN for fewer than two). */
export function medianStepOf(values: number[]): number {
  if (values.length < 2) return NaN;
  return median(values.slice(1).map((v, i) => v - values[i]!));
}

const fmt = (v: number) => (Math.abs(v) >= 100 || v === 0 ? v.toFixed(0) : v.toPrecision(3));

/**
 * The unit a column's values fit, for a channel (thresholds are common practice for multirotor
 * logs, not a published standard): a 1000–2000 µs pulse, the 48–2047 digital command range, a
 * percentage or a fraction for outputs; the step of a time column; about 9.8 at rest for m/s²
 * against about 1 for g; rates beyond any gyro's range in rad/s; pack voltage above 100 in mV;
 * currents above 500 in mA. Null when the values do not tell.
 */
export function unitFromValues(channel: string, values: number[]): LikelyUnit | null {
  const finite = values.filter((v) => Number.isFinite(v));
  if (finite.length === 0) return null;
  let min = Infinity;
  let max = -Infinity;
  for (const v of finite) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const range = `values ${fmt(min)}…${fmt(max)}`;
  if (/^motor[0-9]+$|^throttle$/.test(channel)) {
    if (min >= 900 && max <= 2100)
      return { unit: 'us', why: `${range} look like a 1000–2000 µs pulse` };
    if (min >= 0 && max <= 1) return { unit: 'frac', why: `${range} look like a 0–1 fraction` };
    if (min >= 0 && max <= 100) return { unit: '%', why: `${range} look like a percentage` };
    if (min >= 0 && max <= DIGITAL_COMMAND_RANGE.max)
      return {
        unit: 'raw',
        ...DIGITAL_COMMAND_RANGE,
        why: `${range} look like a digital ESC command (48 = stopped, 2047 = full)`,
      };
    return null;
  }
  if (channel === 'time') {
    const step = medianStepOf(finite);
    if (!(step > 0)) return null;
    const unit: Unit = step >= 50 ? 'us' : step >= 0.5 ? 'ms' : 's';
    const name = unit === 'us' ? 'microseconds' : unit === 'ms' ? 'milliseconds' : 'seconds';
    return { unit, why: `samples ${fmt(step)} apart look like ${name}` };
  }
  if (/^acc_[xyz]$/.test(channel)) {
    const typical = median(finite.map(Math.abs));
    if (typical >= 6 && typical <= 14)
      return { unit: 'm/s2', why: `values near ${fmt(typical)} look like m/s² (1 g = 9.81 m/s²)` };
    if (typical >= 0.6 && typical <= 1.4)
      return { unit: 'g', why: `values near ${fmt(typical)} look like g` };
    return null;
  }
  if (/^gyro_[xyz]$|^sp_(roll|pitch|yaw)$/.test(channel)) {
    const peak = Math.max(Math.abs(min), Math.abs(max));
    // 40 rad/s is over 2000 deg/s, the top of the usual gyro ranges.
    return peak > 40 ? { unit: 'deg/s', why: `values up to ${fmt(peak)} look like deg/s` } : null;
  }
  if (channel === 'vbat') {
    return max > 100
      ? { unit: 'mV', why: `${range} look like millivolts` }
      : { unit: 'V', why: `${range} look like volts` };
  }
  if (channel === 'ibat' || /^imotor[0-9]+$/.test(channel)) {
    return max > 500 ? { unit: 'mA', why: `${range} look like milliamps` } : null;
  }
  return null;
}
