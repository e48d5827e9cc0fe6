import { describe, expect, it } from 'vitest';
import { antiAlias, FrameMode } from '../../../shared/sim/disturbances';
import { streamFor } from '../../../shared/sim/prng';

describe('sensor anti-alias roll-off', () => {
  // The roll-off's corners are our own model of a sensor's filter (antiAlias in
  // shared/sim/disturbances.ts), not a particular part's datasheet.
  it('passes up to 0.4·fs, halves at 0.45·fs and stops at Nyquist', () => {
    expect(antiAlias(399, 1000)).toBe(1);
    expect(antiAlias(450, 1000)).toBeCloseTo(0.5, 12);
    expect(antiAlias(500, 1000)).toBe(0);
    expect(antiAlias(700, 1000)).toBe(0);
  });
});

describe('frame mode', () => {
  it('has unit rms by the AR(2) variance formula, within sampling error', () => {
    // Var(x) = σ²(1 − a2) / ((1 + a2)((1 − a2)² − a1²)) for x[n] = a1·x[n−1] + a2·x[n−2] + e[n]
    // (Box & Jenkins, Time Series Analysis, AR(2) autocovariance; from memory).
    const mode = new FrameMode(290, 15, 1000, streamFor(3, 4));
    let sx = 0;
    let sy = 0;
    const n = 200_000;
    for (let i = 0; i < n; i++) {
      mode.next();
      sx += mode.x * mode.x;
      sy += mode.y * mode.y;
    }
    expect(Math.sqrt(sx / n)).toBeCloseTo(1, 1);
    expect(Math.sqrt(sy / n)).toBeCloseTo(1, 1);
  });
});
