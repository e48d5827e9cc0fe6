import { describe, expect, it } from 'vitest';
import { analyzeFlight, AnalysisInputError } from '../../../shared/analysis/analyze-flight';
import { FlightReport } from '../../../shared/schemas/report';
import {
  defaultThresholds,
  resolveThresholds,
  Thresholds,
} from '../../../shared/schemas/thresholds';
import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';
import type { ParsedLog } from '../../../shared/log/types';

const sim = (name: string, seconds = 20) => simulate(scenarios[name]!, { seed: 4, seconds });

function minimalLog(rows: number): ParsedLog {
  const time = Float64Array.from({ length: rows }, (_, i) => i / 1000);
  return {
    channels: ['time'],
    columns: { time },
    rows,
    sampleRateHz: 1000,
    durationS: rows > 1 ? (rows - 1) / 1000 : 0,
    metadata: {},
    warnings: [],
  };
}

describe('analyzeFlight on awkward input', () => {
  it('refuses an empty log or a single sample with a named error', () => {
    expect(() => analyzeFlight(minimalLog(0))).toThrow(AnalysisInputError);
    expect(() => analyzeFlight(minimalLog(1))).toThrow(/at least two rows/);
  });

  it('reports a log with only time: no motors, no spectra, still a valid report', () => {
    const { report } = analyzeFlight(minimalLog(500));
    expect(FlightReport.safeParse(report).success).toBe(true);
    expect(report.motorCount).toBe(0);
    expect(report.cg).toBeNull();
    expect(report.warnings.some((w) => /No motor outputs/.test(w))).toBe(true);
  });

  it('survives missing values (NaN) scattered through every column', () => {
    const { log } = sim('clean-quad-x');
    for (const name of log.channels) {
      if (name === 'time') continue;
      const c = log.columns[name]!;
      for (let i = 1234; i < c.length; i += 997) c[i] = Number.NaN;
    }
    const { report } = analyzeFlight(log, { airframe: scenarios['clean-quad-x']!.airframe });
    const parsed = FlightReport.safeParse(JSON.parse(JSON.stringify(report)));
    expect(parsed.success).toBe(true);
    expect(report.findings.filter((f) => f.severity === 'act')).toEqual([]);
    expect(Number.isFinite(report.vibration.gyro_x!.bandRms)).toBe(true);
    expect(report.power!.mAh).toBeGreaterThan(0);
  });

  it('turns a log gap warning into a log-gap note with its time', () => {
    const { log } = sim('clean-quad-x');
    log.warnings.push({
      code: 'log-gap',
      message: 'No samples for 0.25 s at 7.50 s.',
      line: 7503,
      tS: 7.5,
    });
    const { report } = analyzeFlight(log);
    const gap = report.findings.find((f) => f.code === 'log-gap')!;
    expect(gap).toMatchObject({ severity: 'note', tS: 7.5 });
    expect(report.warnings.some((w) => w.startsWith('Line 7503:'))).toBe(true);
  });

  it('lets team thresholds change the verdict (a stricter motor limit flags the weak motor as act)', () => {
    const { log } = sim('weak-motor', 60);
    const airframe = scenarios['weak-motor']!.airframe;
    const loose = analyzeFlight(log, { airframe }).report.findings.find(
      (f) => f.code === 'motor-working-hard',
    );
    const strict = analyzeFlight(log, {
      airframe,
      thresholds: { motorWatchPct: 1, motorActPct: 2 },
    }).report.findings.find((f) => f.code === 'motor-working-hard');
    expect(loose?.severity).toBe('watch');
    expect(strict?.severity).toBe('act');
  });
});

describe('thresholds', () => {
  it('validates the defaults and rejects nonsense', () => {
    expect(Thresholds.safeParse(defaultThresholds).success).toBe(true);
    expect(() => resolveThresholds({ saturationLevel: 2 })).toThrow();
    expect(resolveThresholds({ cellActV: 3.2 }).cellActV).toBe(3.2);
  });

  it('keeps the LiPo cell limits at 3.5 V watch and 3.3 V act (common practice, tests/REFERENCES.md §12)', () => {
    expect(defaultThresholds.cellWatchV).toBe(3.5);
    expect(defaultThresholds.cellActV).toBe(3.3);
  });
});
