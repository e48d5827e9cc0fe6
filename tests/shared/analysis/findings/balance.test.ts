import { describe, expect, it } from 'vitest';
import { analyzeFlight } from '../../../../shared/analysis/analyze-flight';
import { scenarios, withFaults } from '../../../../shared/sim/scenarios';
import { simulate } from '../../../../shared/sim/simulate';
import type { Scenario } from '../../../../shared/sim/types';

const analyse = (s: Scenario) => {
  const { log, truth } = simulate(s, { seconds: 40, seed: 5 });
  return analyzeFlight(log, { airframe: truth.airframe });
};

describe('balance findings carry what the diagnosis asserts', () => {
  it('a hex whose motor 5 makes 15 % less thrust: named with its thrust loss', () => {
    const { report, detail } = analyse(scenarios['hex-weak-motor']!);
    expect(detail.diagnosis).toMatchObject({ pattern: 'weak-motor', motor: 5 });
    const f = report.findings.filter((x) => x.code === 'motor-working-hard');
    expect(f.map((x) => x.motor)).toEqual([5]);
    expect(f[0]!.message).toMatch(/about 1[456] % less thrust for its output than its neighbours/);
    expect(f[0]!.message).toMatch(/CG held at the design point/);
    expect(report.balance.thrustLoss!.motor).toBe(5);
    expect(Math.abs(report.balance.thrustLoss!.lossPct - 15)).toBeLessThan(1.5);
  });

  it('a smaller loss the deviation threshold misses still reaches the verdict', () => {
    // 9 % on a hex moves motor 2's output by about 2.5 %, under the 4 % watch level.
    const s = withFaults(scenarios['hex-clean']!, [
      { kind: 'weak-motor', motor: 2, efficiency: 0.91, cause: 'prop' },
    ]);
    const { report, detail } = analyse(s);
    expect(report.balance.deviationPct[1]!).toBeLessThan(4);
    expect(detail.diagnosis.confidence).toBeGreaterThanOrEqual(0.8);
    const f = report.findings.find((x) => x.code === 'motor-working-hard');
    expect(f).toMatchObject({ motor: 2, severity: 'watch' });
    expect(f!.message).toMatch(/about 9 % less thrust/);
  });

  it('a healthy hex and a shifted CG name no weak motor', () => {
    const healthy = analyse(scenarios['hex-clean']!).report;
    expect(healthy.findings.filter((x) => x.code === 'motor-working-hard')).toEqual([]);
    expect(healthy.balance.thrustLoss).toBeNull();
    const cg = analyse(scenarios['cg-offset']!).report;
    expect(cg.balance.thrustLoss).toBeNull();
    expect(cg.findings.map((x) => x.code)).toContain('cg-offset');
  });
});
