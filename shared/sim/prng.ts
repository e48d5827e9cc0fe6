/**
 * Park–Miller "minimal standard" generator: z ← 16807·z mod (2³¹ − 1) (Park & Miller, Commun.
 * ACM 31(10), 1988). 16807·z stays below 2⁵³, so plain Number arithmetic is exact and the
 * sequence is the same on every JavaScript engine.
 */
export const PM_MODULUS = 2147483647;
const PM_MULTIPLIER = 16807;

export class ParkMiller {
  private z: number;
  private spare = NaN;

  /** Any integer seed; it is folded into 1…2³¹−2 (0 would stick at 0). */
  constructor(seed: number) {
    let z = Math.floor(Math.abs(seed)) % PM_MODULUS;
    if (z === 0) z = 1;
    this.z = z;
  }

  /** Next raw state, 1…2³¹−2. */
  nextInt(): number {
    // p mod (2³¹ − 1) = (p mod 2³¹) + ⌊p / 2³¹⌋, folded once (Carta's method); every step is an
    // exact double operation and much cheaper than a floating-point %.
    const p = this.z * PM_MULTIPLIER;
    const hi = Math.floor(p / 2147483648);
    let r = p - hi * 2147483648 + hi;
    if (r >= PM_MODULUS) r -= PM_MODULUS;
    this.z = r;
    return r;
  }

  /** Uniform on the open interval (0, 1). */
  uniform(): number {
    return this.nextInt() / PM_MODULUS;
  }

  /**
   * Standard normal by Marsaglia's polar method (a Box–Muller variant without trigonometry),
   * the second value of each pair cached.
   */
  normal(): number {
    if (this.spare === this.spare) {
      const v = this.spare;
      this.spare = NaN;
      return v;
    }
    let x: number;
    let y: number;
    let s: number;
    do {
      x = 2 * this.uniform() - 1;
      y = 2 * this.uniform() - 1;
      s = x * x + y * y;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = y * f;
    return x * f;
  }
}

/**
 * An independent stream per noise source, so adding a fault that draws numbers does not shift
 * the noise every other source sees.
 */
export function streamFor(seed: number, stream: number): ParkMiller {
  const base = (Math.floor(Math.abs(seed)) % 1_000_003) * 7919 + stream * 104_729 + 1;
  const rng = new ParkMiller(base);
  // A few warm-up steps decorrelate neighbouring seeds (consecutive seeds start close).
  for (let i = 0; i < 8; i++) rng.nextInt();
  return rng;
}
