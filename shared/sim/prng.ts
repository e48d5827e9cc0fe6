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
    this.z = (this.z * PM_MULTIPLIER) % PM_MODULUS;
    return this.z;
  }

  /** Uniform on the open interval (0, 1). */
  uniform(): number {
    return this.nextInt() / PM_MODULUS;
  }

  /** Standard normal by the Box–Muller transform, the second value of each pair cached. */
  normal(): number {
    if (this.spare === this.spare) {
      const v = this.spare;
      this.spare = NaN;
      return v;
    }
    const r = Math.sqrt(-2 * Math.log(this.uniform()));
    const a = 2 * Math.PI * this.uniform();
    this.spare = r * Math.sin(a);
    return r * Math.cos(a);
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
