import type { Column } from '../log/types';
import type { Ranges } from './segments';

/** Shortest demodulation window, s; longer windows are whole runs of these. */
const STEP_S = 0.25;
/** Window lengths tried, in steps: 0.25 s to 2 s. */
const SCALES = [1, 2, 4, 8] as const;
/**
 * Two motors' references count as told apart in a window when the mean of e^{i(φa − φb)} over
 * it is at most this: their phases slipped far enough for one's line to wash out in the other's
 * demodulation.
 */
const MAX_OVERLAP = 0.3;
/** A motor beats another when it keeps at least twice the power (3 dB) where the two separate. */
const WIN_RATIO = 2;
/** Windows two motors must separate in before either can beat the other. */
const MIN_WINDOWS = 2;

/**
 * Which motor a rotor-order vibration comes from, by order tracking: the gyro is demodulated
 * with each motor's own rotation phase (integrated from its logged rpm, continuous across each
 * range). The source rotor stays phase-locked and keeps its power; another drifts out of phase
 * and loses it. Motors are compared two at a time, only over windows (0.25–2 s) in which their
 * two references have slipped apart (a diagonal pair of a quad that turns at nearly the same
 * speed separates only over the longer windows of a roll or pitch). A motor beaten by another
 * (3 dB less where they separate) is cleared; `candidates` are the motors no one beat, most wins
 * first, and `motor` is set when that is a single motor. Motors that never separate stay
 * candidates together; more than half the motors in the running says nothing.
 */
export function attributeOrder(
  channels: readonly Column[],
  rpms: readonly Column[],
  ranges: Ranges,
  fs: number,
  harmonic: number,
): { motor: number | null; candidates: number[]; windows: number } {
  const n = rpms.length;
  const nc = channels.length;
  const len = Math.max(8, Math.round(STEP_S * fs));
  const pairs = (n * (n - 1)) / 2;
  // Evidence per ordered pair [a·n + b]: a's power summed over windows where a and b separate.
  const evidence = new Float64Array(n * n);
  const together = new Float64Array(n * n);
  const k = (2 * Math.PI * harmonic) / 60 / fs;
  // Difference frequencies up to about 25 Hz are sampled at least 8 times a cycle.
  const thin = Math.max(1, Math.floor(fs / 200));
  const phase = new Float64Array(n);
  const cos = new Float64Array(n);
  const sin = new Float64Array(n);
  let used = 0;
  for (let ri = 0; ri < ranges.length; ri++) {
    const a0 = ranges[ri]![0];
    const b0 = ranges[ri]![1];
    const steps = Math.floor((b0 - a0) / len);
    if (steps < 1) continue;
    // Per step: demodulated sums per motor and channel, and the pairs' reference products.
    const dRe = new Float64Array(steps * n * nc);
    const dIm = new Float64Array(steps * n * nc);
    const rRe = new Float64Array(steps * pairs);
    const rIm = new Float64Array(steps * pairs);
    const ok = new Uint8Array(steps);
    phase.fill(0);
    for (let s = 0; s < steps; s++) {
      const start = a0 + s * len;
      let hi = 0;
      for (let m = 0; m < n; m++) {
        const r = rpms[m]!;
        let sum = 0;
        for (let i = start; i < start + len; i++) sum += r[i]!;
        hi = Math.max(hi, (harmonic * sum) / len / 60);
      }
      // Orders above Nyquist fold: the logged phase no longer describes what the gyro saw.
      ok[s] = hi > 0 && hi * 2 < fs ? 1 : 0;
      const dBase = s * n * nc;
      const rBase = s * pairs;
      for (let i = start; i < start + len; i++) {
        for (let m = 0; m < n; m++) {
          const w = rpms[m]![i]!;
          if (w === w) phase[m]! += k * w;
          cos[m] = Math.cos(phase[m]!);
          sin[m] = Math.sin(phase[m]!);
          for (let ch = 0; ch < nc; ch++) {
            const v = channels[ch]![i]!;
            if (v !== v) continue;
            dRe[dBase + m * nc + ch]! += v * cos[m]!;
            dIm[dBase + m * nc + ch]! -= v * sin[m]!;
          }
        }
        // The pairs' phase differences move slowly (a few Hz): sampled every `thin` samples.
        if ((i - start) % thin !== 0) continue;
        let p = rBase;
        for (let a = 0; a < n; a++) {
          for (let b = a + 1; b < n; b++, p++) {
            // e^{iφa}·e^{−iφb}, standing for the `thin` samples up to the next one taken
            rRe[p]! += thin * (cos[a]! * cos[b]! + sin[a]! * sin[b]!);
            rIm[p]! += thin * (sin[a]! * cos[b]! - cos[a]! * sin[b]!);
          }
        }
      }
    }
    const sumRe = new Float64Array(n * nc);
    const sumIm = new Float64Array(n * nc);
    const pRe = new Float64Array(pairs);
    const pIm = new Float64Array(pairs);
    const power = new Float64Array(n);
    for (const scale of SCALES) {
      for (let s0 = 0; s0 + scale <= steps; s0 += scale) {
        let good = true;
        for (let s = s0; s < s0 + scale; s++) if (!ok[s]) good = false;
        if (!good) continue;
        sumRe.fill(0);
        sumIm.fill(0);
        pRe.fill(0);
        pIm.fill(0);
        for (let s = s0; s < s0 + scale; s++) {
          for (let j = 0; j < n * nc; j++) {
            sumRe[j]! += dRe[s * n * nc + j]!;
            sumIm[j]! += dIm[s * n * nc + j]!;
          }
          for (let j = 0; j < pairs; j++) {
            pRe[j]! += rRe[s * pairs + j]!;
            pIm[j]! += rIm[s * pairs + j]!;
          }
        }
        const samples = scale * len;
        for (let m = 0; m < n; m++) {
          let pw = 0;
          for (let ch = 0; ch < nc; ch++) {
            const j = m * nc + ch;
            pw += sumRe[j]! * sumRe[j]! + sumIm[j]! * sumIm[j]!;
          }
          power[m] = pw / (samples * samples);
        }
        let p = 0;
        let any = false;
        for (let a = 0; a < n; a++) {
          for (let b = a + 1; b < n; b++, p++) {
            if (Math.hypot(pRe[p]!, pIm[p]!) / samples > MAX_OVERLAP) continue;
            evidence[a * n + b]! += power[a]!;
            evidence[b * n + a]! += power[b]!;
            together[a * n + b]!++;
            any = true;
          }
        }
        if (any) used++;
      }
    }
  }
  if (used === 0 || n < 2) return { motor: null, candidates: [], windows: used };
  const wins = new Float64Array(n);
  const beaten = new Uint8Array(n);
  const total = new Float64Array(n);
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      if (together[a * n + b]! < MIN_WINDOWS) continue;
      const ea = evidence[a * n + b]!;
      const eb = evidence[b * n + a]!;
      total[a]! += ea;
      total[b]! += eb;
      if (ea >= WIN_RATIO * eb && ea > 0) {
        wins[a]!++;
        beaten[b] = 1;
      } else if (eb >= WIN_RATIO * ea && eb > 0) {
        wins[b]!++;
        beaten[a] = 1;
      }
    }
  }
  const candidates = Array.from({ length: n }, (_, m) => m)
    .filter((m) => !beaten[m])
    .sort((x, y) => wins[y]! - wins[x]! || total[y]! - total[x]!)
    .map((m) => m + 1);
  if (candidates.length === 0 || candidates.length > n / 2)
    return { motor: null, candidates: [], windows: used };
  return { motor: candidates.length === 1 ? candidates[0]! : null, candidates, windows: used };
}
