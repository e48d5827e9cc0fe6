import { describe, expect, it } from 'vitest';
import { energyUsed, fitSag } from '../../../shared/analysis/power';

describe('internal resistance from sag (IEC 61960 two-step ΔV/ΔI; tests/REFERENCES.md §10)', () => {
  it('gives 42.857 mΩ and 16.4857 V open circuit for 16.40 V @ 2 A, 15.20 V @ 30 A', () => {
    const fit = fitSag([16.4, 15.2], [2, 30])!;
    expect(fit.ohm).toBeCloseTo(0.0428571428571, 9);
    expect(fit.openCircuitV).toBeCloseTo(16.4857142857, 9);
    // I²R at 30 A = 38.571 W
    expect(30 * 30 * fit.ohm).toBeCloseTo(38.571, 3);
  });

  it('separates resistance from the slow fall of a discharging pack', () => {
    const n = 2000;
    const q = Float64Array.from({ length: n }, (_, k) => k * 0.5); // mAh drawn
    const i = Float64Array.from({ length: n }, (_, k) => 10 + 15 * Math.sin(k / 7));
    const v = Float64Array.from({ length: n }, (_, k) => 16.8 - 0.03 * i[k]! - 0.0008 * q[k]!);
    // 0.03 Ω is the resistance built into v above (synthetic data, not a measurement).
    expect(fitSag(v, i, q)!.ohm).toBeCloseTo(0.03, 9);
  });

  it('returns null when the current never changes', () => {
    expect(fitSag([16, 16, 16], [5, 5, 5])).toBeNull();
  });

  it('integrates 10 A for 360 s into 1000 mAh and, at 15 V, 15 Wh', () => {
    // Worked by hand from the units: 10 A · 360 s = 3600 C = 1000 mAh; 15 V · 10 A · 0.1 h = 15 Wh.
    const t = [0, 120, 240, 360];
    const r = energyUsed(t, [10, 10, 10, 10], [15, 15, 15, 15]);
    expect(r.mAh).toBeCloseTo(1000, 9);
    expect(r.wh).toBeCloseTo(15, 9);
  });
});
