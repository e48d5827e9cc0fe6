import { describe, expect, it } from 'vitest';
import { bandRms, welch } from '../../../../shared/analysis/dsp/welch';
import { parkMiller } from '../park-miller';

const fs = 1000;
const df = 3.90625;
const signal = (n: number, f: (t: number) => number) =>
  Float64Array.from({ length: n }, (_, i) => f(i / fs));
const welch256 = (
  x: Float64Array,
  scaling: 'density' | 'spectrum' = 'density',
  detrend: 'constant' | false = 'constant',
) => welch(x, fs, { nperseg: 256, noverlap: 128, scaling, detrend });

describe('Welch PSD against scipy.signal.welch (tests/REFERENCES.md §2.2, computed with scipy 1.17.1)', () => {
  it('W1: a bin-centred unit sine reads A²/2 = 0.5 in spectrum scaling and 0.0853333 V²/Hz density', () => {
    const x = signal(4096, (t) => Math.sin(2 * Math.PI * 97.65625 * t));
    const s = welch256(x, 'spectrum');
    expect(s.segments).toBe(31);
    expect(s.psd[25]).toBeCloseTo(0.5, 12);
    expect(s.psd[24]).toBeCloseTo(0.125, 12);
    expect(s.psd[26]).toBeCloseTo(0.125, 12);
    const d = welch256(x);
    expect(Math.abs(d.psd[25]! / (0.5 / 5.859375) - 1)).toBeLessThan(1e-12);
    expect(Math.abs(d.psd[24]! / 0.0213333333333 - 1)).toBeLessThan(1e-9);
    // spectrum / density = ENBW in Hz = 1.5·fs/nperseg
    expect(s.psd[25]! / d.psd[25]!).toBeCloseTo(5.859375, 10);
  });

  it('W2: a 100 Hz sine 0.4 bin off centre gives scipy’s five bins', () => {
    const x = signal(4096, (t) => Math.sin(2 * Math.PI * 100 * t));
    const s = welch256(x, 'spectrum');
    const want = [0.0073551952, 0.3107566243, 0.4058863164, 0.0253678794, 0.0003511113];
    // values printed to 1e-10, so compare absolutely at that precision
    want.forEach((v, i) => expect(Math.abs(s.psd[24 + i]! - v)).toBeLessThan(1e-10));
    const d = welch256(x);
    expect(Math.abs(d.psd[26]! / 0.0692712647 - 1)).toBeLessThan(1e-8);
    let sum = 0;
    for (const v of d.psd) sum += v * df;
    expect(sum).toBeCloseTo(0.5000746, 6);
  });

  it('W3: Parseval — the integrated density equals the mean square of three tones, 0.65625', () => {
    const x = signal(
      4096,
      (t) =>
        Math.sin(2 * Math.PI * 25 * df * t) +
        0.5 * Math.sin(2 * Math.PI * 60 * df * t + 0.3) +
        0.25 * Math.cos(2 * Math.PI * 90 * df * t),
    );
    const d = welch256(x);
    let sum = 0;
    for (const v of d.psd) sum += v * df;
    expect(sum).toBeCloseTo(0.65625, 12);
    const s = welch256(x, 'spectrum');
    expect(s.psd[25]).toBeCloseTo(0.5, 12);
    expect(s.psd[60]).toBeCloseTo(0.125, 12);
    expect(s.psd[90]).toBeCloseTo(0.03125, 12);
    expect(bandRms(d, 0)).toBeCloseTo(Math.sqrt(0.65625), 12);
  });

  describe('§2.3: sine plus Park–Miller noise (generator from Park & Miller 1988)', () => {
    const rand = parkMiller(1);
    const e = Float64Array.from(
      { length: 65536 },
      () => Math.sqrt(12) * 0.1 * (rand() / 2147483647 - 0.5),
    );

    it('regenerates the published generator check and the first noise values', () => {
      const r = parkMiller(1);
      let z = 0;
      for (let i = 0; i < 10000; i++) z = r();
      expect(z).toBe(1043618065); // Park & Miller 1988 check value
      expect(e[0]).toBeCloseTo(-0.173202369623, 11);
      expect(e[2]).toBeCloseTo(0.088544280945, 11);
    });

    it('gives the noise floor, tone bin and total power scipy gives', () => {
      const x = Float64Array.from(e, (v, n) => Math.sin((2 * Math.PI * 97.65625 * n) / fs) + v);
      const d = welch256(x);
      expect(d.segments).toBe(511);
      let floor = 0;
      let count = 0;
      for (let k = 1; k <= 127; k++) {
        if (k >= 20 && k <= 30) continue;
        floor += d.psd[k]!;
        count++;
      }
      expect(Math.abs(floor / count / 1.9937002e-5 - 1)).toBeLessThan(1e-6);
      // Theory 2σ²/fs = 2e-5 V²/Hz, statistical ±2 %
      expect(Math.abs(floor / count / 2e-5 - 1)).toBeLessThan(0.02);
      expect(Math.abs(d.psd[25]! / 0.08532274 - 1)).toBeLessThan(1e-6);
      let sum = 0;
      for (const v of d.psd) sum += v * df;
      expect(Math.abs(sum / 0.50994033 - 1)).toBeLessThan(1e-6);
      const s = welch256(x, 'spectrum');
      expect(Math.abs(s.psd[25]! / 0.49993791 - 1)).toBeLessThan(1e-6);
      const nd = welch256(x, 'density', false);
      let f2 = 0;
      for (let k = 1; k <= 127; k++) if (k < 20 || k > 30) f2 += nd.psd[k]!;
      expect(Math.abs(f2 / count / 1.9960109e-5 - 1)).toBeLessThan(1e-6);
    });

    it('reads a noise-only floor of 1.9945043e-5 V²/Hz', () => {
      const d = welch256(e);
      let floor = 0;
      for (let k = 1; k <= 127; k++) floor += d.psd[k]!;
      expect(Math.abs(floor / 127 / 1.9945043e-5 - 1)).toBeLessThan(1e-6);
    });
  });

  it('returns no segments for a signal shorter than one segment, and NaN-free zeros', () => {
    const d = welch(new Float64Array(100), fs, { nperseg: 256 });
    expect(d.segments).toBe(0);
    expect(d.psd.every((v) => v === 0)).toBe(true);
  });
});
