import type { PeakLabel } from '../schemas/report';

/**
 * Naming a vibration peak by its cause: a rotor order (once per turn, twice per turn, blade
 * pass, folded down from above Nyquist when the log rate is too low for it), a frame mode that
 * holds its frequency while the rotors change speed, or neither.
 */

/** Height of bin k above the median of its ±12-bin neighbourhood (excluding ±2), dB. */
function prominenceAt(db: ArrayLike<number>, k: number): number {
  const vals: number[] = [];
  for (let j = Math.max(1, k - 12); j <= Math.min(db.length - 1, k + 12); j++) {
    if (Math.abs(j - k) > 2 && Number.isFinite(db[j]!)) vals.push(db[j]!);
  }
  if (!vals.length) return 0;
  vals.sort((a, b) => a - b);
  let top = -Infinity;
  for (let j = Math.max(0, k - 1); j <= Math.min(db.length - 1, k + 1); j++)
    top = Math.max(top, db[j]!);
  return top - vals[vals.length >> 1]!;
}

export interface LabelContext {
  /** Typical rotation frequency of each motor, Hz (empty without rpm). */
  motorHz: number[];
  /** Each motor's rotation frequency per Welch segment, Hz, to match orders flown only part of the time. */
  motorSegHz?: readonly ArrayLike<number>[];
  /** Log rate, Hz: orders above Nyquist fold back (tests/REFERENCES.md §3). */
  fs: number;
  /** Magnet poles, for the motors' electrical frequency (pole pairs × rotation). */
  poles?: number;
  blades: number;
  df: number;
  /**
   * Short-time spectra grouped by rotor speed (or throttle): the mean value of the segments in
   * the row, their mean spectrum in dB and, optionally, in linear units with the segment count.
   */
  rows: { value: number; db: Float64Array; power?: Float64Array; count?: number }[];
  /** Width of a row in its own units (rpm or throttle), for the spread of speeds within it. */
  rowWidth?: number;
  by: 'rpm' | 'throttle';
}

/** Median of the bins within ±12 of k (leaving out ±2), linear units: the floor under a peak. */
function floorAt(p: ArrayLike<number>, k: number): number {
  const vals: number[] = [];
  for (let j = Math.max(1, k - 12); j <= Math.min(p.length - 1, k + 12); j++) {
    if (Math.abs(j - k) > 2 && p[j]! === p[j]!) vals.push(p[j]!);
  }
  if (!vals.length) return 0;
  vals.sort((a, b) => a - b);
  return vals[vals.length >> 1]!;
}

/**
 * Share of a peak's energy above the local floor, summed over the short-time spectra, that comes
 * from rows whose own order-h line (folded by the log rate when above Nyquist) passes through
 * the peak: near 1 for a line that follows the rotors even when they ran there only briefly (a
 * punch-out), near 0 for a line that holds its frequency while they change speed.
 */
function orderEnergyShare(
  hz: number,
  h: number,
  folded: boolean,
  ctx: LabelContext,
  tol: (f: number) => number,
): number {
  const { rows, df, fs } = ctx;
  const k = Math.round(hz / df);
  const half = ((ctx.rowWidth ?? 0) / 2 / 60) * h;
  let on = 0;
  let all = 0;
  for (const row of rows) {
    const p = row.power;
    if (!p || k <= 0 || k >= p.length) continue;
    let top = 0;
    for (let j = Math.max(1, k - 1); j <= Math.min(p.length - 1, k + 1); j++)
      top = Math.max(top, p[j]!);
    const excess = Math.max(0, top - floorAt(p, k)) * (row.count ?? 1);
    if (!(excess > 0)) continue;
    all += excess;
    const at = (h * row.value) / 60;
    if (folded !== at > fs / 2) continue;
    const f = Math.abs(at - fs * Math.round(at / fs));
    if (Math.abs(hz - f) <= tol(at) + half) on += excess;
  }
  return all > 0 ? on / all : 0;
}

/**
 * rotor-1x / blade-pass / rotor-2x when the peak sits on that order of some motor's typical
 * speed and, where the flight covered other speeds, the energy moved with the rotors; `frame`
 * when the peak holds its frequency across rows of different rotor speed or throttle. `motor`
 * is set when exactly one motor's order line matches.
 */
