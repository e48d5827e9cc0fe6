import { crossSpectra, type CrossSpectra } from './dsp/cross-spectrum';
import type { ResponseCurve } from './review-detail';
import type { Ranges } from './segments';

/** Rate the response is estimated at, at most, Hz: stick response lives well below 100 Hz. */
const MAX_RATE_HZ = 1000;
/**
 * Welch segment length, s: bins of about a quarter hertz, so several lie below the reference
 * frequency where stick moves carry most of their energy.
 */
const SEGMENT_S = 4;
/** Highest frequency kept for the chart and the search, Hz. */
const MAX_HZ = 100;
/**
 * Bins from the second up to this frequency give the phase delay, Hz (the first bin's phase is
 * pulled by removing each segment's mean, which leaks into it through the Hann window); the
 * lowest readable bin gives the low-frequency level.
 */
const REF_HZ = 3;
/** A bin whose magnitude-squared coherence reaches this is read; below it the input said too little. */
export const USABLE_COHERENCE = 0.6;
/** Setpoint RMS below this, deg/s, carries no timing or gain worth reading. */
const MIN_INPUT_RMS = 2;
/** Fewest Welch segments for an average worth the name. */
const MIN_SEGMENTS = 4;

export interface StickResponse {
  /** Where the gain first falls 3 dB below its low-frequency level, Hz; null when the sticks did not reach that far. */
  bandwidthHz: number | null;
  /** Highest gain over the readable band, dB (above 0 dB the aircraft overshoots the sticks). */
  peakGainDb: number;
  /** Phase delay at the low reference band, ms (comparable with the cross-correlation lag). */
  phaseDelayMs: number;
  /** Mean magnitude-squared coherence over the band the figures come from, 0–1. */
  coherence: number;
  curve: ResponseCurve;
}

/** Block means of the ranges at `decim`, with the ranges mapped onto the reduced samples. */
function decimate(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  ranges: Ranges,
  decim: number,
): { x: Float64Array; y: Float64Array; ranges: [number, number][] } {
  let total = 0;
  for (const [a, b] of ranges) total += Math.floor((b - a) / decim);
  const xs = new Float64Array(total);
  const ys = new Float64Array(total);
  const out: [number, number][] = [];
  let j = 0;
  for (let ri = 0; ri < ranges.length; ri++) {
    const a = ranges[ri]![0];
    const blocks = Math.floor((ranges[ri]![1] - a) / decim);
    const start = j;
    for (let bi = 0; bi < blocks; bi++, j++) {
      let sx = 0;
      let sy = 0;
      for (let i = a + bi * decim, end = i + decim; i < end; i++) {
        sx += x[i]!;
        sy += y[i]!;
      }
      xs[j] = sx / decim;
      ys[j] = sy / decim;
    }
    out.push([start, j]);
  }
  return { x: xs, y: ys, ranges: out };
}

/** H1 gain (dB), unwrapped phase (deg) and coherence per bin from the summed spectra. */
function curveOf(c: CrossSpectra): ResponseCurve {
  const hz: number[] = [];
  const gainDb: number[] = [];
  const phaseDeg: number[] = [];
  const coherence: number[] = [];
  let prev = 0;
  for (let k = 1; k < c.hz.length; k++) {
    const xx = c.gxx[k]!;
    const yy = c.gyy[k]!;
    const re = c.gxyRe[k]!;
    const im = c.gxyIm[k]!;
    const h = xx > 0 ? Math.hypot(re, im) / xx : 0;
    let ph = (Math.atan2(im, re) * 180) / Math.PI;
    // Unwrap against the bin below: the phase of a rate loop falls steadily with frequency.
    while (ph - prev > 180) ph -= 360;
    while (ph - prev < -180) ph += 360;
    prev = ph;
    hz.push(c.hz[k]!);
    gainDb.push(h > 0 ? 20 * Math.log10(h) : -300);
    phaseDeg.push(ph);
    coherence.push(xx > 0 && yy > 0 ? Math.min(1, (re * re + im * im) / (xx * yy)) : 0);
  }
  return { hz, gainDb, phaseDeg, coherence };
}

