import { describe, expect, it } from 'vitest';
import { labelPeak } from '../../../shared/analysis/peak-labels';

describe('labelPeak', () => {
  const base = { blades: 3, df: 4, fs: 1000, rows: [], by: 'rpm' as const };
  it('names rotor 1×, blade pass and 2× from each motor’s own speed', () => {
    expect(labelPeak(200, { ...base, motorHz: [200, 200, 180, 180] }).label).toBe('rotor-1x');
    expect(labelPeak(180, { ...base, motorHz: [200, 200, 180, 180] }).label).toBe('rotor-1x');
    expect(labelPeak(120, { ...base, motorHz: [40, 40, 40, 40] }).label).toBe('blade-pass');
    expect(labelPeak(80, { ...base, motorHz: [40, 40, 40, 40] }).label).toBe('rotor-2x');
    expect(labelPeak(257, { ...base, motorHz: [200, 200, 200, 200] }).label).toBeNull();
  });

  it('names the one motor whose order matches', () => {
    expect(labelPeak(220, { ...base, motorHz: [200, 200, 220, 200] })).toMatchObject({
      label: 'rotor-1x',
      motor: 3,
    });
  });

  it('folds orders above Nyquist back (tests/REFERENCES.md §3: 600 Hz at 1000 Hz appears at 400 Hz)', () => {
    // 400 Hz is 2× of a 200 Hz rotor directly; the direct reading wins over a folded one.
    expect(labelPeak(400, { ...base, motorHz: [200, 200, 200, 200] }).label).toBe('rotor-2x');
    // 220 Hz rotor, 3 blades: blade pass 660 Hz folds to 340 Hz.
    expect(labelPeak(340, { ...base, motorHz: [220, 220, 220, 220] })).toMatchObject({
      label: 'blade-pass',
      aliasOfHz: 660,
    });
    // 14-pole motor (7 pole pairs) at 6000 rpm: electrical 700 Hz folds to 300 Hz (tests/REFERENCES.md §3).
    const e = labelPeak(300, { ...base, blades: 2, poles: 14, motorHz: [100, 100, 100, 100] });
    expect(e).toMatchObject({ label: null, aliasOfHz: 700 });
  });
});

describe('labelPeak: constancy across rotor speed before coincidences', () => {
  // Rows of short-time spectra at three rotor speeds, each with a line at the same 140 Hz bin.
  const fs = 500;
  const df = fs / 128;
  const k = Math.round(140 / df);
  const rowAt = (rpm: number) => {
    const power = new Float64Array(65).fill(1e-4);
    power[k] = 1e-1;
    return {
      value: rpm,
      power,
      count: 10,
      db: Float64Array.from(power, (p) => 10 * Math.log10(p)),
    };
  };
  const ctx = {
    blades: 2,
    df,
    fs,
    by: 'rpm' as const,
    poles: 24,
    rowWidth: 300,
    // 95 Hz rotors: 12 pole pairs × 95 = 1140 Hz folds to 140 Hz at 500 Hz.
    motorHz: [95, 95, 95, 95, 95, 95],
    rows: [rowAt(4800), rowAt(5700), rowAt(6600)],
  };

  it('calls a line that holds its frequency across rotor speeds frame, whatever folds onto it', () => {
    expect(labelPeak(k * df, ctx).label).toBe('frame');
  });

  it('keeps the folded electrical reading when there is no spread of speeds to judge by', () => {
    expect(labelPeak(k * df, { ...ctx, rows: [] })).toMatchObject({
      label: null,
      aliasOfHz: 1140,
    });
  });

  it('names a rotor order the rotors reached only in one row (a punch-out) from where its energy sits', () => {
    const power = new Float64Array(65).fill(1e-4);
    const kPunch = Math.round(200 / df);
    power[kPunch] = 1e-1;
    const punch = {
      value: 12000,
      power,
      count: 3,
      db: Float64Array.from(power, (p) => 10 * Math.log10(p)),
    };
    const quiet = (rpm: number) => {
      const p = new Float64Array(65).fill(1e-4);
      return {
        value: rpm,
        power: p,
        count: 200,
        db: Float64Array.from(p, (v) => 10 * Math.log10(v)),
      };
    };
    const r = labelPeak(kPunch * df, { ...ctx, rows: [quiet(5700), quiet(6000), punch] });
    expect(r.label).toBe('rotor-1x');
  });
});
