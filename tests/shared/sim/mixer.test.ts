import { describe, expect, it } from 'vitest';
import { Mixer } from '../../../shared/sim/mixer';

// Quad X columns scaled to ±1 (roll, pitch, yaw) in the default numbering: 1 FR ccw, 2 RR cw,
// 3 RL ccw, 4 FL cw (shared/README.md §4).
const ctl = [
  Float64Array.from([-1, -1, 1, 1]),
  Float64Array.from([1, -1, -1, 1]),
  Float64Array.from([1, -1, 1, -1]),
] as const;
const collective = Float64Array.from([1, 1, 1, 1]);

describe('mixer with attitude-first desaturation', () => {
  it('adds the attitude demand to the collective when it fits', () => {
    const m = new Mixer(ctl, collective, 0.04);
    const u = new Float64Array(4);
    m.mix(u, 0.5, 0.1, 0, 0);
    expect(Array.from(u)).toEqual([0.4, 0.4, 0.6, 0.6]);
    expect(m.saturated).toBe(false);
    expect(m.uMax).toBeCloseTo(0.6, 12);
  });

  it('scales an attitude demand wider than idle…full down and keeps its shape', () => {
    const m = new Mixer(ctl, collective, 0.04);
    const u = new Float64Array(4);
    m.mix(u, 0.5, 0.8, 0.4, 0);
    // Roll 0.8 and pitch 0.4 ask for a spread of 2.4; only 0.96 fits, so both shrink by 0.4.
    const spread = Math.max(...u) - Math.min(...u);
    expect(spread).toBeCloseTo(0.96, 12);
    // Attitude parts −0.4, −1.2, 0.4, 1.2 (by the columns above), each times 0.4 about the mean.
    const mean = u.reduce((a, b) => a + b, 0) / 4;
    [-0.16, -0.48, 0.16, 0.48].forEach((d, i) => expect(u[i]! - mean).toBeCloseTo(d, 12));
    expect(Math.min(...u)).toBeGreaterThanOrEqual(0.04 - 1e-12);
    expect(Math.max(...u)).toBeLessThanOrEqual(1);
    expect(m.saturated).toBe(true);
  });

  it('shifts the collective down rather than clipping a motor at full', () => {
    const m = new Mixer(ctl, collective, 0.04);
    const u = new Float64Array(4);
    m.mix(u, 0.95, 0.1, 0, 0);
    expect(Array.from(u).map((v) => +v.toFixed(12))).toEqual([0.8, 0.8, 1, 1]);
    expect(m.uMax).toBe(1);
  });
});
