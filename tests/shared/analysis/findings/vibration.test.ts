import { describe, expect, it } from 'vitest';
import { analyzeFlight } from '../../../../shared/analysis/analyze-flight';
import { FlightReport, type Finding } from '../../../../shared/schemas/report';
import { scenarios, withFaults } from '../../../../shared/sim/scenarios';
import { simulate } from '../../../../shared/sim/simulate';
import type { Scenario } from '../../../../shared/sim/types';

const analyse = (name: string) => {
  const { log, truth } = simulate(scenarios[name]!, { seconds: 40, seed: 5 });
  return analyzeFlight(log, { airframe: truth.airframe }).report;
};

// No outside source in this file: the faults are injected by the synthesiser (scenarios in
// shared/sim/scenarios.ts, applied by shared/sim/faults.ts) and the severities follow our own
// rules in shared/analysis/findings/vibration.ts with the limits of shared/schemas/thresholds.ts.
describe('vibration findings below the absolute limits', () => {
  it('a frame line that dominates the roll gyro is a note though under the gyro limit', () => {
    // 'quiet-frame-line': a 260 Hz roll mode of 3 deg/s RMS, under gyroToneWatchDegS (5 deg/s,
    // common practice per thresholds.ts). 4 Hz is this test's allowance, about one bin.
    const r = analyse('quiet-frame-line');
    const peak = r.vibration.gyro_x!.peaks.find((p) => Math.abs(p.hz - 260) < 4);
    expect(peak?.label).toBe('frame');
    const f = r.findings.filter((x) => x.code === 'frame-resonance');
    expect(f).toHaveLength(1);
    // `note` by our own rule (peakSeverity): the line carries at least toneDominantShare (half)
    // of its axis's band power, on an axis at least AXIS_RATIO (2) times the others' median.
    expect(f[0]).toMatchObject({ severity: 'note', axis: 'gyro_x' });
    // 1.8 against pitch alone is this test's margin, not the rule's factor of 2.
    expect(r.vibration.gyro_x!.bandRms).toBeGreaterThan(1.8 * r.vibration.gyro_y!.bandRms);
  });

  // The synthesiser's healthy quad: no fault injected, so any vibration finding is a false alarm.
  it('the healthy rotors’ own lines, alike on every axis, raise nothing', () => {
    const r = analyse('clean-quad-x');
    const vib = ['vibration-peak', 'rotor-harmonic', 'frame-resonance'];
    expect(r.findings.filter((x) => vib.includes(x.code))).toEqual([]);
  });
});

/*
 * One finding per vibration cause, on the synthesiser where the cause is known: a chipped prop
 * shows at every speed it flew and on every axis, yet is one finding that names its motor; a
 * rotor line and a frame mode stay two.
 */
const VIBRATION = new Set(['rotor-harmonic', 'frame-resonance', 'vibration-peak']);

function vibrationFindings(scenario: Scenario): { findings: Finding[]; report: FlightReport } {
  const { log, truth } = simulate(scenario, { seed: 1 });
  const { report } = analyzeFlight(log, { airframe: truth.airframe });
  expect(FlightReport.safeParse(report).success).toBe(true);
  return { findings: report.findings.filter((f) => VIBRATION.has(f.code)), report };
}

describe('a chipped prop is one vibration finding', () => {
  it('motor 2 (the scenario): one rotor-harmonic finding, motor 2, listing every speed and axis', () => {
    // 'rotor-imbalance': 2 g·mm of unbalance on motor 2, injected by the synthesiser.
    const { findings, report } = vibrationFindings(scenarios['rotor-imbalance']!);
    expect(findings).toHaveLength(1);
    const f = findings[0]!;
    expect(f.code).toBe('rotor-harmonic');
    expect(f.motor).toBe(2);
    expect(f.message).toMatch(/follows motor 2 once per turn/);
    // Its diagonal partner turns at nearly the same speed; order tracking still rules it out.
    expect(f.message).not.toMatch(/motor 4\b/);
    // Every rotor-1x peak the report holds is a member of the one finding.
    const oneX = Object.entries(report.vibration).flatMap(([channel, v]) =>
      v.peaks.filter((p) => p.label === 'rotor-1x').map((p) => ({ channel, hz: p.hz })),
    );
    // The counts below (more than 4 lines, 3 speeds in 5 Hz steps, 3 axes) are this test's:
    // enough to show the lines were gathered across speeds and axes, not one of each.
    expect(oneX.length).toBeGreaterThan(4);
    expect(f.seen).toHaveLength(oneX.length);
    for (const p of oneX) expect(f.seen).toContainEqual(expect.objectContaining(p));
    const speeds = new Set(f.seen!.map((s) => Math.round(s.hz / 5)));
    expect(speeds.size).toBeGreaterThan(2);
    expect(new Set(f.seen!.map((s) => s.channel)).size).toBeGreaterThan(2);
    expect(f.message).toMatch(/Seen on gyro_x, .* at .* Hz \(rotor speeds about \d+–\d+ rpm\)/);
  });

  it('the same fault on motor 3, of the other spin set, names motor 3', () => {
    const { findings } = vibrationFindings(
      withFaults(scenarios['clean-quad-x']!, [
        { kind: 'rotor-imbalance', motor: 3, unbalanceGmm: 2 },
      ]),
    );
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ code: 'rotor-harmonic', motor: 3 });
  });

  it('a chipped prop and a ringing frame stay two findings, each with its own lines', () => {
    const { findings } = vibrationFindings(
      withFaults(scenarios['rotor-imbalance']!, [
        { kind: 'frame-resonance', hz: 290, q: 15, rmsDegS: 6 },
      ]),
    );
    expect(findings.map((f) => f.code).sort()).toEqual(['frame-resonance', 'rotor-harmonic']);
    const rotor = findings.find((f) => f.code === 'rotor-harmonic')!;
    const frame = findings.find((f) => f.code === 'frame-resonance')!;
    expect(rotor.motor).toBe(2);
    expect(frame.motor).toBeUndefined();
    // The 290 Hz mode injected above; 8 Hz (about two bins) is this test's allowance.
    expect(frame.seen!.every((s) => s.label === 'frame' && Math.abs(s.hz - 290) < 8)).toBe(true);
    expect(rotor.seen!.every((s) => s.label === 'rotor-1x')).toBe(true);
  });
});
