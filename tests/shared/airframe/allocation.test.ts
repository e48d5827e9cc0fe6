import { describe, expect, it } from 'vitest';
import {
  allocationMatrix,
  expectedHoverShares,
  G0,
  hoverThrustsN,
  mixerMatrix,
} from '../../../shared/airframe/allocation';
import { multiplyVector } from '../../../shared/airframe/linear-algebra';
import { presetAirframe } from '../../../shared/airframe/presets';
import type { Motor } from '../../../shared/schemas/airframe';

// tests/REFERENCES.md §5 inputs: arm 0.15 m at 45°, d = 0.15/√2 m, k = 0.016 m; M1 FR ccw, M2 RR cw,
// M3 RL ccw, M4 FL cw. Positions here in mm.
const dM = 0.15 / Math.SQRT2;
const d = dM * 1000;
const symmetric: Motor[] = [
  { x: d, y: d, spin: 'ccw' },
  { x: -d, y: d, spin: 'cw' },
  { x: -d, y: -d, spin: 'ccw' },
  { x: d, y: -d, spin: 'cw' },
];
const frontLong: Motor[] = [
  { x: 1.2 * d, y: 1.2 * d, spin: 'ccw' },
  { x: -d, y: d, spin: 'cw' },
  { x: -d, y: -d, spin: 'ccw' },
  { x: 1.2 * d, y: -1.2 * d, spin: 'cw' },
];

/** |actual − expected| < tol, the form tests/REFERENCES.md states its tolerances in. */
function expectWithin(actual: number | undefined, expected: number, tol: number) {
  expect(Math.abs((actual ?? NaN) - expected)).toBeLessThan(tol);
}

function expectMatrixClose(actual: number[][], expected: number[][], tol: number) {
  expect(actual.length).toBe(expected.length);
  actual.forEach((row, r) =>
    row.forEach((v, c) => expect(Math.abs(v - expected[r]![c]!)).toBeLessThan(tol)),
  );
}

describe('allocationMatrix', () => {
  it('matches the symmetric quad-X matrix B of tests/REFERENCES.md §5.1', () => {
    // tests/REFERENCES.md §5.1 [computed from first principles]
    const B = allocationMatrix(symmetric);
    expectMatrixClose(
      B,
      [
        [1, 1, 1, 1],
        [-dM, -dM, dM, dM],
        [dM, -dM, -dM, dM],
        [0.016, -0.016, 0.016, -0.016],
      ],
      1e-12,
    );
  });

  it('takes arms relative to the CG', () => {
    const B = allocationMatrix(symmetric, { x: -10, y: 5 });
    expect(B[1]![0]).toBeCloseTo(-(d - 5) / 1000, 12);
    expect(B[2]![1]).toBeCloseTo((-d + 10) / 1000, 12);
  });
});

