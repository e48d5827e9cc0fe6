import { stageCoefficients, type Biquad } from './biquad';
import type { FilterSpec } from '../../schemas/filters';

export interface FilterResponse {
  hz: number[];
  /** 20·log10|H|, dB (−300 at an exact zero). */
  magDb: number[];
  /** Unwrapped-per-stage phase, degrees (sum of each stage's principal phase). */
  phaseDeg: number[];
  /** −dφ/dω, ms. */
  groupDelayMs: number[];
}

/** H(e^{jω}) of one section at ω rad/sample: returns re, im. */
function evalBiquad(c: Biquad, w: number): { re: number; im: number } {
  const c1 = Math.cos(w);
  const s1 = Math.sin(w);
  const c2 = Math.cos(2 * w);
  const s2 = Math.sin(2 * w);
  const nr = c.b0 + c.b1 * c1 + c.b2 * c2;
  const ni = -(c.b1 * s1 + c.b2 * s2);
  const dr = 1 + c.a1 * c1 + c.a2 * c2;
  const di = -(c.a1 * s1 + c.a2 * s2);
  const den = dr * dr + di * di;
  return { re: (nr * dr + ni * di) / den, im: (ni * dr - nr * di) / den };
}

/**
 * Group delay of a polynomial p(z⁻¹) = Σ p_k z⁻ᵏ at ω, in samples: Re{Σ k·p_k e^{−jωk} / Σ p_k e^{−jωk}}.
 * The section's delay is that of the numerator minus that of the denominator.
 */
function polyDelay(p: readonly number[], w: number): number {
  let nr = 0;
  let ni = 0;
  let dr = 0;
  let di = 0;
  for (let k = 0; k < p.length; k++) {
    const c = Math.cos(w * k);
    const s = -Math.sin(w * k);
    dr += p[k]! * c;
    di += p[k]! * s;
    nr += k * p[k]! * c;
    ni += k * p[k]! * s;
  }
  const den = dr * dr + di * di;
  if (den < 1e-300) return 0;
  return (nr * dr + ni * di) / den;
}

/** Magnitude, phase and group delay of a cascade at sample rate fs (Hz) and the given frequencies (Hz). */
export function filterResponse(
  specs: FilterSpec,
  fs: number,
  freqsHz: ArrayLike<number>,
): FilterResponse {
  const sections = specs.map((s) => stageCoefficients(s, fs));
  const out: FilterResponse = { hz: [], magDb: [], phaseDeg: [], groupDelayMs: [] };
  for (let i = 0; i < freqsHz.length; i++) {
    const f = freqsHz[i]!;
    const w = (2 * Math.PI * f) / fs;
    let mag = 1;
    let phase = 0;
    let delay = 0;
    for (const c of sections) {
      const h = evalBiquad(c, w);
      mag *= Math.hypot(h.re, h.im);
      phase += Math.atan2(h.im, h.re);
      delay += polyDelay([c.b0, c.b1, c.b2], w) - polyDelay([1, c.a1, c.a2], w);
    }
    out.hz.push(f);
    out.magDb.push(mag > 1e-15 ? 20 * Math.log10(mag) : -300);
    out.phaseDeg.push((phase * 180) / Math.PI);
    out.groupDelayMs.push((delay / fs) * 1000);
  }
  return out;
}

/** n evenly spaced frequencies from 0 to just under fs/2, Hz. */
export function responseGrid(fs: number, n = 512): number[] {
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push(((fs / 2) * i) / n);
  return out;
}
