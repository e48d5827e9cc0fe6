import { describe, expect, it } from 'vitest';
import {
  labelSpan,
  placePeakLabels,
  xToPx,
  type LabelLayoutOptions,
  type LabelRequest,
} from '../../../../../../src/features/review/components/sections/peak-label-layout';
import { ParkMiller } from '../../../../../../shared/sim/prng';

const phone: LabelLayoutOptions = { widthPx: 280, xMin: 3.9, xMax: 500, xLog: true };

/** Every drawn label's span, per row, must leave the gap free on both sides. */
function assertNoOverlap(peaks: LabelRequest[], o: LabelLayoutOptions) {
  const placed = placePeakLabels(peaks, o);
  const spans = placed.flatMap((p) =>
    p.text === null ? [] : [{ row: p.row!, span: labelSpan(xToPx(p.hz, o), p.text.length, o) }],
  );
  for (let i = 0; i < spans.length; i++)
    for (let j = i + 1; j < spans.length; j++) {
      const a = spans[i]!;
      const b = spans[j]!;
      if (a.row !== b.row) continue;
      const apart = a.span[1] + 4 <= b.span[0] || b.span[1] + 4 <= a.span[0];
      expect(apart, `${JSON.stringify(a)} vs ${JSON.stringify(b)}`).toBe(true);
    }
  return placed;
}

describe('peak label placement', () => {
  it('maps frequencies onto a log or linear axis', () => {
    expect(xToPx(3.9, phone)).toBe(0);
    expect(xToPx(500, phone)).toBeCloseTo(280, 9);
    // The geometric mean sits half-way on a log axis.
    expect(xToPx(Math.sqrt(3.9 * 500), phone)).toBeCloseTo(140, 9);
    expect(xToPx(250, { ...phone, xMin: 0, xLog: false })).toBeCloseTo(140, 9);
  });

  it('keeps far-apart labels on the first row, each with its own text', () => {
    const placed = placePeakLabels(
      [
        { hz: 20, db: 0 },
        { hz: 300, db: 5 },
      ],
      phone,
    );
    expect(placed).toEqual([
      { hz: 20, row: 0, text: '20 Hz' },
      { hz: 300, row: 0, text: '300 Hz' },
    ]);
  });

  it('staggers close lines into rows, the loudest keeping the first', () => {
    const placed = assertNoOverlap(
      [
        { hz: 173, db: -5 },
        { hz: 189, db: 12 },
        { hz: 205, db: -14 },
      ],
      phone,
    );
    expect(placed.find((p) => p.hz === 189)).toMatchObject({ row: 0, text: '189 Hz' });
    expect(new Set(placed.map((p) => p.row))).toEqual(new Set([0, 1, 2]));
  });

  it('merges a label that fits no row into its nearest neighbour’s, or leaves it off', () => {
    const peaks = [180, 185, 190, 195].map((hz, i) => ({ hz, db: -i }));
    const placed = assertNoOverlap(peaks, { ...phone, rows: 2 });
    const texts = placed.flatMap((p) => (p.text ? [p.text] : []));
    expect(texts.length).toBeLessThan(4);
    // Every frequency is still named somewhere, or its line drawn unlabelled.
    expect(texts.join(' ')).toMatch(/180/);
    expect(texts.join(' ')).toMatch(/185/);
    expect(texts.some((t) => t.includes(' · '))).toBe(true);
  });

  it('never overlaps, whatever the lines (random trials)', () => {
    const rng = new ParkMiller(7);
    for (let trial = 0; trial < 300; trial++) {
      const n = 1 + Math.floor(rng.uniform() * 8);
      const peaks = Array.from({ length: n }, () => ({
        hz: 4 + rng.uniform() * 496,
        db: -30 + 40 * rng.uniform(),
      }));
      const widthPx = 150 + rng.uniform() * 1100;
      const xLog = rng.uniform() < 0.5;
      assertNoOverlap(peaks, { widthPx, xMin: xLog ? 3.9 : 0, xMax: 500, xLog });
    }
  });
});
