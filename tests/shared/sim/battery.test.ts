import { describe, expect, it } from 'vitest';
import { cellOpenCircuitV, terminalVoltage } from '../../../shared/sim/battery';

describe('cellOpenCircuitV', () => {
  it('reads 4.20 V full and about 3.7–3.85 V mid-discharge', () => {
    // tests/REFERENCES.md §12: full charge 4.20 V per cell, nominal 3.7 V (LiPo cell specifications).
    expect(cellOpenCircuitV(1)).toBeCloseTo(4.2, 9);
    expect(cellOpenCircuitV(1.2)).toBeCloseTo(4.2, 9);
    const mid = cellOpenCircuitV(0.5);
    expect(mid).toBeGreaterThan(3.7);
    expect(mid).toBeLessThan(3.9);
  });

  it('falls monotonically as charge is used', () => {
    let last = Infinity;
    for (let c = 1; c >= 0; c -= 0.01) {
      const v = cellOpenCircuitV(c);
      expect(v).toBeLessThanOrEqual(last);
      last = v;
    }
    expect(cellOpenCircuitV(-1)).toBe(cellOpenCircuitV(0));
  });
});

describe('terminalVoltage', () => {
  it('reproduces the two-point sag case of tests/REFERENCES.md §10', () => {
    // 4S pack, 16.40 V at 2.0 A and 15.20 V at 30.0 A: R = 0.0428571 Ω, V_oc = 16.4857 V.
    const r = 1.2 / 28;
    const ocv = 16.4 + 2 * r;
    expect(ocv).toBeCloseTo(16.4857, 4);
    expect(Math.abs(terminalVoltage(ocv, r, 15.2 * 30, 0) - 15.2)).toBeLessThan(1e-9);
    expect(Math.abs(terminalVoltage(ocv, r, 16.4 * 2, 0) - 16.4)).toBeLessThan(1e-9);
    // The same with the 2 A as a constant avionics draw and the motors taking the rest.
    expect(Math.abs(terminalVoltage(ocv, r, 15.2 * 28, 2) - 15.2)).toBeLessThan(1e-9);
  });

  it('browns out to half the open-circuit voltage when the power cannot be delivered', () => {
    expect(terminalVoltage(16, 1, 1e6, 0)).toBe(8);
  });
});
