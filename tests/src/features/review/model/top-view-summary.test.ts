import { describe, expect, it } from 'vitest';
import { defaultQuadX } from '../../../../../shared/airframe/presets';
import { topViewSummary } from '../../../../../src/features/review/model/top-view-summary';

describe('top view summary', () => {
  it('carries every figure the picture shows, in motor order, with the marked motors', () => {
    const text = topViewSummary(
      { ...defaultQuadX, name: 'Kite' },
      [-1.2, 0.01, 11.84, NaN],
      { xMm: 3.04, yMm: -1.26 },
      new Set([3]),
    );
    expect(text).toBe(
      'Top view of Kite: 4 motors, motor 3 marked. Deviation from expected hover output: ' +
        'motor 1 −1.2 %, motor 2 0.0 %, motor 3 +11.8 %, motor 4 not measured; ' +
        'estimated CG at x 3.0 mm, y -1.3 mm',
    );
  });

  it('says nothing of a CG when there was too little hover to estimate one', () => {
    const text = topViewSummary(defaultQuadX, [0, 0, 0, 0], null, new Set());
    expect(text).not.toContain('CG');
    expect(text).not.toContain('marked');
  });
});