export function labelPeak(
  hz: number,
  ctx: LabelContext,
): { label: PeakLabel; motor?: number; aliasOfHz?: number } {
  const { motorHz, blades, df, rows, by, fs } = ctx;
  const fold = (f: number) => Math.abs(f - fs * Math.round(f / fs));
  const tol = (f: number) => Math.max(1.5 * df, 0.03 * f);
  const orders: [Exclude<PeakLabel, null | 'frame'>, number][] = [
    ['rotor-1x', 1],
    ['blade-pass', blades],
    ['rotor-2x', 2],
  ];
  let match: [Exclude<PeakLabel, null | 'frame'>, number] | undefined;
  let motors: number[] = [];
  let aliasOfHz: number | undefined;
  // Orders seen directly win over orders folded down from above Nyquist.
  // A motor matches an order at its typical speed, or when at least a tenth of the flight was
  // flown at a speed that puts the order here (a punch-out or a long climb shows up too).
  const share = (m: number, h: number, folded: boolean) => {
    const seg = ctx.motorSegHz?.[m];
    if (!seg || seg.length === 0) return 0;
    let c = 0;
    for (let j = 0; j < seg.length; j++) {
      const at = h * seg[j]!;
      if (folded === at > fs / 2 && Math.abs(hz - fold(at)) <= tol(at)) c++;
    }
    return c / seg.length;
  };
  search: for (const folded of [false, true]) {
    for (const o of orders) {
      let hits = motorHz.flatMap((f, i) => {
        const at = o[1] * f;
        if (folded !== at > fs / 2) return [];
        return Math.abs(hz - fold(at)) <= tol(at) ? [i + 1] : [];
      });
      if (!hits.length)
        hits = motorHz.flatMap((_, i) => (share(i, o[1], folded) >= 0.1 ? [i + 1] : []));
      if (hits.length) {
        match = o;
        motors = hits;
        if (folded) aliasOfHz = o[1] * motorHz[hits[0]! - 1]!;
        break search;
      }
    }
  }
  if (!match && by === 'rpm' && motorHz.length) {
    // Orders the rotors reached only for a moment: most of the peak's energy sits in the
    // short-time spectra whose own order line runs through it (Campbell rows).
    energy: for (const folded of [false, true]) {
      for (const o of orders) {
        if (orderEnergyShare(hz, o[1], folded, ctx, tol) >= 0.6) {
          match = o;
          if (folded) {
            const top = rows.reduce((m, r) => Math.max(m, r.value), 0);
            aliasOfHz = (o[1] * top) / 60;
          }
          break energy;
        }
      }
    }
    if (match) {
      const extraE = aliasOfHz !== undefined ? { aliasOfHz } : {};
      return { label: match[0], ...extraE };
    }
  }
  const extra = aliasOfHz !== undefined ? { aliasOfHz } : {};
  const mean = motorHz.length ? motorHz.reduce((a, b) => a + b, 0) / motorHz.length : 0;
  const k = Math.round(hz / df);
  // Rows whose own order line is well away from this frequency tell rotor from frame.
  let frameVotes = 0;
  let rotorVotes = 0;
  let far = 0;
  for (const row of rows) {
    if (k <= 0 || k >= row.db.length) continue;
    if (match && by === 'rpm') {
      // Shift the row's mean speed to the matched motors' share of it.
      const ratio =
        mean > 0 ? motors.reduce((s, m) => s + motorHz[m - 1]!, 0) / motors.length / mean : 1;
      const kOrder = Math.round(fold((match[1] * ratio * row.value) / 60) / df);
      if (Math.abs(kOrder - k) <= 3 || kOrder <= 0 || kOrder >= row.db.length) continue;
      far++;
      if (prominenceAt(row.db, kOrder) >= 6) rotorVotes++;
      if (prominenceAt(row.db, k) >= 6) frameVotes++;
    } else {
      far++;
      if (prominenceAt(row.db, k) >= 6) frameVotes++;
    }
  }
  if (match) {
    if (far >= 2 && frameVotes > rotorVotes && frameVotes >= Math.max(2, far / 2))
      return { label: 'frame' };
    return motors.length === 1
      ? { label: match[0], motor: motors[0]!, ...extra }
      : { label: match[0], ...extra };
  }
  if (far >= 3 && frameVotes >= Math.max(3, 0.6 * far)) return { label: 'frame' };
  if (ctx.poles && motorHz.length) {
    // Motor electrical frequency, usually folded down from far above the log rate: not one of
    // our labels, but worth naming in the finding.
    const pp = ctx.poles / 2;
    const hit = motorHz.find((f) => Math.abs(hz - fold(pp * f)) <= tol(f));
    if (hit !== undefined) return { label: null, aliasOfHz: pp * hit };
  }
  return { label: null };
}
