import { stageCoefficients } from './biquad';
import type { FilterSpec } from '../../schemas/filters';

/**
 * Runs the cascade over a column (direct form II transposed, state starting at rest), as a
 * flight controller would in real time; returns a new Float32Array, the input is untouched.
 */
export function applyFilters(
  specs: FilterSpec,
  fs: number,
  column: ArrayLike<number>,
): Float32Array {
  const out = Float32Array.from(column);
  filterInPlace(specs, fs, out);
  return out;
}

/** The cascade in place on a buffer; Float64Array keeps full precision for reference checks. */
export function filterInPlace(
  specs: FilterSpec,
  fs: number,
  buf: Float32Array | Float64Array,
): void {
  for (const spec of specs) {
    const { b0, b1, b2, a1, a2 } = stageCoefficients(spec, fs);
    let z1 = 0;
    let z2 = 0;
    for (let i = 0; i < buf.length; i++) {
      const x = buf[i]!;
      const y = b0 * x + z1;
      z1 = b1 * x - a1 * y + z2;
      z2 = b2 * x - a2 * y;
      buf[i] = y;
    }
  }
}
