import { describe, expect, it } from 'vitest';
import { mapCoveringHeaders, type ColumnMap } from '../../../shared/log/column-map';

const outputs: ColumnMap = {
  columns: { T: { channel: 'time', unit: 'ms' }, Out0: { channel: 'motor1' } },
};
const wider: ColumnMap = {
  columns: { T: { channel: 'time' }, Out0: { channel: 'motor1' }, Vb: { channel: 'vbat' } },
};

describe('mapCoveringHeaders', () => {
  it('picks the first saved map that names every header', () => {
    expect(mapCoveringHeaders([{ columnMap: outputs }, { columnMap: wider }], ['T', 'Out0'])).toBe(
      outputs,
    );
    expect(
      mapCoveringHeaders([{ columnMap: outputs }, { columnMap: wider }], ['T', 'Out0', 'Vb']),
    ).toBe(wider);
  });

  it('finds none when a header is missing from every map', () => {
    expect(mapCoveringHeaders([{ columnMap: outputs }], ['T', 'Out0', 'Ibat'])).toBeUndefined();
  });

  it('never applies a map to a file with no headers, or when there are no maps', () => {
    expect(mapCoveringHeaders([{ columnMap: outputs }], [])).toBeUndefined();
    expect(mapCoveringHeaders(undefined, ['T'])).toBeUndefined();
  });
});
