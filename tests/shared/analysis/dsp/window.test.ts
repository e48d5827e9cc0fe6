import { describe, expect, it } from 'vitest';
import {
  hannPeriodic,
  hannSymmetric,
  windowFigures,
  windowResponseDb,
} from '../../../../shared/analysis/dsp/window';

describe('Hann window figures (Harris 1978, Table I; tests/REFERENCES.md §1)', () => {
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
