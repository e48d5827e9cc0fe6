import { describe, expect, it } from 'vitest';
import { inferCells, LIPO, packVoltages } from '../../../shared/analysis/lipo';

describe('LiPo thresholds (tests/REFERENCES.md §12)', () => {
  it('uses 4.20 V full and 3.7 V nominal per cell (cell specifications) and 3.5 / 3.3 V in flight (common practice)', () => {
    expect(LIPO.fullV).toBe(4.2);
    expect(LIPO.nominalV).toBe(3.7);
    expect(LIPO.warnUnderLoadV).toBe(3.5);
    expect(LIPO.landNowV).toBe(3.3);
    expect(packVoltages(4).fullV).toBeCloseTo(16.8, 12);
    expect(packVoltages(6).nominalV).toBeCloseTo(22.2, 12);
  });

  it('infers the cell count of resting packs from full down to storage charge', () => {
    expect(inferCells(16.8)).toBe(4);
    expect(inferCells(14.8)).toBe(4);
    expect(inferCells(25.2)).toBe(6);
    expect(inferCells(22.8)).toBe(6);
    expect(inferCells(12.6)).toBe(3);
    expect(inferCells(4.2)).toBe(1);
    expect(inferCells(0)).toBeNull();
    expect(inferCells(Number.NaN)).toBeNull();
  });
});
