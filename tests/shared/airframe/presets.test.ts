import { describe, expect, it } from 'vitest';
import {
  defaultQuadX,
  layoutPresets,
  presetAirframe,
  type LayoutPreset,
} from '../../../shared/airframe/presets';
import { Airframe } from '../../../shared/schemas/airframe';

describe('layout presets', () => {
  it('numbers the quad X clockwise from front-right with spins ccw, cw, ccw, cw', () => {
    // The default numbering of shared/README.md §4, the layout
    // tests/REFERENCES.md uses for its motor mixing cases.
    const m = presetAirframe('quad-x').motors;
    expect(m.map((v) => [Math.sign(v.x), Math.sign(v.y), v.spin])).toEqual([
      [1, 1, 'ccw'],
      [-1, 1, 'cw'],
      [-1, -1, 'ccw'],
      [1, -1, 'cw'],
    ]);
  });

  it('puts every motor at the arm length on the round layouts', () => {
    for (const preset of ['quad-x', 'quad-plus', 'hex-x', 'octo-x', 'stretched-x'] as const) {
      for (const m of presetAirframe(preset, { armMm: 200 }).motors) {
        expect(Math.hypot(m.x, m.y)).toBeCloseTo(200, 4);
      }
    }
  });

  it('alternates spins around hex and octo so the spin sets are equal', () => {
    for (const preset of ['hex-x', 'octo-x'] as const) {
      const spins = presetAirframe(preset).motors.map((m) => m.spin);
      spins.forEach((s, i) => expect(s).toBe(i % 2 === 0 ? 'ccw' : 'cw'));
      expect(spins.length).toBe(layoutPresets[preset].motorCount);
    }
  });

  it('puts motor 1 of the plus layout on the nose', () => {
    const m = presetAirframe('quad-plus', { armMm: 150 }).motors[0]!;
    expect(m.x).toBeCloseTo(150, 6);
    expect(m.y).toBeCloseTo(0, 6);
  });

  it('stretches fore-aft spacing on the stretched X', () => {
    const m = presetAirframe('stretched-x', { stretch: 1.5 }).motors[0]!;
    expect(m.x / m.y).toBeCloseTo(1.5, 6);
  });

  it('returns airframes the shared schema accepts', () => {
    for (const preset of Object.keys(layoutPresets) as LayoutPreset[]) {
      expect(() => Airframe.parse(presetAirframe(preset))).not.toThrow();
    }
    expect(Airframe.parse(defaultQuadX).massG).toBe(600);
    expect(defaultQuadX.cells).toBe(4);
    expect(defaultQuadX.prop.diameterIn).toBeGreaterThanOrEqual(5);
  });

  it('rejects a bad arm length or an unknown preset with a clear error', () => {
    expect(() => presetAirframe('quad-x', { armMm: -1 })).toThrow(/armMm/);
    expect(() => presetAirframe('tri' as LayoutPreset)).toThrow(/unknown layout preset/);
  });
});
