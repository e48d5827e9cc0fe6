import { describe, expect, it } from 'vitest';
import { ParkMiller, PM_MODULUS, streamFor } from '../../../shared/sim/prng';

describe('ParkMiller', () => {
  it('starts 16807, 282475249, 1622650073 from z0 = 1', () => {
    // OEIS A096550 first terms (tests/REFERENCES.md §2.3).
    const rng = new ParkMiller(1);
    expect([rng.nextInt(), rng.nextInt(), rng.nextInt()]).toEqual([16807, 282475249, 1622650073]);
  });

  it('reaches the published check value 1043618065 after 10 000 steps', () => {
    // Park & Miller, Commun. ACM 31(10), 1988: z_10000 = 1043618065 from z_0 = 1.
    const rng = new ParkMiller(1);
    let z = 0;
    for (let i = 0; i < 10_000; i++) z = rng.nextInt();
    expect(z).toBe(1043618065);
  });

  it('reproduces the uniform noise values of tests/REFERENCES.md §2.3', () => {
    // e[n] = √12·0.1·(z/(2³¹−1) − 0.5); first three values [computed there].
    const rng = new ParkMiller(1);
    const e = () => Math.sqrt(12) * 0.1 * (rng.uniform() - 0.5);
    expect(e()).toBeCloseTo(-0.173202369623, 12);
    expect(e()).toBeCloseTo(-0.127639054321, 12);
    expect(e()).toBeCloseTo(0.088544280945, 12);
  });

  it('folds seed 0 and out-of-range seeds into the valid state range', () => {
    expect(new ParkMiller(0).nextInt()).toBe(16807);
    expect(new ParkMiller(PM_MODULUS).nextInt()).toBe(16807);
    const u = new ParkMiller(-5).uniform();
    expect(u).toBeGreaterThan(0);
    expect(u).toBeLessThan(1);
  });

  it('draws normals with mean 0 and variance 1', () => {
    const rng = new ParkMiller(12345);
    let s = 0;
    let s2 = 0;
    const n = 200_000;
    for (let i = 0; i < n; i++) {
      const v = rng.normal();
      s += v;
      s2 += v * v;
    }
    // Standard errors: mean 1/√n ≈ 0.0022, variance √(2/n) ≈ 0.0032.
    expect(Math.abs(s / n)).toBeLessThan(0.01);
    expect(Math.abs(s2 / n - 1)).toBeLessThan(0.015);
  });

  it('gives different, repeatable streams per seed and source', () => {
    const a = streamFor(7, 1).nextInt();
    expect(streamFor(7, 1).nextInt()).toBe(a);
    expect(streamFor(7, 2).nextInt()).not.toBe(a);
    expect(streamFor(8, 1).nextInt()).not.toBe(a);
  });
});
