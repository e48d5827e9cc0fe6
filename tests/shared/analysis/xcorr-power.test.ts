import { describe, expect, it } from 'vitest';
import { crossCorrelationLag } from '../../../shared/analysis/dsp/xcorr';
import { energyUsed, fitSag } from '../../../shared/analysis/power';
import { inferCells, LIPO, packVoltages } from '../../../shared/analysis/lipo';
import { parkMiller } from './park-miller';

describe('cross-correlation lag (Knapp & Carter 1976; scipy correlate convention, REFERENCES §11)', () => {
  it('X1: finds the 37-sample delay of a Park–Miller sequence, peak 75.68664602', () => {
    const r = parkMiller(1);
    const x = Float64Array.from({ length: 1000 }, () => r() / 2147483647 - 0.5);
    const y = Float64Array.from({ length: 1000 }, (_, n) => (n < 37 ? 0 : x[n - 37]!));
    const est = crossCorrelationLag(x, y, 200, 'linear')!;
    expect(Math.round(est.lag)).toBe(37);
    expect(Math.abs(est.lag - 37)).toBeLessThan(0.5);
    const back = crossCorrelationLag(y, x, 200, 'linear')!;
    expect(Math.round(back.lag)).toBe(-37);
    let peak = 0;
    for (let n = 0; n <= 962; n++) peak += x[n]! * x[n]!;
    expect(peak).toBeCloseTo(75.68664602, 7);
    // at fs = 500 Hz that is 74 ms
    expect((Math.round(est.lag) / 500) * 1000).toBe(74);
  });

  it('X2: interpolates a Gaussian delay of 10.3 samples exactly through ln r, 10.29925 linearly', () => {
    const x = Float64Array.from({ length: 256 }, (_, n) => Math.exp(-(((n - 100) / 8) ** 2)));
    const y = Float64Array.from({ length: 256 }, (_, n) => Math.exp(-(((n - 110.3) / 8) ** 2)));
    expect(Math.abs(crossCorrelationLag(x, y, 40, 'log')!.lag - 10.3)).toBeLessThan(1e-9);
    expect(Math.abs(crossCorrelationLag(x, y, 40, 'linear')!.lag - 10.29925)).toBeLessThan(1e-5);
  });

  it('returns null for too short a signal', () => {
    expect(crossCorrelationLag([1], [1], 5)).toBeNull();
  });
});

describe('internal resistance from sag (IEC 61960 two-step ΔV/ΔI; REFERENCES §10)', () => {
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
    expect(fitSag(v, i, q)!.ohm).toBeCloseTo(0.03, 9);
  });

  it('returns null when the current never changes', () => {
    expect(fitSag([16, 16, 16], [5, 5, 5])).toBeNull();
  });

  it('integrates 10 A for 360 s into 1000 mAh and, at 15 V, 15 Wh', () => {
    const t = [0, 120, 240, 360];
    const r = energyUsed(t, [10, 10, 10, 10], [15, 15, 15, 15]);
    expect(r.mAh).toBeCloseTo(1000, 9);
    expect(r.wh).toBeCloseTo(15, 9);
  });
});

describe('LiPo thresholds (REFERENCES §12)', () => {
  it('uses 4.20 V full and 3.7 V nominal per cell (cell specifications) and 3.5 / 3.3 V in flight (common practice)', () => {
    expect(LIPO.fullV).toBe(4.2);
    expect(LIPO.nominalV).toBe(3.7);
    expect(LIPO.warnUnderLoadV).toBe(3.5);
    expect(LIPO.landNowV).toBe(3.3);
    expect(packVoltages(4).fullV).toBeCloseTo(16.8, 12);
    expect(packVoltages(6).nominalV).toBeCloseTo(22.2, 12);
  });

  it('infers the cell count of resting packs from full down to storage charge', () => {
    expect(inferCells(16.8)).toBe(4);
    expect(inferCells(14.8)).toBe(4);
    expect(inferCells(25.2)).toBe(6);
    expect(inferCells(22.8)).toBe(6);
    expect(inferCells(12.6)).toBe(3);
    expect(inferCells(4.2)).toBe(1);
    expect(inferCells(0)).toBeNull();
    expect(inferCells(Number.NaN)).toBeNull();
  });
});
