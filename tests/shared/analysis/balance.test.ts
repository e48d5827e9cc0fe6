import { describe, expect, it } from 'vitest';
import { hoverThrustsN, mixerMatrix } from '../../../shared/airframe/allocation';
import { presetAirframe } from '../../../shared/airframe/presets';
import { analyseBalance, fitPatterns, hoverMeans } from '../../../shared/analysis/balance';
import { effortRows, decomposeEffort } from '../../../shared/analysis/effort';
import { diagnose } from '../../../shared/analysis/diagnosis';
import { defaultThresholds } from '../../../shared/schemas/thresholds';
import type { Airframe } from '../../../shared/schemas/airframe';

// tests/REFERENCES.md §5: arm 0.15 m at 45° → d = 106.066 mm; 0.6 kg; M1 FR ccw, M2 RR cw, M3 RL ccw, M4 FL cw.
const d = 150 / Math.SQRT2;
const quad = (front = 1): Airframe => ({
  name: 'Kite',
  motors: [
    { x: d * front, y: d * front, spin: 'ccw' },
    { x: -d, y: d, spin: 'cw' },
    { x: -d, y: -d, spin: 'ccw' },
    { x: d * front, y: -d * front, spin: 'cw' },
  ],
  massG: 600,
  prop: { diameterIn: 5, pitchIn: 3.5, blades: 3 },
});

/** Constant output columns that deliver the given thrusts with thrust ∝ output² (γ = 2). */
const columnsFor = (thrusts: number[], scale = 0.05) =>
  thrusts.map((t) => new Float64Array(100).fill(Math.sqrt(t) * scale));
const all: [number, number][] = [[0, 100]];

describe('mixer sign pattern and numbers via shared/airframe (tests/REFERENCES.md §5.1, closed form 1/(4d), 1/(4k))', () => {
  it('gives each motor the published share of thrust, roll, pitch and yaw', () => {
    const m = mixerMatrix(quad().motors, { x: 0, y: 0 }, 0.016);
    const want = [
      [0.25, -2.357023, 2.357023, 15.625],
      [0.25, -2.357023, -2.357023, -15.625],
      [0.25, 2.357023, -2.357023, 15.625],
      [0.25, 2.357023, 2.357023, -15.625],
    ];
    want.forEach((row, i) => row.forEach((v, j) => expect(m[i]![j]).toBeCloseTo(v, 6)));
  });

  it('decomposes outputs into collective, roll, pitch and yaw effort in output units', () => {
    const rows = effortRows(quad());
    // A pure roll command of +0.1 (right side down: left motors up) reads back as roll 0.1.
    const u = [0.4 - 0.1, 0.4 - 0.1, 0.4 + 0.1, 0.4 + 0.1].map((v) => Float32Array.of(v));
    const e = decomposeEffort(quad(), u, 1);
    expect(e.collective[0]).toBeCloseTo(0.4, 6);
    expect(e.roll[0]).toBeCloseTo(0.1, 6);
    expect(e.pitch[0]).toBeCloseTo(0, 6);
    expect(e.yaw[0]).toBeCloseTo(0, 6);
    // Positive yaw (nose right) speeds the ccw props, §5.1 sign table.
    const y = decomposeEffort(
      quad(),
      [0.45, 0.35, 0.45, 0.35].map((v) => Float32Array.of(v)),
      1,
    );
    expect(y.yaw[0]).toBeCloseTo(0.05, 6);
    expect(rows).toHaveLength(4);
  });
});

