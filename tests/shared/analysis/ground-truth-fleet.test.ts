/**
 * Ground truth on builds like the demo fleet's (shared/sim): the synthesiser injects one known
 * fault, and the verdict names that fault and nothing it did not inject.
 */
import { describe, expect, it } from 'vitest';
import { presetAirframe } from '../../../shared/airframe/presets';
import { analyzeFlight } from '../../../shared/analysis/analyze-flight';
import { simulate } from '../../../shared/sim/simulate';
import type { Fault, Scenario } from '../../../shared/sim/types';

const heronLike = presetAirframe('wide-front-x', {
  name: 'Wide-front cinematic quad',
  armMm: 125,
  massG: 920,
  frontArmScale: 1.2,
});

function fly(airframe: Scenario['airframe'], faults: Fault[], rateHz: number, seed: number) {
  const { log, truth } = simulate(
    { name: 'case', describe: 'case', airframe, faults, seconds: 36, rateHz },
    { seed },
  );
  return { ...analyzeFlight(log, { airframe }), truth, log };
}
const codes = (r: ReturnType<typeof fly>, severity?: string) =>
  r.report.findings.filter((f) => !severity || f.severity === severity).map((f) => f.code);

describe('a CG offset on a wide-front quad', () => {
  const r = fly(heronLike, [{ kind: 'cg-offset', dxMm: 14, dyMm: 0 }], 500, 108);

  it('is named as a CG offset, forward, within 3 mm', () => {
    expect(codes(r)).toContain('cg-offset');
    expect(Math.abs(r.report.cg!.xMm - r.truth.trueCg.x)).toBeLessThan(3);
    expect(r.detail.diagnosis.pattern).toBe('cg-offset');
  });

  it('does not read as a tracking problem: the integrator holds the trim', () => {
    expect(codes(r)).not.toContain('tracking-lag');
    const clean = fly(heronLike, [], 500, 108);
    // The lag is the loop's, not the offset's (Knapp & Carter 1976, REFERENCES.md §11: the
    // cross-correlation peak measures the delay, which a steady offset must not change).
    const lag = r.report.tracking!.pitch.lagMs!;
    expect(Math.abs(lag - clean.report.tracking!.pitch.lagMs!)).toBeLessThan(15);
  });
});
