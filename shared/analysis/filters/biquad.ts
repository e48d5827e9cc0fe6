import { DEFAULT_LOWPASS_Q, DEFAULT_NOTCH_Q, type FilterStage } from '../../schemas/filters';

/** Normalised (a0 = 1) second-order section: y = b0·x + b1·x₁ + b2·x₂ − a1·y₁ − a2·y₂. */
export interface Biquad {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
}

/** RBJ cookbook notch at f0 Hz, quality q, sample rate fs Hz; needs 0 < f0 < fs/2. */
export function notchCoefficients(f0: number, q: number, fs: number): Biquad {
  const w0 = (2 * Math.PI * f0) / fs;
  const cos = Math.cos(w0);
  const alpha = Math.sin(w0) / (2 * q);
  const a0 = 1 + alpha;
  return { b0: 1 / a0, b1: (-2 * cos) / a0, b2: 1 / a0, a1: (-2 * cos) / a0, a2: (1 - alpha) / a0 };
}

/** RBJ cookbook second-order low-pass at f0 Hz, quality q, sample rate fs Hz. */
export function lowpass2Coefficients(f0: number, q: number, fs: number): Biquad {
  const w0 = (2 * Math.PI * f0) / fs;
  const cos = Math.cos(w0);
  const alpha = Math.sin(w0) / (2 * q);
  const a0 = 1 + alpha;
  const b = (1 - cos) / 2 / a0;
  return { b0: b, b1: 2 * b, b2: b, a1: (-2 * cos) / a0, a2: (1 - alpha) / a0 };
}

/**
 * First-order low-pass by the bilinear transform of 1/(1 + s/ωc) with the cutoff pre-warped,
 * so the −3 dB point lands exactly on fc: k = tan(π·fc/fs), y = (k·(x + x₁) − (k − 1)·y₁)/(k + 1).
 * Written as a biquad with b2 = a2 = 0 so one code path applies every stage.
 */
export function lowpass1Coefficients(fc: number, fs: number): Biquad {
  const k = Math.tan((Math.PI * fc) / fs);
  return { b0: k / (k + 1), b1: k / (k + 1), b2: 0, a1: (k - 1) / (k + 1), a2: 0 };
}

/** Coefficients of one bench stage at sample rate fs; the frequency is clamped just under Nyquist. */
export function stageCoefficients(stage: FilterStage, fs: number): Biquad {
  const hz = Math.min(stage.hz, fs * 0.499);
  switch (stage.kind) {
    case 'lowpass1':
      return lowpass1Coefficients(hz, fs);
    case 'lowpass2':
      return lowpass2Coefficients(hz, stage.q ?? DEFAULT_LOWPASS_Q, fs);
    case 'notch':
      return notchCoefficients(hz, stage.q ?? DEFAULT_NOTCH_Q, fs);
  }
}
