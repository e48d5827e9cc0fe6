import { describe, expect, it } from 'vitest';
import { G0 } from '../../../shared/airframe/allocation';
import { scenarios } from '../../../shared/sim/scenarios';
import { reactionYawSign } from '../../../shared/sim/plant';
import { simulate } from '../../../shared/sim/simulate';
import type { Scenario } from '../../../shared/sim/types';
import { col, hoverRows, hoverThrusts, meanOver } from './helpers';

const short = { seconds: 30, rateHz: 500, seed: 7 };
const run = (s: Scenario, o = short) => simulate(s, o);
const scenario = (name: string) => {
  const s = scenarios[name];
  if (!s) throw new Error(`no scenario ${name}`);
  return s;
};
const clean = run(scenario('clean-quad-x'));

describe('simulate: physics sanity', () => {
  it('carries exactly the weight in a steady hover', () => {
    // Steady hover: Σ T = m·g0 with g0 = 9.80665 m/s² (standard gravity, CGPM 1901).
    for (const name of ['clean-quad-x', 'hex-clean']) {
      const { log, truth } = run(scenario(name));
      const total = hoverThrusts(log, truth).reduce((a, b) => a + b, 0);
      expect(total / (truth.params.massKg * G0)).toBeCloseTo(1, 2);
      // Specific force in FRD: thrust pushes along −z, so a hover reads −1 g on acc_z.
      const az = col(log, 'acc_z');
      expect(meanOver(hoverRows(log, truth), (r) => az[r]!)).toBeCloseTo(-1, 2);
    }
  });

  it('gives a clockwise prop a negative (nose-left) reaction yaw moment', () => {
    // Newton's third law: the frame turns opposite to the prop (shared/README.md §4 sign convention).
    expect(reactionYawSign('cw')).toBe(-1);
    expect(reactionYawSign('ccw')).toBe(1);
  });

  it('holds yaw only when the two spin sets’ reaction torques cancel', () => {
    // Newton's third law; common practice for paired spin directions: with matched props the
    // sets share equally, with cw props 10 % torquier the controller slows them until
    // kQ_cw·ω_cw² = kQ_ccw·ω_ccw², i.e. ω_ccw/ω_cw = √1.1.
    for (const [name, ratio] of [
      ['clean-quad-x', 1],
      ['spin-mismatch', Math.sqrt(1.1)],
    ] as const) {
      const { log, truth } = run(scenario(name));
      const ranges = hoverRows(log, truth);
      const rpm = [1, 2, 3, 4].map((i) => col(log, `rpm${i}`));
      const ccw = meanOver(ranges, (r) => rpm[0]![r]! + rpm[2]![r]!);
      const cw = meanOver(ranges, (r) => rpm[1]![r]! + rpm[3]![r]!);
      expect(ccw / cw).toBeCloseTo(ratio, 2);
      // Net reaction torque over the hover ≈ 0, relative to one rotor's torque.
      const { kQ } = truth.params;
      const net = meanOver(ranges, (r) =>
        truth.airframe.motors.reduce(
          (s, m, i) => s + reactionYawSign(m.spin) * kQ[i]! * rpm[i]![r]! ** 2,
          0,
        ),
      );
      const one = meanOver(ranges, (r) => kQ[0]! * rpm[0]![r]! ** 2);
      expect(Math.abs(net / one)).toBeLessThan(0.01);
      const gz = col(log, 'gyro_z');
      expect(Math.abs(meanOver(ranges, (r) => gz[r]!))).toBeLessThan(0.5);
    }
  });

  it('rolls right by raising the left motors', () => {
    // Common practice quad-X pattern: a right roll raises motors 3 (rear-left) and 4 (front-left).
    const { log, truth } = clean;
    const roll = truth.phases.find((p) => p.kind === 'roll')!;
    const a = Math.round((roll.t0 + 0.05) * 500);
    const b = Math.round((roll.t0 + 0.35) * 500);
    const m = [1, 2, 3, 4].map((i) => col(log, `motor${i}`));
    const left = meanOver([[a, b]], (r) => m[2]![r]! + m[3]![r]!);
    const right = meanOver([[a, b]], (r) => m[0]![r]! + m[1]![r]!);
    expect(left).toBeGreaterThan(right);
    const gx = col(log, 'gyro_x');
    expect(meanOver([[a + 50, b + 50]], (r) => gx[r]!)).toBeGreaterThan(10);
  });

  it('settles an asymmetric frame where the moments about the CG vanish', () => {
    // shared/README.md §4: moments about the CG; tests/REFERENCES.md §5.3: rear/front thrust = 1.2 exactly
    // for front arms 1.2× the rear.
    const { log, truth } = run(scenario('wide-front-healthy'));
    const t = hoverThrusts(log, truth);
    expect((t[1]! + t[2]!) / (t[0]! + t[3]!)).toBeCloseTo(1.2, 2);
    const total = t.reduce((a, b) => a + b, 0);
    const xc = truth.airframe.motors.reduce((s, m, i) => s + m.x * t[i]!, 0) / total;
    const yc = truth.airframe.motors.reduce((s, m, i) => s + m.y * t[i]!, 0) / total;
    expect(Math.abs(xc)).toBeLessThan(0.5);
    expect(Math.abs(yc)).toBeLessThan(0.5);
    t.forEach((v, i) => expect(v / truth.params.trueHoverThrustN[i]!).toBeCloseTo(1, 2));
  });

  it('shares the load equally on healthy symmetric hex and octo frames', () => {
    for (const name of ['hex-clean', 'octo-clean', 'quad-plus', 'stretched-healthy']) {
      const { log, truth } = run(scenario(name));
      const t = hoverThrusts(log, truth);
      const mean = t.reduce((a, b) => a + b, 0) / t.length;
      t.forEach((v) => expect(v / mean).toBeCloseTo(1, 1));
    }
  });
});
