/**
 * Periodic ("DFT-even") Hann window, w[n] = 0.5 − 0.5·cos(2πn/N), n = 0…N−1 — the form
 * Welch spectra use (scipy's default), so a bin-centred tone lands in exactly three bins.
 */
export function hannPeriodic(n: number): Float64Array {
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / n);
  return w;
}

/** Symmetric Hann, w[n] = 0.5 − 0.5·cos(2πn/(N−1)); for filter design and comparisons. */
export function hannSymmetric(n: number): Float64Array {
  const w = new Float64Array(n);
  if (n === 1) {
    w[0] = 1;
    return w;
  }
  for (let i = 0; i < n; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / (n - 1));
  return w;
}

export interface WindowFigures {
  /** Σw / N. */
  coherentGain: number;
  /** N·Σw² / (Σw)², in bins. */
  enbwBins: number;
  /** Σw, Σw² — the normalisers of the 'spectrum' and 'density' scalings. */
  sum: number;
  sumSq: number;
}

/** Figures of merit of a window (Harris 1978 definitions). */
export function windowFigures(w: ArrayLike<number>): WindowFigures {
  let s = 0;
  let s2 = 0;
  for (let i = 0; i < w.length; i++) {
    const v = w[i]!;
    s += v;
    s2 += v * v;
  }
  return { coherentGain: s / w.length, enbwBins: (w.length * s2) / (s * s), sum: s, sumSq: s2 };
}

/**
 * Window response, dB relative to its peak, to a tone `offsetBins` from a bin centre
 * (DTFT of w at that offset divided by Σw). −1.42 dB at 0.5 for Hann: the scalloping loss.
 */
export function windowResponseDb(w: ArrayLike<number>, offsetBins: number): number {
  const n = w.length;
  let re = 0;
  let im = 0;
  let s = 0;
  for (let i = 0; i < n; i++) {
    const a = (-2 * Math.PI * offsetBins * i) / n;
    re += w[i]! * Math.cos(a);
    im += w[i]! * Math.sin(a);
    s += w[i]!;
  }
  return 20 * Math.log10(Math.hypot(re, im) / s);
}
