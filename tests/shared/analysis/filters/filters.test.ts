import { describe, expect, it } from 'vitest';
import {
  lowpass1Coefficients,
  lowpass2Coefficients,
  notchCoefficients,
} from '../../../../shared/analysis/filters/biquad';
import { applyFilters, filterInPlace } from '../../../../shared/analysis/filters/apply';
import { filterResponse } from '../../../../shared/analysis/filters/response';
import { FilterSpec } from '../../../../shared/schemas/filters';

const impulse = (n: number) => Float64Array.from({ length: n }, (_, i) => (i === 0 ? 1 : 0));

describe('RBJ notch, f0 = 200 Hz, Q = 5, fs = 4000 (RBJ Audio EQ Cookbook, W3C Note 2021; tests/REFERENCES.md §4.1)', () => {
  const notch: FilterSpec = [{ kind: 'notch', hz: 200, q: 5 }];

  it('has the cookbook coefficients', () => {
    const c = notchCoefficients(200, 5, 4000);
    expect(c.b0).toBeCloseTo(0.970024591623, 12);
    expect(c.b1).toBeCloseTo(-1.845096417659, 12);
    expect(c.b2).toBeCloseTo(0.970024591623, 12);
    expect(c.a1).toBeCloseTo(-1.845096417659, 12);
    expect(c.a2).toBeCloseTo(0.940049183245, 12);
  });

  it('matches scipy.signal.freqz magnitude, phase and group delay', () => {
    // [f, |H|, phase deg, group delay ms] from tests/REFERENCES.md §4.1 (computed with scipy)
    const rows = [
      [50, 0.998605, -3.0262, 0.19001],
      [100, 0.991405, -7.5176, 0.34321],
      [180, 0.731058, -43.0249, 4.19565],
      [195, 0.249196, -75.5701, 7.77855],
      [205, 0.2436, 75.9009, 7.43305],
      [220, 0.697041, 45.8099, 3.81237],
      [400, 0.991923, 7.2873, 0.08687],
      [1000, 0.999473, 1.861, 0.00853],
    ] as const;
    const r = filterResponse(
      notch,
      4000,
      rows.map((x) => x[0]),
    );
    rows.forEach(([, mag, ph, gd], i) => {
      // table printed to 6 decimals / 4 for degrees / 5 for ms
      expect(Math.abs(10 ** (r.magDb[i]! / 20) - mag)).toBeLessThan(1e-6);
      expect(Math.abs(r.phaseDeg[i]! - ph)).toBeLessThan(1e-4);
      expect(Math.abs(r.groupDelayMs[i]! - gd)).toBeLessThan(1e-5);
    });
  });

  it('is 1 at DC and Nyquist and 0 at the centre (analytic)', () => {
    const r = filterResponse(notch, 4000, [0, 2000, 200]);
    expect(r.magDb[0]).toBeCloseTo(0, 9);
    expect(r.magDb[1]).toBeCloseTo(0, 9);
    expect(r.magDb[2]).toBeLessThan(-200);
  });

  it('gives scipy lfilter’s impulse response', () => {
    const y = new Float64Array(impulse(8));
    filterInPlace(notch, 4000, y);
    const want = [
      0.970024591623, -0.055307518615, -0.043893937926, -0.028996759923, -0.012239357361,
      0.004675586062, 0.020132504983, 0.032751131964,
    ];
    want.forEach((v, i) => expect(y[i]).toBeCloseTo(v, 11));
  });
});

describe('RBJ low-pass, f0 = 100 Hz, fs = 4000 (tests/REFERENCES.md §4.2)', () => {
  it('equals scipy.signal.butter(2, 100, fs=4000) with Q = 1/√2', () => {
    const c = lowpass2Coefficients(100, Math.SQRT1_2, 4000);
    expect(c.b0).toBeCloseTo(0.00554271721, 12);
    expect(c.b1).toBeCloseTo(0.011085434421, 12);
    expect(c.a1).toBeCloseTo(-1.778631777825, 12);
    expect(c.a2).toBeCloseTo(0.800802646666, 12);
  });

  it('with the rounded Q = 0.7071 stays within 2e-6 of the exact design', () => {
    const c = lowpass2Coefficients(100, 0.7071, 4000);
    expect(c.a1).toBeCloseTo(-1.778630078939, 12);
    expect(Math.abs(c.a2 - 0.800802646666)).toBeLessThan(2e-6);
  });

  it('matches the response table: −3.0103 dB and −90° at f0, group delay 2.24616 ms at DC', () => {
    const lp: FilterSpec = [{ kind: 'lowpass2', hz: 100 }];
    const f = [0, 50, 100, 200, 1000];
    const mag = [1, 0.970318, 0.707107, 0.239714, 0.006194];
    const ph = [0, -43.2403, -90, -136.9812, -173.6098];
    const gd = [2.24616, 2.64595, 2.26007, 0.66816, 0.028];
    const r = filterResponse(lp, 4000, f);
    f.forEach((_, i) => {
      expect(Math.abs(10 ** (r.magDb[i]! / 20) - mag[i]!)).toBeLessThan(1e-6);
      expect(Math.abs(r.phaseDeg[i]! - ph[i]!)).toBeLessThan(1e-4);
      expect(Math.abs(r.groupDelayMs[i]! - gd[i]!)).toBeLessThan(1e-5);
    });
  });

  it('gives the published first impulse samples', () => {
    const y = applyFilters([{ kind: 'lowpass2', hz: 100 }], 4000, impulse(4));
    [0.00554271721, 0.020943887386, 0.038355558255, 0.051448494318].forEach((v, i) =>
      expect(y[i]).toBeCloseTo(v, 7),
    );
  });
});

