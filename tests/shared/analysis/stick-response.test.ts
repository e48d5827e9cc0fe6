import { describe, expect, it } from 'vitest';
import { analyzeFlight } from '../../../shared/analysis/analyze-flight';
import { stickResponse } from '../../../shared/analysis/stick-response';
import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';
import { parkMiller } from './park-miller';

/**
 * The discrete first-order lag plus transport delay of tests/REFERENCES.md §14:
 * y[n] = a·y[n−1] + (1−a)·x[n−5], a = exp(−2π·20/1000), fs = 1000 Hz. Its exact response is
 * H(e^{jω}) = (1−a)·e^{−5jω} / (1 − a·e^{−jω}); the figures below are computed from that
 * closed form here, independently of the estimator, and agree with the scipy values cited
 * there (bandwidth 20.03 Hz, phase delay 12.44 ms at 2 Hz, −2.903 dB at 19.53 Hz).
 */
const fs = 1000;
const a = Math.exp((-2 * Math.PI * 20) / fs);
function exact(f: number): { db: number; delayMs: number } {
  const w = (2 * Math.PI * f) / fs;
  const re = 1 - a * Math.cos(w);
  const im = a * Math.sin(w);
  const mag = (1 - a) / Math.hypot(re, im);
  const phase = -5 * w - Math.atan2(im, re);
  return { db: 20 * Math.log10(mag), delayMs: (-phase / (2 * Math.PI * f)) * 1000 };
}
function exactBandwidth(): number {
  let lo = 1;
  let hi = 100;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (exact(mid).db > 10 * Math.log10(0.5)) lo = mid;
    else hi = mid;
  }
  return lo;
}
function lagFilter(x: Float64Array): Float64Array {
  const y = new Float64Array(x.length);
  for (let n = 0; n < x.length; n++) y[n] = (n ? a * y[n - 1]! : 0) + (1 - a) * (x[n - 5] ?? 0);
  return y;
}

describe('stick response: H1 and coherence (Bendat & Piersol; tests/REFERENCES.md §14)', () => {
  const rand = parkMiller(7);
  const N = 200_000;
  const white = Float64Array.from({ length: N }, () => 40 * (rand() / 2147483647 - 0.5));

  it('the closed form gives the reference figures', () => {
    expect(exactBandwidth()).toBeCloseTo(20.03, 2);
    expect(exact(2).delayMs).toBeCloseTo(12.44, 2);
    expect(exact(19.53125).db).toBeCloseTo(-2.903, 3);
  });

  it('recovers bandwidth, gain, phase delay and coherence of a known lag from white noise', () => {
    const { response } = stickResponse(white, lagFilter(white), fs, [[0, N]]);
    const r = response!;
    expect(Math.abs(r.bandwidthHz! - exactBandwidth())).toBeLessThan(0.3);
    expect(Math.abs(r.phaseDelayMs - exact(2).delayMs)).toBeLessThan(0.15);
    const k = r.curve.hz.findIndex((f) => Math.abs(f - 19.53125) < 1e-9);
    expect(Math.abs(r.curve.gainDb[k]! - exact(19.53125).db)).toBeLessThan(0.05);
    expect(r.coherence).toBeGreaterThan(0.99);
    expect(r.peakGainDb).toBeLessThan(0.1);
  });

  it('input only below 8 Hz and a noisy gyro: no bandwidth, says why, still reads the delay', () => {
    // Stick-like input: white noise through three moving averages of 125 ms (nulls at 8 Hz
    // and its multiples, side lobes under −39 dB), and gyro noise on the output.
    const m = 125;
    let slow = white;
    for (let pass = 0; pass < 3; pass++) {
      const next = new Float64Array(N);
      let s = 0;
      for (let n = 0; n < N; n++) {
        s += slow[n]! - (slow[n - m] ?? 0);
        next[n] = s / m;
      }
      slow = next;
    }
    const x = slow.map((v) => v * 30);
    const noise = parkMiller(11);
    const y = lagFilter(x).map((v) => v + 0.5 * (noise() / 2147483647 - 0.5));
    const { response, reason } = stickResponse(x, y, fs, [[0, N]]);
    expect(response!.bandwidthHz).toBeNull();
    expect(reason).toMatch(/too little movement above \d+ Hz/);
    expect(Math.abs(response!.phaseDelayMs - exact(2).delayMs)).toBeLessThan(0.3);
  });

  it('input with some energy above 8 Hz and a clean gyro: the bandwidth it reads is right', () => {
    const m = 125;
    const slow = new Float64Array(N);
    let s = 0;
    for (let n = 0; n < N; n++) {
      s += white[n]! - (white[n - m] ?? 0);
      slow[n] = (s / m) * 10;
    }
    const { response } = stickResponse(slow, lagFilter(slow), fs, [[0, N]]);
    const bw = response!.bandwidthHz;
    expect(bw === null || Math.abs(bw - exactBandwidth()) < 0.3).toBe(true);
  });

  it('returns null with a reason when the sticks hardly move', () => {
    const still = new Float64Array(20_000).fill(3);
    const r = stickResponse(still, still, fs, [[0, 20_000]]);
    expect(r.response).toBeNull();
    expect(r.reason).toMatch(/hardly moved/);
  });
});

// Faults injected by the synthesiser (scenarios in shared/sim/scenarios.ts): 40 ms of link
// latency, a softened rate loop. The allowances (3, 6, 8 ms; 8 Hz) are this block's own.
// With stick-like input the correlation lag sits near the low-frequency phase delay
// (tests/REFERENCES.md §14).
describe('stick response on the synthesiser’s loops', () => {
  const run = (name: string) => {
    const { log, truth } = simulate(scenarios[name]!, { seconds: 60, seed: 3 });
    return analyzeFlight(log, { airframe: truth.airframe }).report.tracking!;
  };
  const clean = run('clean-quad-x');

  it('the phase delay agrees with the cross-correlation lag on roll and pitch', () => {
    for (const axis of ['roll', 'pitch'] as const)
      expect(Math.abs(clean[axis].phaseDelayMs! - clean[axis].lagMs!)).toBeLessThan(3);
  });

  it('40 ms of link latency shows up in the phase delay', () => {
    const late = run('tracking-delay');
    for (const axis of ['roll', 'pitch'] as const) {
      const added = late[axis].phaseDelayMs! - clean[axis].phaseDelayMs!;
      expect(Math.abs(added - 40)).toBeLessThan(6);
    }
  });

  it('a soft tune has a lower bandwidth than the sticks reach and more delay', () => {
    const slow = run('slow-loop');
    for (const axis of ['roll', 'pitch'] as const) {
      expect(slow[axis].bandwidthHz).not.toBeNull();
      expect(slow[axis].bandwidthHz!).toBeLessThan(8);
      // The good tune's bandwidth lies beyond what the pilot's sticks excite: not read.
      expect(clean[axis].bandwidthHz).toBeNull();
      expect(slow[axis].phaseDelayMs!).toBeGreaterThan(clean[axis].phaseDelayMs! + 8);
    }
  });
});
