import type { Trace } from './review-detail';

/**
 * Min/max bucket downsampling for charts: each bucket keeps its smallest and largest value of
 * every series, in time order, so spikes survive while the point count stays at `maxPoints`.
 * Plain arrays out (JSON and structured-clone friendly).
 */
export function downsampleMinMax(
  time: ArrayLike<number>,
  series: Record<string, ArrayLike<number>>,
  maxPoints = 4000,
  range: readonly [number, number] = [0, time.length],
): Trace {
  const [r0, r1] = range;
  const n = Math.max(0, r1 - r0);
  const names = Object.keys(series);
  const out: Trace = { t: [], series: Object.fromEntries(names.map((k) => [k, [] as number[]])) };
  if (n === 0) return out;
  if (n <= maxPoints) {
    for (let i = r0; i < r1; i++) out.t.push(time[i]!);
    for (const k of names) {
      const s = series[k]!;
      const dst = out.series[k]!;
      for (let i = r0; i < r1; i++) dst.push(s[i]!);
    }
    return out;
  }
  const buckets = Math.max(1, Math.floor(maxPoints / 2));
  const bounds: number[] = [];
  for (let b = 0; b <= buckets; b++) bounds.push(r0 + Math.floor((b * n) / buckets));
  for (let b = 0; b < buckets; b++) {
    out.t.push(time[bounds[b]!]!, time[bounds[b + 1]! - 1]!);
  }
  for (const k of names) {
    const s = series[k]!;
    const dst = out.series[k]!;
    for (let b = 0; b < buckets; b++) {
      const a = bounds[b]!;
      const e = bounds[b + 1]!;
      let lo = Infinity;
      let hi = -Infinity;
      let iLo = a;
      let iHi = a;
      for (let i = a; i < e; i++) {
        const v = s[i]!;
        if (v < lo) {
          lo = v;
          iLo = i;
        }
        if (v > hi) {
          hi = v;
          iHi = i;
        }
      }
      if (!Number.isFinite(lo)) dst.push(NaN, NaN);
      else if (iLo <= iHi) dst.push(lo, hi);
      else dst.push(hi, lo);
    }
  }
  return out;
}