describe('first-order low-pass (bilinear transform with pre-warping)', () => {
  it('is −3.0103 dB at its cutoff and unity at DC', () => {
    const r = filterResponse([{ kind: 'lowpass1', hz: 80 }], 2000, [0, 80]);
    expect(r.magDb[0]).toBeCloseTo(0, 12);
    expect(r.magDb[1]).toBeCloseTo(-10 * Math.log10(2), 9);
  });

  it('has the group delay of the warped analog RC: τ = sec²(ω/2)/(2k·(1 + tan²(ω/2)/k²)) samples', () => {
    // Closed form from τ_a(Ω) = (1/ωc)/(1 + (Ω/ωc)²) (textbook RC group delay) with
    // Ω = ωc·tan(ω/2)/k, k = tan(π·fc/fs) — the bilinear map used by the design.
    const fs = 2000;
    const fc = 80;
    const k = Math.tan((Math.PI * fc) / fs);
    const f = [0, 10, 40, 80, 200, 600, 900];
    const r = filterResponse([{ kind: 'lowpass1', hz: fc }], fs, f);
    f.forEach((hz, i) => {
      const w = (2 * Math.PI * hz) / fs;
      const t = Math.tan(w / 2);
      const samples = 1 / Math.cos(w / 2) ** 2 / (2 * k) / (1 + (t / k) ** 2);
      expect(r.groupDelayMs[i]).toBeCloseTo((samples / fs) * 1000, 10);
    });
    // At DC this approaches the RC time constant 1/(2π·fc) = 1.989 ms (textbook).
    expect(r.groupDelayMs[0]).toBeCloseTo(1000 / (2 * Math.PI * fc), 1);
  });

  it('has coefficients k/(k+1) and (k−1)/(k+1)', () => {
    const c = lowpass1Coefficients(100, 1000);
    const k = Math.tan(Math.PI / 10);
    expect(c.b0).toBeCloseTo(k / (k + 1), 14);
    expect(c.a1).toBeCloseTo((k - 1) / (k + 1), 14);
  });
});

describe('cascades and the spec schema', () => {
  it('adds stage responses in dB and stage delays', () => {
    const a: FilterSpec = [{ kind: 'lowpass2', hz: 150 }];
    const b: FilterSpec = [{ kind: 'notch', hz: 220, q: 4 }];
    const f = [30, 120, 300];
    const ra = filterResponse(a, 4000, f);
    const rb = filterResponse(b, 4000, f);
    const rab = filterResponse([...a, ...b], 4000, f);
    f.forEach((_, i) => {
      expect(rab.magDb[i]).toBeCloseTo(ra.magDb[i]! + rb.magDb[i]!, 9);
      expect(rab.groupDelayMs[i]).toBeCloseTo(ra.groupDelayMs[i]! + rb.groupDelayMs[i]!, 9);
    });
  });

  it('applies an empty cascade as a copy and leaves the input untouched', () => {
    const x = Float32Array.from([1, 2, 3]);
    const y = applyFilters([], 1000, x);
    expect(Array.from(y)).toEqual([1, 2, 3]);
    expect(y).not.toBe(x);
  });

  it('rejects a negative frequency and an unknown kind', () => {
    expect(FilterSpec.safeParse([{ kind: 'notch', hz: -5 }]).success).toBe(false);
    expect(FilterSpec.safeParse([{ kind: 'highpass', hz: 5 }]).success).toBe(false);
  });

  it('removes a 200 Hz tone with a 200 Hz notch', () => {
    const x = Float32Array.from({ length: 8000 }, (_, i) =>
      Math.sin((2 * Math.PI * 200 * i) / 4000),
    );
    const y = applyFilters([{ kind: 'notch', hz: 200, q: 5 }], 4000, x);
    let s = 0;
    for (let i = 4000; i < 8000; i++) s += y[i]! * y[i]!;
    expect(Math.sqrt(s / 4000)).toBeLessThan(1e-3);
  });
});
