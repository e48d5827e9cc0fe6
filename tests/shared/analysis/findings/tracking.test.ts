import { describe, expect, it } from 'vitest';
import { analyzeFlight } from '../../../../shared/analysis/analyze-flight';
import { trackingFindings } from '../../../../shared/analysis/findings/tracking';
import { defaultThresholds } from '../../../../shared/schemas/thresholds';
import { scenarios } from '../../../../shared/sim/scenarios';
import { simulate } from '../../../../shared/sim/simulate';

const analyse = (name: string) => {
  const { log, truth } = simulate(scenarios[name]!, { seconds: 40, seed: 5 });
  return analyzeFlight(log, { airframe: truth.airframe }).report;
};
const axis = (lagMs: number) => ({ rmsDegS: 2, lagMs, worstAtS: 1, response: null });

// The lag limits (note 10, watch 25, act 50 ms at 5 in, scaled by (prop/5)^1.5) are from
// memory of common tuning practice, not a published standard; these tests pin that rule.
describe('tracking lag findings', () => {
  it('a 5-inch aircraft trailing by more than 10 ms gets a note naming the usual causes', () => {
    const f = trackingFindings(
      { roll: axis(12), pitch: axis(9), yaw: axis(40) },
      5,
      defaultThresholds,
    );
    expect(f.map((x) => [x.axis, x.severity])).toEqual([['roll', 'note']]);
    expect(f[0]!.message).toMatch(/filtering/);
    expect(f[0]!.message).toMatch(/gains/);
    expect(f[0]!.message).toMatch(/motor response/);
  });

  it('bigger props get more room: 12 ms is fine on a 10-inch rig, 30 ms is a note', () => {
    const quiet = trackingFindings({ roll: axis(12), pitch: axis(12), yaw: axis(40) }, 10, {
      ...defaultThresholds,
    });
    expect(quiet).toEqual([]);
    const f = trackingFindings({ roll: axis(30), pitch: axis(12), yaw: axis(40) }, 10, {
      ...defaultThresholds,
    });
    expect(f.map((x) => x.severity)).toEqual(['note']);
  });

  it('the synthesiser’s soft tune trails the sticks and is told so; the good tune is not', () => {
    const slow = analyse('slow-loop');
    const lag = slow.findings.filter((x) => x.code === 'tracking-lag').map((x) => x.axis);
    expect(lag).toEqual(expect.arrayContaining(['roll', 'pitch']));
    expect(slow.tracking!.roll.lagMs!).toBeGreaterThan(10);
    const clean = analyse('clean-quad-x');
    expect(clean.tracking!.roll.lagMs!).toBeLessThan(10);
    expect(clean.findings.filter((x) => x.code === 'tracking-lag')).toEqual([]);
  });
});
