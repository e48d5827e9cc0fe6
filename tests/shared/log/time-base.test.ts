import { describe, expect, it } from 'vitest';
import { parseLog } from '../../../shared/log/parse';
import { analyseTimeBase, medianStep, selectKth } from '../../../shared/log/time-base';
import { enc } from './helpers';

function csv(times: number[]): string {
  return 'time,motor1\n' + times.map((t) => `${t},0.5`).join('\n') + '\n';
}

describe('time base', () => {
  it('finds the median step like a sort would', () => {
    const a = Float64Array.from([5, 1, 4, 2, 3, 9, 0]);
    expect(selectKth(a.slice(), 3)).toBe(3);
    expect(medianStep(Float64Array.from([0, 1, 3, 6]))).toBe(2); // steps 1, 2, 3
    expect(medianStep(Float64Array.from([0, 1, 2, 4, 8]))).toBe(1.5); // steps 1, 1, 2, 4
    expect(medianStep(Float64Array.from([7]))).toBe(0);
  });

  it('takes the sample rate from the median step, not the mean', () => {
    const t = Array.from({ length: 2001 }, (_, i) => i / 2000);
    const withGap = [...t.slice(0, 1000), ...t.slice(1100).map((x) => x)];
    // Worked by hand: every step but one is 1/2000 s, so the median gives 2000 Hz where the
    // mean (1 s over 1900 steps) would give 1900 Hz.
    const log = parseLog(enc(csv(withGap)));
    expect(log.sampleRateHz).toBeCloseTo(2000, 6);
    expect(log.durationS).toBeCloseTo(1, 12);
  });

  it('reports a gap with its time, length and line', () => {
    // A 50 ms step against a 1 ms median: past GAP_FACTOR, 4 median steps (common practice,
    // shared/log/time-base.ts); 49 missing samples and line 7 (a comment line, the header,
    // then the rows) worked by hand.
    const times = [0, 0.001, 0.002, 0.003, 0.053, 0.054, 0.055];
    const log = parseLog(enc('# aircraft: Heron\n' + csv(times)));
    expect(log.timeBase?.gaps).toEqual([
      { tS: 0.003, durationS: expect.closeTo(0.05, 12), line: 7 },
    ]);
    const w = log.warnings.find((x) => x.code === 'log-gap');
    expect(w).toMatchObject({ line: 7, tS: 0.003 });
    expect(w?.message).toMatch(/0\.00300 s \(line 7\).*0\.0500 s.*49 samples missing/);
  });

  it('summarises many gaps instead of listing every one', () => {
    const times: number[] = [];
    for (let i = 0; i < 60; i++)
      times.push(i * 0.1, i * 0.1 + 0.001, i * 0.1 + 0.002, i * 0.1 + 0.003);
    const log = parseLog(enc(csv(times)));
    // 60 bursts make 59 gaps; 20 are listed and one line sums up the rest: our own rule,
    // MAX_GAP_WARNINGS in shared/log/time-base.ts.
    const gaps = log.warnings.filter((w) => w.code === 'log-gap');
    expect(log.timeBase?.gaps.length).toBe(59);
    expect(gaps.length).toBe(21);
    expect(gaps[20]!.message).toMatch(/39 more gaps.*59 in all/);
  });

  it('reports jitter with where the worst step is', () => {
    const times = [0];
    for (let i = 1; i < 200; i++)
      times.push(times[i - 1]! + (i === 150 ? 0.0018 : i % 2 ? 0.0012 : 0.0008));
    const log = parseLog(enc(csv(times.map((t) => Number(t.toFixed(6))))));
    // Steps alternate 1.2 and 0.8 ms about a 1 ms median, ±20 % (worked by hand), past
    // JITTER_WARN_PCT, 10 % (common practice, shared/log/time-base.ts); the 1.8 ms step is the
    // worst, row 150, line 152 after the header.
    const w = log.warnings.find((x) => x.code === 'time-jitter');
    expect(log.timeBase!.jitterPct).toBeGreaterThan(10);
    expect(w?.line).toBe(152);
    expect(w?.message).toMatch(/line 152/);
  });

  it('keeps steady logs quiet', () => {
    const log = parseLog(enc(csv(Array.from({ length: 500 }, (_, i) => i * 0.00025))));
    expect(log.warnings).toEqual([]);
    expect(log.timeBase).toMatchObject({ nonIncreasingSteps: 0, gaps: [] });
    expect(log.timeBase!.jitterPct).toBeLessThan(1e-6);
  });

  it('reports time that repeats or runs backwards, with the first place', () => {
    const log = parseLog(enc(csv([0, 0.001, 0.002, 0.002, 0.001, 0.003])));
    expect(log.timeBase?.nonIncreasingSteps).toBe(2);
    const w = log.warnings.find((x) => x.code === 'time-not-increasing');
    expect(w?.line).toBe(5);
  });

  it('gives a one-sample log a zero rate and duration', () => {
    const log = parseLog(enc(csv([3])));
    expect(log.rows).toBe(1);
    expect(log.sampleRateHz).toBe(0);
    expect(log.durationS).toBe(0);
    expect(analyseTimeBase(new Float64Array(0), (r) => r).sampleRateHz).toBe(0);
  });
});
