import { describe, expect, it } from 'vitest';
import { analyzeFlight } from '../../../../shared/analysis/analyze-flight';
import { scenarios } from '../../../../shared/sim/scenarios';
import { simulate } from '../../../../shared/sim/simulate';

const analyse = (name: string) => {
  const { log, truth } = simulate(scenarios[name]!, { seconds: 40, seed: 5 });
  return analyzeFlight(log, { airframe: truth.airframe }).report;
};

describe('vibration findings below the absolute limits', () => {
  it('a frame line that dominates the roll gyro is a note though under the gyro limit', () => {
    const r = analyse('quiet-frame-line');
    const peak = r.vibration.gyro_x!.peaks.find((p) => Math.abs(p.hz - 260) < 4);
    expect(peak?.label).toBe('frame');
    const f = r.findings.filter((x) => x.code === 'frame-resonance');
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'note', axis: 'gyro_x' });
    expect(r.vibration.gyro_x!.bandRms).toBeGreaterThan(1.8 * r.vibration.gyro_y!.bandRms);
  });

  it('the healthy rotors’ own lines, alike on every axis, raise nothing', () => {
    const r = analyse('clean-quad-x');
    const vib = ['vibration-peak', 'rotor-harmonic', 'frame-resonance'];
    expect(r.findings.filter((x) => vib.includes(x.code))).toEqual([]);
  });
});
