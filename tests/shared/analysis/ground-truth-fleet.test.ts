/**
 * Ground truth on builds like the demo fleet's (shared/sim): the synthesiser injects one known
 * fault, and the verdict names that fault and nothing it did not inject.
 */
import { describe, expect, it } from 'vitest';
import { presetAirframe } from '../../../shared/airframe/presets';
import { analyzeFlight } from '../../../shared/analysis/analyze-flight';
import { simulate } from '../../../shared/sim/simulate';
import type { Fault, Scenario } from '../../../shared/sim/types';

const heronLike = presetAirframe('wide-front-x', {
  name: 'Wide-front cinematic quad',
  armMm: 125,
  massG: 920,
  frontArmScale: 1.2,
});

function fly(airframe: Scenario['airframe'], faults: Fault[], rateHz: number, seed: number) {
  const { log, truth } = simulate(
    { name: 'case', describe: 'case', airframe, faults, seconds: 36, rateHz },
    { seed },
  );
  return { ...analyzeFlight(log, { airframe }), truth, log };
}
const codes = (r: ReturnType<typeof fly>, severity?: string) =>
  r.report.findings.filter((f) => !severity || f.severity === severity).map((f) => f.code);

describe('a CG offset on a wide-front quad', () => {
  const r = fly(heronLike, [{ kind: 'cg-offset', dxMm: 14, dyMm: 0 }], 500, 108);

  it('is named as a CG offset, forward, within 3 mm', () => {
    expect(codes(r)).toContain('cg-offset');
    expect(Math.abs(r.report.cg!.xMm - r.truth.trueCg.x)).toBeLessThan(3);
    expect(r.detail.diagnosis.pattern).toBe('cg-offset');
  });

  it('does not read as a tracking problem: the integrator holds the trim', () => {
    expect(codes(r)).not.toContain('tracking-lag');
    const clean = fly(heronLike, [], 500, 108);
    // The lag is the loop's, not the offset's (Knapp & Carter 1976, tests/REFERENCES.md §11: the
    // cross-correlation peak measures the delay, which a steady offset must not change).
    const lag = r.report.tracking!.pitch.lagMs!;
    expect(Math.abs(lag - clean.report.tracking!.pitch.lagMs!)).toBeLessThan(15);
  });
});

const ospreyLike = presetAirframe('hex-x', { name: 'Hex survey rig', armMm: 300, massG: 2800 });

describe('a frame mode on a hex logged at 500 Hz', () => {
  const r = fly(ospreyLike, [{ kind: 'frame-resonance', hz: 140, q: 14, rmsDegS: 5 }], 500, 110);

  it('labels the line frame (it holds 140 Hz while the rotors change speed) and raises frame-resonance', () => {
    // The mode sits where the motors' electrical line (12 pole pairs × a ~95 Hz hover rotor
    // speed ≈ 1140 Hz) folds down by the 500 Hz log rate; that line would move with rpm, this
    // one does not (shared/README.md §6: frame = constant frequency across throttle).
    expect(ospreyLike.poles).toBe(24);
    const fs = r.report.sampleRateHz;
    const bin = fs / 128;
    for (const ch of ['gyro_x', 'gyro_y'] as const) {
      const peak = r.report.vibration[ch]!.peaks.find((p) => Math.abs(p.hz - 140) < bin)!;
      expect(peak.label).toBe('frame');
    }
    expect(codes(r)).toContain('frame-resonance');
    expect(r.report.findings.some((f) => /electrical/.test(f.message))).toBe(false);
  });

  it('does not call the healthy hex’s rotor lines frame', () => {
    const clean = fly(ospreyLike, [], 500, 110);
    for (const v of Object.values(clean.report.vibration))
      expect(v.peaks.every((p) => p.label !== 'frame')).toBe(true);
    expect(codes(clean)).not.toContain('frame-resonance');
  });
});

const kiteLike = presetAirframe('quad-x', { name: '5-inch quad X', armMm: 110, massG: 610 });

describe('a healthy quad logged at 1 kHz', () => {
  const r = fly(kiteLike, [], 1000, 101);

  it('carries no peak that the rotors do not explain: each is a rotor order at a speed flown', () => {
    const fs = r.report.sampleRateHz;
    const tol = 1.5 * (fs / 256);
    const fold = (f: number) => Math.abs(f - fs * Math.round(f / fs));
    const blades = kiteLike.prop.blades;
    // Ground truth: the logged rotor speeds. A peak is explained when some motor's 1×, 2× or
    // blade-pass line (folded by the log rate) sat within a bin and a half of it for at least a
    // quarter of a second of the flight.
    const explained = (hz: number) => {
      let samples = 0;
      for (let i = 0; i < r.log.rows; i++) {
        let hit = false;
        for (let m = 1; m <= 4 && !hit; m++) {
          const f1 = r.log.columns[`rpm${m}`]![i]! / 60;
          hit = [1, 2, blades].some((h) => Math.abs(fold(h * f1) - hz) <= tol);
        }
        if (hit) samples++;
      }
      return samples / fs >= 0.25;
    };
    let peaks = 0;
    for (const v of Object.values(r.report.vibration)) {
      for (const p of v.peaks) {
        peaks++;
        expect(explained(p.hz), `${p.hz} Hz`).toBe(true);
        expect(['rotor-1x', 'rotor-2x', 'blade-pass']).toContain(p.label);
      }
    }
    expect(peaks).toBeGreaterThan(0);
  });
});