describe('mixerMatrix', () => {
  it('inverts the symmetric quad X exactly (tests/REFERENCES.md §5.1 closed form)', () => {
    // tests/REFERENCES.md §5.1: entries 1/4, ±1/(4d) = ±2.3570226 m⁻¹, ±1/(4k) = ±15.625 m⁻¹, tol 1e-9.
    const r = 1 / (4 * dM);
    expectMatrixClose(
      mixerMatrix(symmetric),
      [
        [0.25, -r, r, 15.625],
        [0.25, -r, -r, -15.625],
        [0.25, r, -r, 15.625],
        [0.25, r, r, -15.625],
      ],
      1e-9,
    );
    expect(r).toBeCloseTo(2.357023, 6);
  });

  it('gives the well-known quad-X sign pattern', () => {
    // Common practice (tests/REFERENCES.md §5.1 table): roll right raises the left motors, pitch
    // forward (nose down) raises the rear motors, yaw right raises the counter-clockwise props.
    const B = mixerMatrix(symmetric);
    const rollRight = B.map((row) => Math.sign(row[1]!));
    const pitchForward = B.map((row) => Math.sign(-row[2]!));
    const yawRight = B.map((row) => Math.sign(row[3]!));
    expect(rollRight).toEqual([-1, -1, 1, 1]); // M3 RL and M4 FL up
    expect(pitchForward).toEqual([-1, 1, 1, -1]); // M2 RR and M3 RL up
    expect(yawRight).toEqual([1, -1, 1, -1]); // M1 and M3 (ccw) up
  });

  it('reproduces the worked roll and yaw examples of tests/REFERENCES.md §5.1', () => {
    const B = mixerMatrix(symmetric);
    const roll = multiplyVector(B, [0, 0.1, 0, 0]);
    const yaw = multiplyVector(B, [0, 0, 0, 0.01]);
    [-0.2357, -0.2357, 0.2357, 0.2357].forEach((v, i) => expect(roll[i]).toBeCloseTo(v, 4));
    [0.15625, -0.15625, 0.15625, -0.15625].forEach((v, i) => expect(yaw[i]).toBeCloseTo(v, 9));
  });

  it('inverts the front-arms-1.2× quad of tests/REFERENCES.md §5.2', () => {
    // tests/REFERENCES.md §5.2 [computed], closed forms 1/4.4, 1.2/4.4, 1/(4.4d), 1/(4.4k), 1.2/(4.4k).
    const r = 1 / (4.4 * dM);
    expectMatrixClose(
      mixerMatrix(frontLong),
      [
        [1 / 4.4, -r, r, 1 / (4.4 * 0.016)],
        [1.2 / 4.4, -r, -r, -1.2 / (4.4 * 0.016)],
        [1.2 / 4.4, r, -r, 1.2 / (4.4 * 0.016)],
        [1 / 4.4, r, r, -1 / (4.4 * 0.016)],
      ],
      1e-9,
    );
    expect(r).toBeCloseTo(2.1427478, 7);
    expect(1.2 / (4.4 * 0.016)).toBeCloseTo(17.045455, 6);
  });

  it.each(['hex-x', 'octo-x', 'wide-front-x', 'stretched-x'] as const)(
    'makes A·T = b for any wanted wrench on a %s (moments about the CG vanish)',
    (preset) => {
      const airframe = presetAirframe(preset);
      const cg = { x: 7, y: -4 };
      const A = allocationMatrix(airframe.motors, cg);
      const M = mixerMatrix(airframe.motors, cg);
      for (const b of [
        [20, 0, 0, 0],
        [10, 0.3, -0.2, 0.05],
        [0, -1, 2, -0.1],
      ]) {
        const wrench = multiplyVector(A, multiplyVector(M, b));
        wrench.forEach((v, i) => expect(v).toBeCloseTo(b[i]!, 9));
      }
    },
  );

  it('picks the minimum-norm thrusts for a hex (the solution lies in the row space of A)', () => {
    const airframe = presetAirframe('hex-x');
    const A = allocationMatrix(airframe.motors);
    const T = multiplyVector(mixerMatrix(airframe.motors), [10, 0.2, 0.1, 0.03]);
    // Any null-space direction n of A must be orthogonal to T: project a few on T.
    // n = e_i − (Aᵀ(AAᵀ)⁻¹A)e_i spans the null space.
    const M = mixerMatrix(airframe.motors);
    for (let i = 0; i < 6; i++) {
      const e = Array.from({ length: 6 }, (_, j) => (j === i ? 1 : 0));
      const proj = multiplyVector(M, multiplyVector(A, e));
      const n = e.map((v, j) => v - proj[j]!);
      const dot = n.reduce((s, v, j) => s + v * T[j]!, 0);
      expect(Math.abs(dot)).toBeLessThan(1e-9);
    }
  });

  it('refuses a layout whose props all spin one way', () => {
    const same = symmetric.map((m) => ({ ...m, spin: 'cw' as const }));
    expect(() => mixerMatrix(same)).toThrow(/cannot control/);
  });

  it('refuses fewer than four motors', () => {
    expect(() => mixerMatrix(symmetric.slice(0, 3))).toThrow(/at least 4/);
  });
});

