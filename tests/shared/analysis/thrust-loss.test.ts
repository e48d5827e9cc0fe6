import { describe, expect, it } from 'vitest';
import { hoverThrustsN } from '../../../shared/airframe/allocation';
import { presetAirframe } from '../../../shared/airframe/presets';
import { estimateThrustLoss, thrustLossOf } from '../../../shared/analysis/thrust-loss';

describe('thrust loss from the hover moment equations', () => {
  // Any hover thrusts with zero moment about the CG will do (tests/REFERENCES.md §5.3: moments
  // about the CG vanish in a steady hover); the minimum-norm ones are the simplest to build.
  const hex = presetAirframe('hex-x', { name: 'hex' });
  const quad = presetAirframe('quad-x', { name: 'quad' });

  /** Output thrust proxies of an aircraft whose motor `m` makes `e` of its neighbours' thrust. */
  const proxies = (airframe: typeof hex, m: number, e: number) =>
    hoverThrustsN(airframe).map((t, i) => (i === m - 1 ? t / e : t));

  it('recovers a hex motor making 15 % less thrust for its output, exactly', () => {
    const loss = thrustLossOf(hex, proxies(hex, 5, 0.85), 5)!;
    expect(loss.lossPct).toBeCloseTo(15, 9);
    expect(loss.explained).toBeCloseTo(1, 9);
    expect(loss.cg).toBe('design');
    expect(estimateThrustLoss(hex, proxies(hex, 5, 0.85))!.motor).toBe(5);
  });

  it('finds the motor on a quad and an octo, with the proxies in any common scale', () => {
    const q = proxies(quad, 3, 0.88).map((v) => v * 0.37);
    expect(estimateThrustLoss(quad, q)).toMatchObject({ motor: 3 });
    expect(estimateThrustLoss(quad, q)!.lossPct).toBeCloseTo(12, 9);
    const octo = presetAirframe('octo-x', { name: 'octo' });
    const o = estimateThrustLoss(octo, proxies(octo, 7, 0.9))!;
    expect(o.motor).toBe(7);
    expect(o.lossPct).toBeCloseTo(10, 9);
  });

  it('reads zero loss on a balanced hover and explains a CG shift poorly', () => {
    expect(thrustLossOf(hex, hoverThrustsN(hex), 2)!.lossPct).toBeCloseTo(0, 9);
    // Thrusts balanced about a CG 15 mm forward, judged about the design CG.
    const shifted = hoverThrustsN(hex, { x: 15, y: 0 });
    const best = estimateThrustLoss(hex, shifted);
    expect(best === null || best.explained < 0.9).toBe(true);
  });

  it('refuses proxies that do not match the airframe', () => {
    expect(thrustLossOf(hex, [1, 1, 1, 1], 1)).toBeNull();
    expect(thrustLossOf(hex, [1, 1, 1, NaN, 1, 1], 1)).toBeNull();
  });
});
