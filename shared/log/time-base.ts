import type { LogWarning, TimeBase, TimeGap } from './types';

/** A step longer than this many median steps is a gap (common practice: a few lost samples). */
export const GAP_FACTOR = 4;
/** Jitter above this % of the median step is worth a warning (common practice). */
export const JITTER_WARN_PCT = 10;
const MAX_GAP_WARNINGS = 20;

export interface TimeBaseResult {
  timeBase: TimeBase;
  sampleRateHz: number;
  durationS: number;
  warnings: LogWarning[];
}

/** k-th smallest of `a` (reorders `a`); Hoare's selection, O(n) on average. */
export function selectKth(a: Float64Array, k: number): number {
  let lo = 0;
  let hi = a.length - 1;
  while (hi > lo) {
    const pivot = a[(lo + hi) >>> 1]!;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        const t = a[i]!;
        a[i] = a[j]!;
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else break;
  }
  return a[k]!;
}

/** Median of the steps of `time`, s. Time must hold no NaN. */
export function medianStep(time: Float64Array): number {
  const n = time.length - 1;
  if (n < 1) return 0;
  const steps = new Float64Array(n);
  for (let i = 0; i < n; i++) steps[i] = time[i + 1]! - time[i]!;
  const mid = n >>> 1;
  const upper = selectKth(steps, mid);
  if (n % 2 === 1) return upper;
  // Even count: the lower middle is the largest value left of `mid` after selection.
  let lower = -Infinity;
  for (let i = 0; i < mid; i++) if (steps[i]! > lower) lower = steps[i]!;
  return (lower + upper) / 2;
}

const fmt = (s: number) => (Math.abs(s) >= 10 ? s.toFixed(2) : s.toPrecision(3));

/**
 * Sample rate (from the median step), monotonicity, gaps and jitter of a time column in s.
 * `lineOfRow` turns a row index into the file line for messages.
 */
export function analyseTimeBase(
  time: Float64Array,
  lineOfRow: (row: number) => number,
): TimeBaseResult {
  const rows = time.length;
  const warnings: LogWarning[] = [];
  const median = medianStep(time);
  const gaps: TimeGap[] = [];
  let nonIncreasing = 0;
  let firstNonIncreasing = -1;
  let sumSq = 0;
  let regular = 0;
  let worst = 0;
  let worstRow = -1;
  for (let i = 1; i < rows; i++) {
    const step = time[i]! - time[i - 1]!;
    if (!(step > 0)) {
      nonIncreasing++;
      if (firstNonIncreasing < 0) firstNonIncreasing = i;
      continue;
    }
    if (median > 0 && step > GAP_FACTOR * median) {
      gaps.push({ tS: time[i - 1]!, durationS: step, line: lineOfRow(i) });
      continue;
    }
    if (median > 0) {
      const d = (step - median) / median;
      sumSq += d * d;
      regular++;
      if (Math.abs(d) > worst) {
        worst = Math.abs(d);
        worstRow = i;
      }
    }
  }
  const jitterPct = regular > 0 ? Math.sqrt(sumSq / regular) * 100 : 0;
  const sampleRateHz = median > 0 ? 1 / median : 0;
  const durationS = rows > 1 ? time[rows - 1]! - time[0]! : 0;

  if (nonIncreasing > 0) {
    const i = firstNonIncreasing;
    warnings.push({
      code: 'time-not-increasing',
      message: `Time does not increase at ${nonIncreasing} sample${nonIncreasing === 1 ? '' : 's'}, first at line ${lineOfRow(i)} (${fmt(time[i - 1]!)} s → ${fmt(time[i]!)} s). Those steps are kept as written; check the logger's clock.`,
      line: lineOfRow(i),
      tS: time[i]!,
    });
  }
  gaps.slice(0, MAX_GAP_WARNINGS).forEach((g) => {
    const missing = median > 0 ? Math.round(g.durationS / median) - 1 : 0;
    warnings.push({
      code: 'log-gap',
      message: `Gap in the log at ${fmt(g.tS)} s (line ${g.line}): time jumps ${fmt(g.durationS)} s, about ${missing} sample${missing === 1 ? '' : 's'} missing.`,
      line: g.line,
      tS: g.tS,
    });
  });
  if (gaps.length > MAX_GAP_WARNINGS) {
    warnings.push({
      code: 'log-gap',
      message: `${gaps.length - MAX_GAP_WARNINGS} more gaps in the log after ${fmt(gaps[MAX_GAP_WARNINGS]!.tS)} s (${gaps.length} in all).`,
      line: gaps[MAX_GAP_WARNINGS]!.line,
      tS: gaps[MAX_GAP_WARNINGS]!.tS,
    });
  }
  if (jitterPct > JITTER_WARN_PCT && worstRow > 0) {
    warnings.push({
      code: 'time-jitter',
      message: `Sample timing jitters by ${jitterPct.toFixed(0)} % of the ${fmt(median * 1000)} ms step (worst at ${fmt(time[worstRow]!)} s, line ${lineOfRow(worstRow)}). Spectra assume even sampling, so peaks may smear.`,
      line: lineOfRow(worstRow),
      tS: time[worstRow]!,
    });
  }
  return {
    timeBase: { medianStepS: median, nonIncreasingSteps: nonIncreasing, jitterPct, gaps },
    sampleRateHz,
    durationS,
    warnings,
  };
}
