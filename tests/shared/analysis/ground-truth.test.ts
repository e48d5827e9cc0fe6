/**
 * Ground truth from the flight synthesiser (shared/sim): each scenario injects a known fault,
 * and the verdict must name it — the right motor, side or spin set, the CG within a few mm,
 * peaks within a bin with the right label — while healthy builds raise no `act` finding.
 */
import { describe, expect, it } from 'vitest';
import { analyzeFlight, type FlightAnalysis } from '../../../shared/analysis/analyze-flight';
import { FlightReport } from '../../../shared/schemas/report';
import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';
import type { GroundTruth } from '../../../shared/sim/types';
import type { ParsedLog } from '../../../shared/log/types';

interface Run extends FlightAnalysis {
  truth: GroundTruth;
  log: ParsedLog;
}
const cache = new Map<string, Run>();
function run(name: string): Run {
  let r = cache.get(name);
  if (!r) {
    const { log, truth } = simulate(scenarios[name]!, { seed: 1 });
    r = { ...analyzeFlight(log, { airframe: truth.airframe }), truth, log };
    cache.set(name, r);
  }
  return r;
}
const codes = (r: Run, severity?: string) =>
  r.report.findings.filter((f) => !severity || f.severity === severity).map((f) => f.code);

/** Mean rpm/60 of every motor over the synthesiser's hover phases, Hz. */
function hoverRotorHz(r: Run): number {
  const t = r.log.columns.time!;
  let s = 0;
  let n = 0;
  for (let m = 1; m <= r.report.motorCount; m++) {
    const rpm = r.log.columns[`rpm${m}`]!;
    for (let i = 0; i < r.log.rows; i++) {
      if (r.truth.phases.some((p) => p.kind === 'hover' && t[i]! >= p.t0 && t[i]! < p.t1)) {
        s += rpm[i]!;
        n++;
      }
    }
  }
  return s / n / 60;
}

describe('healthy builds raise no act finding', () => {
  for (const name of [
    'clean-quad-x',
    'wide-front-healthy',
    'stretched-healthy',
    'quad-plus',
    'hex-clean',
    'octo-clean',
  ]) {
    it(`${name}: a valid report, a balanced verdict and nothing to act on`, () => {
      const r = run(name);
      expect(FlightReport.safeParse(r.report).success).toBe(true);
      expect(codes(r, 'act')).toEqual([]);
      expect(r.detail.diagnosis.pattern).toBe('healthy');
      for (const d of r.report.balance.deviationPct) expect(Math.abs(d)).toBeLessThan(2);
      expect(Math.hypot(r.report.cg!.xMm, r.report.cg!.yMm)).toBeLessThan(3);
    });
  }

  it('wide-front: expects unequal shares (front carries less) and calls them normal', () => {
    const r = run('wide-front-healthy');
    const [front, rear] = [r.report.balance.expectedShare[0]!, r.report.balance.expectedShare[1]!];
    expect(front).toBeLessThan(rear);
    expect(codes(r)).not.toContain('motor-working-hard');
    expect(codes(r)).not.toContain('cg-offset');
  });

  it('clean quad: the rotor 1× peak sits within a bin of the logged hover rotor speed', () => {
    const r = run('clean-quad-x');
    const f = hoverRotorHz(r);
    const bin = r.report.sampleRateHz / 256;
    const peak = r.report.vibration.gyro_x!.peaks.find((p) => p.label === 'rotor-1x')!;
    expect(Math.abs(peak.hz - f)).toBeLessThan(bin);
  });
});

