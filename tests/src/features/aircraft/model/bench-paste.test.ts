import { describe, expect, it } from 'vitest';
import { parseBenchPaste } from '../../../../../src/features/aircraft/model/bench-paste';
import { efficiencyGPerW } from '../../../../../src/features/aircraft/components/bench-runs-panel';

describe('pasted bench readings', () => {
  it('reads tab-separated lines with a header, taking throttle above 1 as a percentage', () => {
    expect(
      parseBenchPaste('throttle\tthrust\tcurrent\n25\t420\t2.1\n0.5;1180;7.4;5200;24.2\n'),
    ).toEqual([
      { throttle: 0.25, thrustG: 420, currentA: 2.1 },
      { throttle: 0.5, thrustG: 1180, currentA: 7.4, rpm: 5200, voltageV: 24.2 },
    ]);
  });

  it('names the line it cannot read', () => {
    expect(parseBenchPaste('25 420\n50 lots\n')).toBe(
      'Line 2: "50 lots" is not a list of numbers.',
    );
    expect(parseBenchPaste('75\n')).toBe('Line 1: needs at least throttle and thrust.');
    expect(parseBenchPaste('\n  \n')).toBe('Nothing to read: paste one reading per line.');
  });

  it('gives thrust per electrical watt only when current and voltage are both known', () => {
    // P = V·I (Joule's law): 24.2 V × 7.4 A = 179.08 W; 1180 g / 179.08 W = 6.589 g/W.
    expect(
      efficiencyGPerW({ throttle: 0.5, thrustG: 1180, currentA: 7.4, voltageV: 24.2 }),
    ).toBeCloseTo(6.5892, 4);
    expect(efficiencyGPerW({ throttle: 0.5, thrustG: 1180, currentA: 7.4 })).toBeNull();
  });
});
