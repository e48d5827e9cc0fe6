import { describe, expect, it } from 'vitest';
import { buildPhases, MIN_FLIGHT_S } from '../../../shared/sim/pilot-script';

describe('buildPhases', () => {
  it.each([10, 20, 30, 36, 60, 300])(
    'tiles a %d s flight from idle to idle without gaps',
    (seconds) => {
      const phases = buildPhases(seconds);
      expect(phases[0]).toMatchObject({ kind: 'idle', t0: 0 });
      expect(phases.at(-1)).toMatchObject({ kind: 'idle', t1: seconds });
      phases.slice(1).forEach((p, i) => expect(p.t0).toBeCloseTo(phases[i]!.t1, 9));
      phases.forEach((p) => expect(p.t1).toBeGreaterThan(p.t0));
      expect(phases.at(-2)!.kind).toBe('landing');
    },
  );

  it('flies one long hover when there is no room for manoeuvres', () => {
    expect(buildPhases(20).map((p) => p.kind)).toEqual([
      'idle',
      'take-off',
      'hover',
      'landing',
      'idle',
    ]);
  });

  it('repeats the manoeuvre block on long flights, hovers several seconds each', () => {
    const phases = buildPhases(300);
    expect(phases.filter((p) => p.kind === 'punch-out')).toHaveLength(6);
    for (const h of phases.filter((p) => p.kind === 'hover'))
      expect(h.t1 - h.t0).toBeGreaterThan(5);
  });

  it('refuses a flight shorter than the minimum, or not a number', () => {
    expect(() => buildPhases(MIN_FLIGHT_S - 1)).toThrow(/at least 10 s/);
    expect(() => buildPhases(NaN)).toThrow(/at least/);
  });
});
