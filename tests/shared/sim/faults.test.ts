import { describe, expect, it } from 'vitest';
import { findPeaks } from '../../../shared/analysis/dsp/peaks';
import { welch } from '../../../shared/analysis/dsp/welch';
import { scenarios, withFaults } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';
import type { Scenario } from '../../../shared/sim/types';
import { col, hoverOutputs, hoverRows, hoverThrusts, meanOver, tonePower } from './helpers';

const short = { seconds: 30, rateHz: 500, seed: 7 };
const run = (s: Scenario, o = short) => simulate(s, o);
const scenario = (name: string) => {
  const s = scenarios[name];
  if (!s) throw new Error(`no scenario ${name}`);
  return s;
};
const clean = run(scenario('clean-quad-x'));
const cleanOut = hoverOutputs(clean.log, clean.truth);

// These tests check the synthesiser against its own fault model: each fault is injected by the
// scenarios of shared/sim/scenarios.ts through shared/sim/faults.ts, and the expected effect
// follows from the synthesiser's physics (shared/sim/plant.ts) or from a published relation
// named beside the check. The tolerances are this file's own, set to the sampling noise of a
// 30 s flight; none is a published limit.
describe('simulate: each fault changes what it should and nothing else', () => {
  it('a 12 % weaker motor 3 needs 1/√0.88 more output; the others stay put', () => {
    // Thrust ∝ output² for our motor model, so equal thrust needs output × 1/√0.88.
    const { log, truth } = run(scenario('weak-motor'));
    const out = hoverOutputs(log, truth);
    expect(out[2]! / cleanOut[2]!).toBeCloseTo(1 / Math.sqrt(0.88), 2);
    expect(Math.abs(out[2]! / cleanOut[2]! - 1 / Math.sqrt(0.88))).toBeLessThan(0.005);
    for (const i of [0, 1, 3]) expect(Math.abs(out[i]! / cleanOut[i]! - 1)).toBeLessThan(0.004);
    expect(truth.params.thrustEfficiency).toEqual([1, 1, 0.88, 1]);
  });

  it('a damaged prop (same fault, prop cause) spins that rotor faster instead', () => {
    const s = withFaults(scenario('clean-quad-x'), [
      { kind: 'weak-motor', motor: 1, efficiency: 0.88, cause: 'prop' },
    ]);
    const { log, truth } = run(s);
    const rpm1 = col(log, 'rpm1');
    const rpm2 = col(log, 'rpm2');
    const ranges = hoverRows(log, truth);
    expect(meanOver(ranges, (r) => rpm1[r]! / rpm2[r]!)).toBeCloseTo(1 / Math.sqrt(0.88), 2);
  });

  it('a CG 15 mm forward loads the front pair, with no yaw part', () => {
    const { log, truth } = run(scenario('cg-offset'));
    // Moments about the CG vanish in a steady hover (shared/README.md §4, tests/REFERENCES.md
    // §5.3), so the thrust-weighted motor position is the CG the scenario injected.
    expect(truth.trueCg).toEqual({ x: 15, y: 0 });
    const t = hoverThrusts(log, truth);
    const total = t.reduce((a, b) => a + b, 0);
    const xc = truth.airframe.motors.reduce((s, m, i) => s + m.x * t[i]!, 0) / total;
    const yc = truth.airframe.motors.reduce((s, m, i) => s + m.y * t[i]!, 0) / total;
    expect(Math.abs(xc - 15)).toBeLessThan(1);
    expect(Math.abs(yc)).toBeLessThan(1);
    // No yaw part: both spin sets still carry half.
    expect((t[0]! + t[2]!) / total).toBeCloseTo(0.5, 2);
  });

  it('an unbalanced rotor shakes the frame without changing the outputs', () => {
    const { log, truth } = run(scenario('rotor-imbalance'));
    const out = hoverOutputs(log, truth);
    out.forEach((v, i) => expect(Math.abs(v / cleanOut[i]! - 1)).toBeLessThan(0.002));
    const [a, b] = hoverRows(log, truth)[0]!;
    const rpm2 = col(log, 'rpm2');
    const hz = meanOver([[a, b]], (r) => rpm2[r]!) / 60;
    const faulty = tonePower(col(log, 'acc_y'), a, b, hz, 500);
    const base = tonePower(col(clean.log, 'acc_y'), a, b, hz, 500);
    // 2 g·mm of unbalance (injected) must stand 13 dB above the healthy rotor's line: this test's margin.
    expect(faulty / base).toBeGreaterThan(20);
  });

  it('a frame resonance adds a fixed line and leaves every motor output identical', () => {
    const opts = { seconds: 30, rateHz: 1000, seed: 3 };
    const res = simulate(scenario('frame-resonance'), opts);
    const base = simulate(scenario('clean-quad-x'), opts);
    for (let i = 1; i <= 4; i++)
      expect(col(res.log, `motor${i}`)).toEqual(col(base.log, `motor${i}`));
    const [a, b] = hoverRows(res.log, res.truth)[0]!;
    const gx = col(res.log, 'gyro_x');
    const at = (hz: number) => {
      let s = 0;
      for (let f = hz - 3; f <= hz + 3; f += 0.5) s += tonePower(gx, a, b, f, 1000);
      return s;
    };
    // The injected 290 Hz mode stands 10 dB over a quiet stretch of spectrum: this test's margin.
    expect(at(290) / at(250)).toBeGreaterThan(10);
    expect(res.truth.params.frameResonanceHz).toBe(290);
  });

  it('a tired pack sags by its larger internal resistance (V = V_oc − I·R)', () => {
    // tests/REFERENCES.md §10: R = ΔV/ΔI between two current levels close in time.
    for (const [name, scale] of [
      ['clean-quad-x', 1],
      ['tired-battery', 3.5],
    ] as const) {
      const { log, truth } = run(scenario(name));
      const punch = truth.phases.find((p) => p.kind === 'punch-out')!;
      const v = col(log, 'vbat');
      const i = col(log, 'ibat');
      const before = [[Math.round((punch.t0 - 0.6) * 500), Math.round((punch.t0 - 0.1) * 500)]] as [
        number,
        number,
      ][];
      const during = [[Math.round((punch.t1 - 0.2) * 500), Math.round(punch.t1 * 500)]] as [
        number,
        number,
      ][];
      const dV = meanOver(before, (r) => v[r]!) - meanOver(during, (r) => v[r]!);
      const dI = meanOver(during, (r) => i[r]!) - meanOver(before, (r) => i[r]!);
      expect(dI).toBeGreaterThan(10);
      expect(dV / dI / truth.params.batteryResistanceOhm).toBeCloseTo(1, 1);
      // 8 mΩ a cell × 4 cells, the synthesiser’s healthy pack (shared/sim/build.ts, plant.ts),
      // × 3.5 when tired.
      expect(truth.params.batteryResistanceOhm).toBeCloseTo(0.032 * scale, 6);
    }
  });

  it('undersized ESCs go over their rating in the punch-out only', () => {
    // 'esc-overcurrent' injects 8 A ESCs; the punch-out is the only phase past their rating.
    const { log, truth } = run(scenario('esc-overcurrent'));
    expect(truth.airframe.escMaxA).toBe(8);
    expect(log.channels).toContain('imotor1');
    const peak = Math.max(...[1, 2, 3, 4].map((k) => Math.max(...col(log, `imotor${k}`))));
    expect(peak).toBeGreaterThan(8);
    expect(truth.params.escOverS).toBeGreaterThan(0.05);
    expect(truth.params.escOverS).toBeLessThan(1);
    expect(clean.truth.params.escOverS).toBe(0);
    const out = hoverOutputs(log, truth);
    out.forEach((v, i) => expect(Math.abs(v / cleanOut[i]! - 1)).toBeLessThan(0.002));
  });

  it('an underpowered build hovers high and saturates where the healthy one does not', () => {
    // 'underpowered' injects 30 % of the thrust; 0.75 and 0.98 are this test's bounds.
    const { log, truth } = run(scenario('underpowered'));
    hoverOutputs(log, truth).forEach((v) => expect(v).toBeGreaterThan(0.75));
    expect(truth.params.saturationS).toBeGreaterThan(0.1);
    expect(clean.truth.params.saturationS).toBe(0);
    const m1 = col(log, 'motor1');
    expect(m1.some((v) => v >= 0.98)).toBe(true);
  });

  it('a setpoint delay shows as extra lag between setpoint and gyro', () => {
    // Knapp & Carter 1976 (tests/REFERENCES.md §11): the delay is the lag of the cross-correlation peak.
    const lagMs = (name: string) => {
      const { log } = run(scenario(name));
      const sp = col(log, 'sp_roll');
      const g = col(log, 'gyro_x');
      let best = 0;
      let bestK = 0;
      for (let k = 0; k <= 100; k++) {
        let s = 0;
        for (let i = 0; i + k < log.rows; i++) s += sp[i]! * g[i + k]!;
        if (s > best) {
          best = s;
          bestK = k;
        }
      }
      return (bestK / 500) * 1000;
    };
    // 'tracking-delay' injects 40 ms; 8 ms (4 samples at 500 Hz) is this test's allowance.
    const extra = lagMs('tracking-delay') - lagMs('clean-quad-x');
    expect(Math.abs(extra - 40)).toBeLessThanOrEqual(8);
  });

  it('a steady CG offset stays trimmed through throttle steps (punch-out and the drop after it)', () => {
    // A rate loop with integral action holds a steady offset. The moment a CG offset asks for
    // grows with thrust, so the trim has to follow the collective: the pitch error through the
    // punch-out and recovery stays close to the healthy aircraft's.
    const wideFront = scenario('wide-front-healthy');
    const pitchErrorRms = (s: Scenario) => {
      const { log, truth } = run(s);
      const sp = col(log, 'sp_pitch');
      const g = col(log, 'gyro_y');
      const rows = truth.phases
        .filter((p) => p.kind === 'punch-out' || p.kind === 'recover')
        .map((p) => [Math.round(p.t0 * 500), Math.round(p.t1 * 500)] as [number, number]);
      return Math.sqrt(meanOver(rows, (i) => (sp[i]! - g[i]!) ** 2));
    };
    const healthy = pitchErrorRms(wideFront);
    const offset = pitchErrorRms(withFaults(wideFront, [{ kind: 'cg-offset', dxMm: 14, dyMm: 0 }]));
    expect(offset).toBeLessThan(healthy * 1.5 + 1);
  });

  it('logs at 1 kHz carry no line the same flight at 4 kHz lacks (nothing folds in)', () => {
    // Each vibration source is generated at the log rate behind the anti-alias model, so a line
    // above Nyquist is dropped rather than folded: every peak of the 1 kHz log must sit where the
    // 4 kHz log of the same flight has one too. Welch (1967) PSD, 3.9 Hz bins at both rates.
    const s = scenario('clean-quad-x');
    const peaksAt = (rateHz: number) => {
      const { log } = run(s, { seconds: 30, rateHz, seed: 3 });
      const from = Math.round(2 * rateHz);
      const spec = welch(col(log, 'gyro_x'), rateHz, {
        nperseg: rateHz === 1000 ? 256 : 1024,
        ranges: [[from, log.rows - rateHz]],
      });
      return findPeaks(spec, { minHz: 20, minProminenceDb: 10, max: 8 }).map((p) => p.hz);
    };
    const low = peaksAt(1000);
    const high = peaksAt(4000);
    expect(low.length).toBeGreaterThan(0);
    for (const hz of low)
      expect(
        high.some((h) => Math.abs(h - hz) <= 8),
        `${hz} Hz`,
      ).toBe(true);
  });

  it('combines faults: a weak motor and a CG offset both show', () => {
    const s = withFaults(scenario('weak-motor'), [{ kind: 'cg-offset', dxMm: 0, dyMm: 12 }]);
    const { log, truth } = run(s);
    expect(truth.faults.map((f) => f.kind)).toEqual(['weak-motor', 'cg-offset']);
    const t = hoverThrusts(log, truth);
    const total = t.reduce((a, b) => a + b, 0);
    const yc = truth.airframe.motors.reduce((acc, m, i) => acc + m.y * t[i]!, 0) / total;
    expect(Math.abs(yc - 12)).toBeLessThan(1);
    // Against the CG fault alone, only motor 3 moves, by 1/√0.88.
    const cgOnly = run(
      withFaults(scenario('clean-quad-x'), [{ kind: 'cg-offset', dxMm: 0, dyMm: 12 }]),
    );
    const out = hoverOutputs(log, truth);
    const ref = hoverOutputs(cgOnly.log, cgOnly.truth);
    expect(Math.abs(out[2]! / ref[2]! - 1 / Math.sqrt(0.88))).toBeLessThan(0.005);
    for (const i of [0, 1, 3]) expect(Math.abs(out[i]! / ref[i]! - 1)).toBeLessThan(0.004);
  });
});