describe('each fault is named', () => {
  it('weak motor: names motor 3 as working hard and diagnoses one motor, not the CG', () => {
    const r = run('weak-motor');
    const motor = (r.truth.faults[0] as { motor: number }).motor;
    const f = r.report.findings.filter((x) => x.code === 'motor-working-hard');
    expect(f.map((x) => x.motor)).toEqual([motor]);
    expect(r.detail.diagnosis).toMatchObject({ pattern: 'weak-motor', motor });
    expect(codes(r)).not.toContain('cg-offset');
  });

  it('CG offset: estimates the true CG within 3 mm and diagnoses a loaded side', () => {
    const r = run('cg-offset');
    expect(Math.abs(r.report.cg!.xMm - r.truth.trueCg.x)).toBeLessThan(3);
    expect(Math.abs(r.report.cg!.yMm - r.truth.trueCg.y)).toBeLessThan(3);
    expect(r.detail.diagnosis.pattern).toBe('cg-offset');
    expect(codes(r)).toContain('cg-offset');
    expect(codes(r)).not.toContain('motor-working-hard');
  });

  it('spin mismatch: the torque split leans to the set with less torque and names that spin set', () => {
    const r = run('spin-mismatch');
    const fault = r.truth.faults[0] as { spin: 'cw' | 'ccw'; torqueScale: number };
    // More reaction torque per thrust on one set means the other set must carry more.
    const heavier = fault.torqueScale > 1 ? (fault.spin === 'cw' ? 'ccw' : 'cw') : fault.spin;
    expect(Math.sign(r.report.torqueSplit.asymmetryPct)).toBe(heavier === 'cw' ? 1 : -1);
    expect(r.detail.diagnosis.pattern).toBe('spin-set');
    const f = r.report.findings.find((x) => x.code === 'torque-split')!;
    const set = r.truth.airframe.motors.flatMap((m, i) => (m.spin === heavier ? [i + 1] : []));
    expect(f.message).toContain(`motors ${set.join(' and ')}`);
  });

  it('tilted motor: shows as one spin set working harder, the set of the tilted motor', () => {
    const r = run('tilted-motor');
    expect(r.detail.diagnosis.pattern).toBe('spin-set');
    const f = r.report.findings.find((x) => x.code === 'torque-split')!;
    expect(f.message).toMatch(/motors 2 and 4/);
  });

  it('rotor imbalance: a loud rotor-1× peak within a bin, traced to the culprit’s spin pair', () => {
    const r = run('rotor-imbalance');
    const motor = (r.truth.faults[0] as { motor: number }).motor;
    const bin = r.report.sampleRateHz / 256;
    const peak = r.report.vibration.gyro_x!.peaks[0]!;
    expect(peak.label).toBe('rotor-1x');
    expect(Math.abs(peak.hz - hoverRotorHz(r))).toBeLessThan(bin);
    const f = r.report.findings.find((x) => x.code === 'rotor-harmonic')!;
    expect(f.message).toContain(`motor ${motor}`);
    // the healthy diagonal pair is ruled out
    expect(f.message).not.toMatch(/motor 1\b|motor 3\b/);
  });

  it('frame resonance: a peak within a bin of the mode, labelled frame, raised as frame-resonance', () => {
    const r = run('frame-resonance');
    const hz = r.truth.params.frameResonanceHz!;
    const bin = r.report.sampleRateHz / 256;
    const frame = r.report.vibration.gyro_x!.peaks.find((p) => p.label === 'frame')!;
    expect(Math.abs(frame.hz - hz)).toBeLessThan(bin);
    expect(codes(r)).toContain('frame-resonance');
    // the clean build's rotor peak is not called frame
    expect(
      run('clean-quad-x').report.vibration.gyro_x!.peaks.every((p) => p.label !== 'frame'),
    ).toBe(true);
  });

  it('tired battery: sags below the land-now level and reads the pack resistance within 10 %', () => {
    const r = run('tired-battery');
    expect(r.report.findings.find((x) => x.code === 'battery-sag')?.severity).toBe('act');
    const ohm = r.report.power!.internalResistanceOhm!;
    expect(Math.abs(ohm / r.truth.params.batteryResistanceOhm - 1)).toBeLessThan(0.1);
    const clean = run('clean-quad-x').report.power!;
    expect(
      Math.abs(
        clean.internalResistanceOhm! / run('clean-quad-x').truth.params.batteryResistanceOhm - 1,
      ),
    ).toBeLessThan(0.1);
    expect(codes(run('clean-quad-x'))).not.toContain('battery-sag');
  });

  it('power: counts the charge drawn within 1 % and the cells from the airframe', () => {
    const r = run('clean-quad-x');
    expect(Math.abs(r.report.power!.mAh! / r.truth.params.mAhUsed - 1)).toBeLessThan(0.01);
    expect(r.report.power!.cells).toBe(r.truth.params.cells);
  });

  it('ESC overcurrent: flags time over the rating from the per-ESC currents', () => {
    const r = run('esc-overcurrent');
    expect(codes(r)).toContain('esc-overcurrent');
    expect(r.report.headroom.escOverS).toBeGreaterThan(0);
    // 100 ms means smooth the shortest spikes, so allow a quarter second either way
    expect(Math.abs(r.report.headroom.escOverS - r.truth.params.escOverS)).toBeLessThan(0.25);
    expect(
      Math.abs(r.report.headroom.escPeakA! - Math.max(...r.truth.params.peakMotorCurrentA)),
    ).toBeLessThan(1.5);
  });

  it('underpowered: calls out the high hover output and measures saturation time', () => {
    const r = run('underpowered');
    expect(
      r.report.findings.some((f) => f.code === 'motor-saturation' && f.severity === 'act'),
    ).toBe(true);
    expect(Math.abs(r.report.headroom.saturationS - r.truth.params.saturationS)).toBeLessThan(0.1);
  });

  it('tracking delay: the lag grows by about the injected delay and raises tracking-lag', () => {
    const r = run('tracking-delay');
    const clean = run('clean-quad-x');
    const delay = r.truth.params.delayMs;
    for (const axis of ['roll', 'pitch'] as const) {
      const grew = r.report.tracking![axis].lagMs! - clean.report.tracking![axis].lagMs!;
      expect(Math.abs(grew - delay)).toBeLessThan(0.35 * delay);
    }
    expect(codes(r)).toContain('tracking-lag');
  });
});

describe('without an airframe', () => {
  it('assumes the default quad X, says so, and still validates', () => {
    const { log } = simulate(scenarios['clean-quad-x']!, { seed: 2, seconds: 20 });
    const { report } = analyzeFlight(log);
    expect(report.airframe.assumed).toBe(true);
    expect(report.warnings.some((w) => /assumed/.test(w))).toBe(true);
    expect(FlightReport.safeParse(report).success).toBe(true);
  });

  it('keeps effort traces under 4000 points', () => {
    const r = run('clean-quad-x');
    expect(r.detail.effort.t.length).toBeLessThanOrEqual(4000);
    expect(r.detail.effort.series.effort_roll!.length).toBe(r.detail.effort.t.length);
    expect(r.detail.campbell!.db.length).toBe(r.detail.campbell!.rows.length);
  });
});