describe('balance, torque split and CG', () => {
  it('finds zero deviation and a centred CG on a symmetric quad in a clean hover (§5.3: W/4 each)', () => {
    const af = quad();
    const t = hoverThrustsN(af);
    t.forEach((v) => expect(v).toBeCloseTo((0.6 * 9.80665) / 4, 6));
    const b = analyseBalance(af, hoverMeans(columnsFor(t), null, all, 2));
    b.deviationPct.forEach((v) => expect(v).toBeCloseTo(0, 9));
    expect(b.cg.xMm).toBeCloseTo(0, 9);
    expect(b.asymmetryPct).toBeCloseTo(0, 9);
  });

  it('expects rear/front = 1.2 on a frame with 20 % longer front arms and calls that healthy (§5.3)', () => {
    const af = quad(1.2);
    const t = hoverThrustsN(af);
    expect(t[0]).toBeCloseTo(1.33727, 5); // W/4.4
    expect(t[1]).toBeCloseTo(1.604725, 5); // 1.2·W/4.4
    const b = analyseBalance(af, hoverMeans(columnsFor(t), null, all, 2));
    b.deviationPct.forEach((v) => expect(Math.abs(v)).toBeLessThan(1e-9));
    expect(b.expectedShare[1]! / b.expectedShare[0]!).toBeCloseTo(1.2, 9);
    expect(diagnose(af, b, 20, defaultThresholds).pattern).toBe('healthy');
  });

  it('puts the CG 10 mm aft when the thrusts are the §5.3 CG-offset case (1.332311 / 1.609684 N)', () => {
    const af = quad();
    const t = hoverThrustsN(af, { x: -10, y: 0 });
    expect(t[0]).toBeCloseTo(1.332311, 6);
    expect(t[1]).toBeCloseTo(1.609684, 6);
    const b = analyseBalance(af, hoverMeans(columnsFor(t), null, all, 2));
    expect(b.cg.xMm).toBeCloseTo(-10, 6);
    expect(b.cg.yMm).toBeCloseTo(0, 6);
    // moments vanish about the estimated CG
    const m = af.motors.reduce((s, mo, i) => s + (mo.x - b.cg.xMm) * b.measuredShare[i]!, 0);
    expect(m).toBeCloseTo(0, 9);
    const dg = diagnose(af, b, 20, defaultThresholds);
    expect(dg.pattern).toBe('cg-offset');
    expect(dg.confidence).toBeGreaterThan(0.9);
    expect(dg.text).toMatch(/10 mm aft/);
  });

  it('tells one weak motor (one motor and a yaw part) from a spin-set mismatch (one spin set)', () => {
    const af = quad();
    const t = hoverThrustsN(af);
    // Motor 3 needs 8 % more output² for the same thrust.
    const weak = columnsFor(t.map((v, i) => (i === 2 ? v * 1.08 : v)));
    const bw = analyseBalance(af, hoverMeans(weak, null, all, 2));
    const fw = fitPatterns(af, bw.outputShare, bw.expectedShare);
    expect(fw[0]).toMatchObject({ pattern: 'weak-motor', motor: 3 });
    // shared/README.md §7: against the output expected at the measured total, √1.08/√(4.08/4) − 1
    expect(bw.deviationPct[2]).toBeCloseTo((Math.sqrt(1.08) / Math.sqrt(4.08 / 4) - 1) * 100, 6);
    // The cw props (2, 4) carry 6 % more each.
    const spin = columnsFor(t.map((v, i) => (i % 2 === 1 ? v * 1.06 : v)));
    const bs = analyseBalance(af, hoverMeans(spin, null, all, 2));
    expect(fitPatterns(af, bs.outputShare, bs.expectedShare)[0]!.pattern).toBe('spin-set');
    expect(bs.asymmetryPct).toBeGreaterThan(2);
  });

  it('uses rpm² for measured shares when rpm is logged (propeller law T ∝ n²)', () => {
    const af = quad();
    const out = columnsFor([1, 1, 1, 1]);
    const rpm = [10000, 10000, 10000, 11000].map((r) => new Float64Array(100).fill(r));
    const b = analyseBalance(af, hoverMeans(out, rpm, all, 2));
    expect(b.proxy).toBe('rpm');
    expect(b.measuredShare[3]! / b.measuredShare[0]!).toBeCloseTo(1.21, 9);
  });

  it('with rpm logged, judges a worn motor against the healthy motors’ thrust per output', () => {
    // Motor 3 worn: same rpm (so the same thrust, T = C_T·ρ·n²·D⁴) for 1/√0.91 more output.
    const af = quad();
    const out = [1, 1, 1 / Math.sqrt(0.91), 1].map((k) => new Float64Array(100).fill(0.4 * k));
    const rpm = [0, 1, 2, 3].map(() => new Float64Array(100).fill(12000));
    const b = analyseBalance(af, hoverMeans(out, rpm, all, 2));
    expect(b.deviationPct[2]).toBeCloseTo((1 / Math.sqrt(0.91) - 1) * 100, 6);
    for (const i of [0, 1, 3]) expect(b.deviationPct[i]).toBeCloseTo(0, 6);
  });

  it('compares mean outputs on both sides, so control jitter does not bias every motor low', () => {
    const af = quad();
    // Each motor alternates 0.35 / 0.45 around a 0.4 mean.
    const out = [0, 1, 2, 3].map(() =>
      Float64Array.from({ length: 100 }, (_, i) => (i % 2 ? 0.45 : 0.35)),
    );
    const b = analyseBalance(af, hoverMeans(out, null, all, 2));
    b.deviationPct.forEach((v) => expect(v).toBeCloseTo(0, 9));
  });

  it('says there was too little hover to judge below the threshold', () => {
    const af = quad();
    const b = analyseBalance(af, hoverMeans(columnsFor([1, 1, 1, 1]), null, all, 2));
    const dg = diagnose(af, b, 1.5, defaultThresholds);
    expect(dg.pattern).toBe('too-little-hover');
    expect(dg.text).toMatch(/Too little hover to judge/);
  });

  it('works on a hex: a weak motor 5 is named through the mixer projection', () => {
    const hex = presetAirframe('hex-x');
    const t = hoverThrustsN(hex);
    // Closed loop: the outputs that deliver the hover thrust when motor 5 makes 10 % less per output².
    const b = analyseBalance(
      hex,
      hoverMeans(columnsFor(t.map((v, i) => (i === 4 ? v / 0.9 : v))), null, all, 2),
    );
    const fits = fitPatterns(hex, b.outputShare, b.expectedShare);
    expect(fits[0]).toMatchObject({ pattern: 'weak-motor', motor: 5 });
  });
});
