import { describe, expect, it } from 'vitest';
import { analyzeFlight } from '../../../shared/analysis/analyze-flight';
import { computeDrift, driftSample } from '../../../shared/analysis/drift';
import type { FlightReport } from '../../../shared/schemas/report';
import { defaultThresholds } from '../../../shared/schemas/thresholds';
import { scenarios, withFaults } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';
import type { Fault } from '../../../shared/sim/types';

const kite = scenarios['clean-quad-x']!;
const fly = (faults: Fault[], seed: number, baseline?: FlightReport[]) => {
  const { log, truth } = simulate(withFaults(kite, faults, `kite-${seed}`), {
    seconds: 30,
    rateHz: 500,
    seed,
  });
  return analyzeFlight(log, {
    airframe: truth.airframe,
    ...(baseline ? { baseline: { reports: baseline, label: 'Kite’s last 3 flights' } } : {}),
  }).report;
};
const healthy = [1, 2, 3].map((seed) => fly([], seed));

// Nothing here is checked against an outside source: the faults are injected by the
// synthesiser (shared/sim/faults.ts), and the limits they must cross are our own rules —
// driftFindings in shared/analysis/drift.ts with the defaults of shared/schemas/thresholds.ts,
// whose values are marked there as common practice.
describe('drift against the aircraft’s own recent flights', () => {
  it('a motor that lost 6 % after three healthy flights raises motor-drift under the fixed limits', () => {
    // efficiency 0.94: a 6 % loss injected by the synthesiser in shared/sim/faults.ts.
    const now = fly([{ kind: 'weak-motor', motor: 2, efficiency: 0.94 }], 9, healthy);
    // The same flight judged alone: the change it should report is its own deviation against
    // the healthy flights' median (changePts = nowPct − baseline median, shared/README.md §7).
    const alone = fly([{ kind: 'weak-motor', motor: 2, efficiency: 0.94 }], 9);
    const medianOf = (i: number) =>
      healthy.map((r) => r.balance.deviationPct[i]!).sort((a, b) => a - b)[1]!;
    const truth = alone.balance.deviationPct[1]! - medianOf(1);
    // Under motorWatchPct (4 %, common practice per shared/schemas/thresholds.ts) when alone.
    expect(alone.findings.filter((f) => f.code === 'motor-working-hard')).toEqual([]);
    const d = now.drift!;
    expect(d.flights).toBe(3);
    // Our own definition (shared/README.md §7); 0.05 points is this test's allowance for the
    // rounding drift.ts applies, not a measured bound.
    expect(Math.abs(d.motors[1]!.changePts - truth)).toBeLessThan(0.05);
    // motorDriftPts, 1.5 points (common practice, shared/schemas/thresholds.ts).
    expect(d.motors[1]!.changePts).toBeGreaterThan(1.5);
    const f = now.findings.filter((x) => x.code === 'motor-drift');
    expect(f.map((x) => x.motor)).toEqual([2]);
    // Drift findings are always `watch`: our own rule, driftFindings in shared/analysis/drift.ts.
    expect(f[0]).toMatchObject({ severity: 'watch', flights: 3 });
    expect(Math.abs(f[0]!.changePts! - d.motors[1]!.changePts)).toBeLessThan(0.01);
    expect(f[0]!.message).toMatch(/against Kite’s last 3 flights/);
  });

  it('a healthy flight against healthy ones raises no drift', () => {
    const now = fly([], 7, healthy);
    expect(now.drift).not.toBeNull();
    expect(now.findings.filter((x) => /drift|ageing/.test(x.code))).toEqual([]);
  });

  it('rising vibration, pack resistance and lag raise their own drift findings', () => {
    // Faults injected by the synthesiser (shared/sim/faults.ts): 0.6 g·mm of unbalance, pack
    // resistance × 1.8 (+80 %), 12 ms of added lag. Each must clear its own drift limit
    // (shared/schemas/thresholds.ts, common practice): vibration × 1.5, resistance +25 %, lag
    // +5 ms. The 50 % bound below is this test's: well past the limit, well short of the 80 %.
    const shaky = fly([{ kind: 'rotor-imbalance', motor: 1, unbalanceGmm: 0.6 }], 8, healthy);
    expect(shaky.findings.map((x) => x.code)).toContain('vibration-drift');
    const tired = fly([{ kind: 'tired-battery', resistanceScale: 1.8 }], 8, healthy);
    expect(tired.drift!.power!.changePct).toBeGreaterThan(50);
    expect(tired.findings.map((x) => x.code)).toContain('pack-ageing');
    const late = fly([{ kind: 'tracking-delay', delayMs: 12 }], 8, healthy);
    expect(late.findings.filter((x) => x.code === 'response-drift').map((x) => x.axis)).toEqual(
      expect.arrayContaining(['roll', 'pitch']),
    );
  });

  // driftMinFlights 3 and minHoverForVerdictS 4 s: our own rules (shared/schemas/thresholds.ts,
  // applied by usableBaseline in shared/analysis/drift.ts).
  it('needs three earlier flights with enough hover, and says so', () => {
    const r = computeDrift(
      driftSample(healthy[0]!),
      { samples: healthy.slice(1).map(driftSample) },
      defaultThresholds,
    );
    expect(r.drift).toBeNull();
    expect(r.warning).toMatch(/at least 3 earlier flights/);
    const short = { ...healthy[0]!, segments: { ...healthy[0]!.segments, hoverS: 1 } };
    const r2 = computeDrift(
      driftSample(healthy[0]!),
      { samples: [short, short, short].map(driftSample) },
      defaultThresholds,
    );
    expect(r2.drift).toBeNull();
  });

  it('keeps only the most recent flights the team settings allow', () => {
    const th = { ...defaultThresholds, driftMaxFlights: 2, driftMinFlights: 2 };
    expect(
      computeDrift(driftSample(healthy[0]!), { samples: healthy.map(driftSample) }, th).drift!
        .flights,
    ).toBe(2);
  });
});