/**
 * Stick response of one axis: the H1 frequency response estimate from setpoint (input) to gyro
 * (output), H1 = Gxy / Gxx with Welch-averaged spectra, and the magnitude-squared coherence
 * γ² = |Gxy|² / (Gxx·Gyy) (Bendat & Piersol, Random Data, 4th ed., ch. 6 and 9; tests/REFERENCES.md
 * §14). Segments of about 4 s give bins of about 0.25 Hz. Returns null with the reason when the
 * sticks carried too little movement; `bandwidthHz` alone is null when they never reached the
 * frequency where the gain falls 3 dB.
 */
export function stickResponse(
  setpoint: ArrayLike<number>,
  gyro: ArrayLike<number>,
  fs: number,
  ranges: Ranges,
): { response: StickResponse | null; reason?: string } {
  const decim = Math.max(1, Math.floor(fs / MAX_RATE_HZ + 1e-9));
  const rate = fs / decim;
  const d =
    decim > 1
      ? decimate(setpoint, gyro, ranges, decim)
      : { x: setpoint, y: gyro, ranges: ranges.map(([a, b]) => [a, b] as [number, number]) };
  const longest = d.ranges.reduce((m, [a, b]) => Math.max(m, b - a), 0);
  let n = 2 ** Math.round(Math.log2(SEGMENT_S * rate));
  while (n > 128 && n * MIN_SEGMENTS > 2 * longest) n >>= 1;
  const spectra = crossSpectra(d.x, d.y, rate, n, d.ranges, Math.min(MAX_HZ, rate / 2));
  if (spectra.segments < MIN_SEGMENTS)
    return { response: null, reason: 'the flight was too short to average' };
  // Input RMS from its own spectrum (Parseval over the kept band, Hann-window power 3/8·n).
  let power = 0;
  for (let k = 1; k < spectra.gxx.length; k++) power += spectra.gxx[k]!;
  const inputRms = Math.sqrt((2 * power) / (spectra.segments * n * n * 0.375));
  if (!(inputRms >= MIN_INPUT_RMS))
    return { response: null, reason: 'the sticks hardly moved on this axis' };
  const curve = curveOf(spectra);
  const usable = curve.coherence.map((g) => g >= USABLE_COHERENCE);
  // curve index i is bin i + 1.
  const low = curve.hz.flatMap((f, i) => (i >= 1 && f <= REF_HZ && usable[i] ? [i] : []));
  const first = usable.indexOf(true);
  if (!low.length || first < 0 || first > low[0]!)
    return { response: null, reason: 'the sticks and the gyro did not agree at low frequency' };
  const lowDb = curve.gainDb[first]!;
  // Phase delay: least squares of phase = −360·f·τ through the origin over the low bins,
  // weighted by the coherence's signal-to-noise ratio γ²/(1 − γ²).
  let num = 0;
  let den = 0;
  for (const i of low) {
    const g = curve.coherence[i]!;
    const w = Math.min(1e4, g / Math.max(1e-4, 1 - g));
    num += w * curve.phaseDeg[i]! * curve.hz[i]!;
    den += w * curve.hz[i]! * curve.hz[i]!;
  }
  const phaseDelayMs = (-num / den / 360) * 1000;
  // Walk up through the readable band until the gain falls 3 dB or the coherence runs out.
  let bandwidthHz: number | null = null;
  let peakGainDb = -Infinity;
  let cohSum = 0;
  let cohN = 0;
  let last = first;
  for (let i = first; i < curve.hz.length; i++) {
    if (!usable[i]) {
      if (i - last > 2) break;
      continue;
    }
    const db = curve.gainDb[i]!;
    cohSum += curve.coherence[i]!;
    cohN++;
    if (db < lowDb - 3) {
      const f0 = curve.hz[last]!;
      const d0 = curve.gainDb[last]!;
      bandwidthHz = f0 + ((lowDb - 3 - d0) / (db - d0)) * (curve.hz[i]! - f0);
      break;
    }
    peakGainDb = Math.max(peakGainDb, db);
    last = i;
  }
  return {
    response: {
      bandwidthHz,
      peakGainDb,
      phaseDelayMs,
      coherence: cohN ? cohSum / cohN : 0,
      curve,
    },
    ...(bandwidthHz === null
      ? {
          reason: `the sticks carried too little movement above ${Math.round(curve.hz[last]!)} Hz to find the bandwidth`,
        }
      : {}),
  };
}
