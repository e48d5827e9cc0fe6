import { describe, expect, it } from 'vitest';
import { hoverThrustsN } from '../../../shared/airframe/allocation';
import { presetAirframe } from '../../../shared/airframe/presets';
import { analyzeFlight, AnalysisInputError } from '../../../shared/analysis/analyze-flight';
import { benchRunCurve, powerLawCurve } from '../../../shared/analysis/thrust-curve';
import type { ParsedLog } from '../../../shared/log/types';

// A bench run far from output²: a quick rise, a shallow stretch where this quad hovers, then
// steep (invented for the test, piecewise linear so the truth is exact).
const bench = {
  rows: [
    { throttle: 0, thrustG: 0 },
    { throttle: 0.2, thrustG: 100 },
    { throttle: 0.5, thrustG: 200 },
    { throttle: 0.8, thrustG: 500 },
    { throttle: 1, thrustG: 800 },
  ],
};

describe('bench-run thrust curve', () => {
  const c = benchRunCurve(bench);

  it('interpolates linearly between readings and holds the end readings outside them', () => {
    expect(c.thrust(0.1)).toBeCloseTo(50, 9);
    expect(c.thrust(0.35)).toBeCloseTo(150, 9);
    expect(c.thrust(0.65)).toBeCloseTo(350, 9);
    expect(c.thrust(0.9)).toBeCloseTo(650, 9);
    expect(c.thrust(-0.1)).toBe(0);
    expect(c.thrust(1.2)).toBe(800);
  });

  it('inverts: the output for a thrust, clamped to the table', () => {
    for (const u of [0.05, 0.33, 0.47, 0.71, 0.99]) expect(c.output(c.thrust(u))).toBeCloseTo(u, 9);
    expect(c.output(5000)).toBe(1);
    expect(c.output(-5)).toBe(0);
  });

  it('refuses tables it cannot use, naming the reading', () => {
    expect(() => benchRunCurve({ rows: [{ throttle: 0.5, thrustG: 100 }] })).toThrow(
      /two readings/,
    );
    expect(() =>
      benchRunCurve({
        rows: [
          { throttle: 0.5, thrustG: 100 },
          { throttle: 0.4, thrustG: 200 },
        ],
      }),
    ).toThrow(/reading 2: throttle must go up/);
    expect(() =>
      benchRunCurve({
        rows: [
          { throttle: 0.1, thrustG: 300 },
          { throttle: 0.4, thrustG: 200 },
        ],
      }),
    ).toThrow(/reading 2: thrust falls/);
  });

  it('the power law is output^γ (shared/README.md §4) and its inverse', () => {
    const p = powerLawCurve(2);
    expect(p.thrust(0.5)).toBe(0.25);
    expect(p.output(0.25)).toBeCloseTo(0.5, 12);
  });
});

describe('analyzeFlight with a bench run and no rpm', () => {
  // A quad X hovering steadily with its CG 12 mm forward: by moments about the CG (tests/REFERENCES.md,
  // hover thrust balance), the motors' thrusts are the minimum-norm hover solution about (12, 0).
  const airframe = presetAirframe('quad-x', { name: 'Bench quad', armMm: 110, massG: 600 });
  const cg = { x: 12, y: 0 };
  const thrustN = hoverThrustsN(airframe, cg);
  const grams = thrustN.map((t) => (t / 9.80665) * 1000);
  const curve = benchRunCurve(bench);
  const outputs = grams.map((g) => curve.output(g));

  function hoverLog(): ParsedLog {
    const fs = 500;
    const rows = fs * 12;
    const time = Float64Array.from({ length: rows }, (_, i) => i / fs);
    const columns: ParsedLog['columns'] = { time };
    const channels = ['time'];
    // Two seconds armed at idle on the ground, then the hover.
    const idleRows = 2 * fs;
    outputs.forEach((u, i) => {
      columns[`motor${i + 1}`] = new Float32Array(rows).fill(0.04, 0, idleRows).fill(u, idleRows);
      channels.push(`motor${i + 1}`);
    });
    for (const g of ['gyro_x', 'gyro_y', 'gyro_z']) {
      columns[g] = new Float32Array(rows);
      channels.push(g);
    }
    return {
      channels,
      columns,
      rows,
      sampleRateHz: fs,
      durationS: (rows - 1) / fs,
      metadata: {},
      warnings: [],
    };
  }

  it('takes the thrust shares, torque split and CG through the curve', () => {
    const { report } = analyzeFlight(hoverLog(), { airframe, benchRun: bench });
    const total = grams.reduce((a, b) => a + b, 0);
    report.balance.measuredShare.forEach((s, i) => expect(s).toBeCloseTo(grams[i]! / total, 4));
    expect(report.cg!.xMm).toBeCloseTo(cg.x, 1);
    expect(report.cg!.yMm).toBeCloseTo(cg.y, 1);
    const cw = airframe.motors.reduce((a, m, i) => a + (m.spin === 'cw' ? grams[i]! : 0), 0);
    expect(report.torqueSplit.cwShare).toBeCloseTo(cw / total, 4);
    // The front motors work harder than the design expects, the rear ones less.
    const dev = report.balance.deviationPct;
    airframe.motors.forEach((m, i) => expect(Math.sign(dev[i]!)).toBe(Math.sign(m.x)));
  });

  it('differs from the output² reading, which misplaces the CG on this motor', () => {
    const { report } = analyzeFlight(hoverLog(), { airframe });
    expect(Math.abs(report.cg!.xMm - cg.x)).toBeGreaterThan(2);
  });

  it('rejects a bench run that cannot map output to thrust with an input error', () => {
    expect(() =>
      analyzeFlight(hoverLog(), {
        airframe,
        benchRun: { rows: [{ throttle: 0.2, thrustG: 10 }] },
      }),
    ).toThrow(AnalysisInputError);
  });
});
