import { describe, expect, it } from 'vitest';
import { RealFft } from '../../../shared/analysis/dsp/real-fft';
import {
  hannPeriodic,
  hannSymmetric,
  windowFigures,
  windowResponseDb,
} from '../../../shared/analysis/dsp/window';
import { bandRms, welch } from '../../../shared/analysis/dsp/welch';
import { findPeaks, parabolicPeak } from '../../../shared/analysis/dsp/peaks';
import { parkMiller } from './park-miller';

const fs = 1000;
const df = 3.90625;
const signal = (n: number, f: (t: number) => number) =>
  Float64Array.from({ length: n }, (_, i) => f(i / fs));
const welch256 = (
  x: Float64Array,
  scaling: 'density' | 'spectrum' = 'density',
  detrend: 'constant' | false = 'constant',
) => welch(x, fs, { nperseg: 256, noverlap: 128, scaling, detrend });

describe('fft.js wrapper', () => {
  it('matches a direct DFT on small sizes', () => {
    for (const n of [2, 4, 8, 16, 32, 64]) {
      const rand = parkMiller(7);
      const x = Float64Array.from({ length: n }, () => rand() / 2147483647 - 0.5);
      const { re, im } = new RealFft(n).spectrum(x);
      for (let k = 0; k <= n / 2; k++) {
        let dr = 0;
        let di = 0;
        for (let j = 0; j < n; j++) {
          dr += x[j]! * Math.cos((-2 * Math.PI * k * j) / n);
          di += x[j]! * Math.sin((-2 * Math.PI * k * j) / n);
        }
        expect(re[k]).toBeCloseTo(dr, 12);
        expect(im[k]).toBeCloseTo(di, 12);
      }
    }
  });

  it('rejects sizes that are not a power of two', () => {
    expect(() => new RealFft(12)).toThrow(RangeError);
    expect(() => new RealFft(1)).toThrow(RangeError);
  });

  it('gives |X| = 64, 32, 32 for a Hann-windowed bin-25 sine, N = 256 (REFERENCES §1, computed)', () => {
    const w = hannPeriodic(256);
    const x = Float64Array.from(w, (v, n) => v * Math.sin((2 * Math.PI * 25 * n) / 256));
    const p = new Float64Array(129);
    new RealFft(256).powerSpectrum(x, p);
    expect(Math.sqrt(p[25]!)).toBeCloseTo(64, 10);
    expect(Math.sqrt(p[24]!)).toBeCloseTo(32, 10);
    expect(Math.sqrt(p[26]!)).toBeCloseTo(32, 10);
    for (let k = 0; k < 129; k++)
      if (k < 24 || k > 26) expect(Math.sqrt(p[k]!)).toBeLessThan(1e-10);
  });
});

describe('Hann window figures (Harris 1978, Table I; REFERENCES §1)', () => {
  it('has coherent gain 0.5 and ENBW 1.5 bins (periodic form)', () => {
    for (const n of [16, 256, 4096]) {
      const f = windowFigures(hannPeriodic(n));
      expect(f.coherentGain).toBeCloseTo(0.5, 12);
      expect(f.enbwBins).toBeCloseTo(1.5, 12);
    }
  });

  it('loses 1.4236 dB half a bin off centre (scalloping; CMSIS-DSP "flatness −1.4236 dB")', () => {
    expect(windowResponseDb(hannPeriodic(256), 0.5)).toBeCloseTo(
      20 * Math.log10(8 / (3 * Math.PI)),
      3,
    );
    expect(Math.abs(windowResponseDb(hannPeriodic(1024), 0.5) + 1.423623)).toBeLessThan(2e-4);
  });

  it('has a first null at 2 bins and side lobes near −31.5 dB (CMSIS-DSP PSLL 31.5 dB)', () => {
    const w = hannPeriodic(1024);
    expect(windowResponseDb(w, 2)).toBeLessThan(-200);
    expect(Math.abs(windowResponseDb(w, 2.36) + 31.467)).toBeLessThan(0.03);
  });

  it('symmetric Hann of 256 has coherent gain (N−1)/(2N) and ENBW 1.5·N/(N−1) (MathWorks enbw page)', () => {
    const f = windowFigures(hannSymmetric(256));
    expect(f.coherentGain).toBeCloseTo(255 / 512, 12);
    expect(f.enbwBins).toBeCloseTo((1.5 * 256) / 255, 12);
    // MathWorks enbw(hann(128), 1000) = 11.8110 Hz
    expect(windowFigures(hannSymmetric(128)).enbwBins * (1000 / 128)).toBeCloseTo(11.811, 3);
  });
});

describe('Welch PSD against scipy.signal.welch (REFERENCES §2.2, computed with scipy 1.17.1)', () => {
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

describe('peaks and harmonic interpolation (REFERENCES §3; J. O. Smith, SASP)', () => {
  const harmonics = (f0: number) =>
    signal(
      4096,
      (t) =>
        Math.sin(2 * Math.PI * f0 * t) +
        0.5 * Math.sin(2 * Math.PI * 2 * f0 * t) +
        0.2 * Math.sin(2 * Math.PI * 3 * f0 * t),
    );

  it('P1: finds bin-centred harmonics at 97.66, 195.31, 292.97 Hz with heights 0.5, 0.125, 0.02', () => {
    const peaks = findPeaks(welch256(harmonics(97.65625), 'spectrum'), { minValue: 0.01 });
    expect(peaks.map((p) => p.bin)).toEqual([25, 50, 75]);
    peaks.forEach((p, i) => expect(p.hz / 97.65625).toBeCloseTo(i + 1, 9));
    expect(peaks.map((p) => 10 ** (p.db / 10))).toEqual([
      expect.closeTo(0.5, 9),
      expect.closeTo(0.125, 9),
      expect.closeTo(0.02, 9),
    ]);
  });

  it('P2: interpolates a 100 Hz rotor and its harmonics to scipy-derived frequencies and heights', () => {
    const peaks = findPeaks(welch256(harmonics(100), 'spectrum'), { minValue: 0.01 });
    expect(peaks.map((p) => p.bin)).toEqual([26, 51, 77]);
    const hz = [99.95258, 200.05418, 299.94582];
    const h = [0.52544, 0.12665, 0.02026];
    peaks.forEach((p, i) => {
      expect(Math.abs(p.hz / hz[i]! - 1)).toBeLessThan(1e-6);
      // heights printed to 5 decimals
      expect(Math.abs(10 ** (p.db / 10) - h[i]!)).toBeLessThan(1e-5);
      expect(Math.abs(p.hz / 100 - (i + 1))).toBeLessThan(0.01);
    });
  });

  it('parabola offset is ½(α−γ)/(α−2β+γ) and zero for a symmetric triple', () => {
    expect(parabolicPeak(-3, 0, -3).p).toBeCloseTo(0, 15);
    expect(parabolicPeak(-1, 0, -3).p).toBeCloseTo(-0.25, 12);
  });

  it('ignores a flat spectrum', () => {
    const flat = {
      hz: Float64Array.from({ length: 64 }, (_, i) => i),
      psd: new Float64Array(64).fill(1),
      df: 1,
      segments: 1,
    };
    expect(findPeaks(flat)).toEqual([]);
  });
});