describe('hover thrusts', () => {
  const W = 0.6 * G0; // tests/REFERENCES.md §5.3: 0.6 kg × 9.80665 m/s² (g0, CGPM 1901) = 5.883990 N

  it('shares the weight equally on a symmetric quad X', () => {
    expect(W).toBeCloseTo(5.88399, 6);
    const t = hoverThrustsN(presetAirframe('quad-x', { armMm: 150, massG: 600 }));
    t.forEach((v) => expectWithin(v, 1.470998, 1e-6)); // tests/REFERENCES.md §5.3
  });

  it('loads the rear motors 1.2× on the front-arms-1.2× quad', () => {
    // tests/REFERENCES.md §5.3: front W/4.4 = 1.337270 N, rear 1.2·W/4.4 = 1.604725 N.
    const t = hoverThrustsN(presetAirframe('wide-front-x', { armMm: 150, massG: 600 }));
    expectWithin(t[0], 1.33727, 1e-6);
    expectWithin(t[1], 1.604725, 1e-6);
    expectWithin(t[2], 1.604725, 1e-6);
    expectWithin(t[3], 1.33727, 1e-6);
  });

  it('loads the rear motors when the CG sits 10 mm behind the arm junction', () => {
    // tests/REFERENCES.md §5.3: front 1.332311 N, rear 1.609684 N.
    const airframe = presetAirframe('quad-x', { armMm: 150, massG: 600 });
    const t = hoverThrustsN(airframe, { x: -10, y: 0 });
    expectWithin(t[0], 1.332311, 1e-6);
    expectWithin(t[3], 1.332311, 1e-6);
    expectWithin(t[1], 1.609684, 1e-6);
    expectWithin(t[2], 1.609684, 1e-6);
    // The same follows from the airframe's own design CG.
    const shifted = hoverThrustsN({ ...airframe, cg: { x: -10, y: 0 } });
    shifted.forEach((v, i) => expect(v).toBeCloseTo(t[i]!, 12));
  });

  it('sums to the weight for every layout', () => {
    for (const preset of ['quad-plus', 'hex-x', 'octo-x', 'stretched-x'] as const) {
      const airframe = presetAirframe(preset);
      const total = hoverThrustsN(airframe).reduce((s, v) => s + v, 0);
      expect(total).toBeCloseTo((airframe.massG / 1000) * G0, 9);
    }
  });
});

describe('expectedHoverShares', () => {
  it('is equal for symmetric layouts', () => {
    for (const [preset, n] of [
      ['quad-x', 4],
      ['quad-plus', 4],
      ['hex-x', 6],
      ['octo-x', 8],
    ] as const) {
      expectedHoverShares(presetAirframe(preset)).forEach((s) => expect(s).toBeCloseTo(1 / n, 12));
    }
  });

  it('gives 1 : 1.2 front to rear on the front-arms-1.2× quad', () => {
    const s = expectedHoverShares(presetAirframe('wide-front-x', { frontArmScale: 1.2 }));
    expect(s[0]).toBeCloseTo(1 / 4.4, 9);
    expect(s[1]).toBeCloseTo(1.2 / 4.4, 9);
  });

  it('does not depend on the yaw coefficient', () => {
    const airframe = presetAirframe('hex-x', { cg: { x: 20, y: -10 } });
    const a = mixerMatrix(airframe.motors, airframe.cg, 0.005).map((r) => r[0]!);
    const b = mixerMatrix(airframe.motors, airframe.cg, 0.05).map((r) => r[0]!);
    a.forEach((v, i) => expect(v).toBeCloseTo(b[i]!, 12));
    const shares = expectedHoverShares(airframe);
    const sum = a.reduce((s, v) => s + v, 0);
    shares.forEach((v, i) => expect(v).toBeCloseTo(a[i]! / sum, 12));
  });
});
