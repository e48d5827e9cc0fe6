import FFT from 'fft.js';

/** The part of fft.js we use, typed; the package itself ships `any` everywhere. */
interface FftCore {
  readonly size: number;
  realTransform(out: Float64Array, data: ArrayLike<number>): void;
  transform(out: Float64Array, data: ArrayLike<number>): void;
  completeSpectrum(spectrum: Float64Array): void;
}
const FftCtor = FFT as unknown as new (size: number) => FftCore;

/**
 * A real-input FFT of one power-of-two size with its own scratch buffers, so the hot loop of a
 * Welch estimate allocates nothing. Not re-entrant: one instance per caller at a time.
 */
export class RealFft {
  readonly size: number;
  private readonly core: FftCore;
  /** Interleaved re/im, 2·size long; realTransform fills bins 0…size/2. */
  private readonly out: Float64Array;

  constructor(size: number) {
    if (!Number.isInteger(size) || size < 2 || (size & (size - 1)) !== 0) {
      throw new RangeError(`FFT size must be a power of two ≥ 2, got ${size}`);
    }
    this.size = size;
    this.core = new FftCtor(size);
    this.out = new Float64Array(2 * size);
  }

  /** |X[k]|² for k = 0…size/2 into `power` (length ≥ size/2 + 1); X[k] = Σ x[n]·e^(−2πikn/N). */
  powerSpectrum(input: Float64Array, power: Float64Array): void {
    this.core.realTransform(this.out, input);
    const out = this.out;
    const half = this.size >> 1;
    for (let k = 0; k <= half; k++) {
      const re = out[2 * k]!;
      const im = out[2 * k + 1]!;
      power[k] = re * re + im * im;
    }
  }

  /**
   * The transform of a real input into the instance's scratch buffer: interleaved re/im, bins
   * 0…size/2 valid. Overwritten by the next call; copy what you keep.
   */
  transformInPlace(input: Float64Array): Float64Array {
    this.core.realTransform(this.out, input);
    return this.out;
  }

  /** Complex spectrum of a real input, bins 0…size/2, as separate re and im arrays. */
  spectrum(input: Float64Array): { re: Float64Array; im: Float64Array } {
    this.core.realTransform(this.out, input);
    const half = this.size >> 1;
    const re = new Float64Array(half + 1);
    const im = new Float64Array(half + 1);
    for (let k = 0; k <= half; k++) {
      re[k] = this.out[2 * k]!;
      im[k] = this.out[2 * k + 1]!;
    }
    return { re, im };
  }
}

const cache = new Map<number, RealFft>();

/** A shared instance per size (single-threaded callers only). */
export function realFft(size: number): RealFft {
  let f = cache.get(size);
  if (!f) {
    f = new RealFft(size);
    cache.set(size, f);
  }
  return f;
}

/** Smallest power of two ≥ n (n ≥ 1). */
export function nextPow2(n: number): number {
  let p = 1;
  while (p < n) p *= 2;
  return p;
}
