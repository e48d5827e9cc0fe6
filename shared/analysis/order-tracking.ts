import type { Column } from '../log/types';
import type { Ranges } from './segments';

/** Window of the synchronous demodulation, s: two tones 4 Hz apart no longer add up over it. */
const WINDOW_S = 0.25;

/**
 * Which motor a rotor-order vibration comes from, by order tracking: in windows where the motors
 * turn at clearly different speeds, the gyro is demodulated with each motor's own rotation
 * phase (integrated from its logged rpm). The source rotor stays phase-locked and keeps its
 * power; the others drift out of phase and lose it. `candidates` are the motors within 2× (3 dB)
 * of the strongest, strongest first; `motor` is set when that is a single motor. Motors that
 * never separate in speed (a diagonal pair that only splits in yaw) stay candidates together.
 */
export function attributeOrder(
  channels: readonly Column[],
  rpms: readonly Column[],
  ranges: Ranges,
  fs: number,
  harmonic: number,
): { motor: number | null; candidates: number[]; windows: number } {
  const n = rpms.length;
  const len = Math.max(8, Math.round(WINDOW_S * fs));
  const minSpread = 1 / WINDOW_S; // Hz between the fastest and slowest rotor order
  const power = new Float64Array(n);
  const re = new Float64Array(n * channels.length);
  const im = new Float64Array(n * channels.length);
  const phase = new Float64Array(n);
  const hz = new Float64Array(n);
  let used = 0;
  for (let ri = 0; ri < ranges.length; ri++) {
    const a = ranges[ri]![0];
    const b = ranges[ri]![1];
    for (let s = a; s + len <= b; s += len) {
      let lo = Infinity;
      let hi = -Infinity;
      for (let m = 0; m < n; m++) {
        const r = rpms[m]!;
        let sum = 0;
        for (let i = s; i < s + len; i++) sum += r[i]!;
        hz[m] = (harmonic * sum) / len / 60;
        lo = Math.min(lo, hz[m]!);
        hi = Math.max(hi, hz[m]!);
      }
      if (!(hi - lo >= minSpread) || hi * 2 >= fs) continue;
      used++;
      re.fill(0);
      im.fill(0);
      phase.fill(0);
      const k = (2 * Math.PI * harmonic) / 60 / fs;
      for (let i = s; i < s + len; i++) {
        for (let m = 0; m < n; m++) {
          const w = rpms[m]![i]!;
          if (w === w) phase[m]! += k * w;
          const c = Math.cos(phase[m]!);
          const sn = Math.sin(phase[m]!);
          for (let ch = 0; ch < channels.length; ch++) {
            const v = channels[ch]![i]!;
            if (v !== v) continue;
            re[m * channels.length + ch]! += v * c;
            im[m * channels.length + ch]! -= v * sn;
          }
        }
      }
      for (let m = 0; m < n; m++) {
        let p = 0;
        for (let ch = 0; ch < channels.length; ch++) {
          const j = m * channels.length + ch;
          p += re[j]! * re[j]! + im[j]! * im[j]!;
        }
        power[m]! += p / (len * len);
      }
    }
  }
  if (used === 0 || n < 2) return { motor: null, candidates: [], windows: used };
  const order = Array.from(power, (p, m) => [p, m] as const).sort((x, y) => y[0] - x[0]);
  const top = order[0]![0];
  const candidates = order.filter(([p]) => p * 2 >= top).map(([, m]) => m + 1);
  // More than half the motors in the running says nothing useful.
  if (candidates.length > n / 2) return { motor: null, candidates: [], windows: used };
  return { motor: candidates.length === 1 ? candidates[0]! : null, candidates, windows: used };
}
