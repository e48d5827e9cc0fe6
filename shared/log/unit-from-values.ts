import type { Unit } from './channels';

/**
 * A unit suggested by the first values of a column whose header names none (common practice
 * for flight logs: a 1000–2000 µs pulse, a step of hundreds of µs or a few ms, pack voltage in
 * mV above 100).
 */
export function unitFromValues(
  channel: string,
  values: number[],
): { unit: Unit; why: string } | null {
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
