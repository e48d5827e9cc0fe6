import { describe, expect, it } from 'vitest';
import { motorColor } from '../../../../../../src/components/charts/palette';
import {
  followReviewTime,
  motorSeries,
  traceSeries,
  type TimeContext,
} from '../../../../../../src/features/review/components/sections/time-context';

const trace = {
  t: [0, 0.1, 0.2],
  series: { collective: [0.4, 0.5, 0.5], motor1: [0.3, 0.3, 0.3], motor3: [0.5, 0.5, 0.6] },
};

describe('series for the review charts', () => {
  it('keeps the picked series the trace holds, in the order picked, with their style', () => {
    const s = traceSeries(trace, [
      { key: 'effort_roll', name: 'Roll', color: '#111' },
      { key: 'collective', name: 'Collective', color: '#222', width: 1.6 },
    ]);
    expect(s).toEqual([{ name: 'Collective', color: '#222', width: 1.6, data: [0.4, 0.5, 0.5] }]);
  });

  it('gives nothing for an empty pick or a trace with no series', () => {
    expect(traceSeries(trace, [])).toEqual([]);
    expect(traceSeries({ t: [], series: {} }, [{ key: 'ibat', name: 'I', color: '#000' }])).toEqual(
      [],
    );
  });

  it('lists motors by number in their own colours, leaving out one the log lacks', () => {
    expect(motorSeries(trace, 4).map((m) => [m.name, m.color])).toEqual([
      ['Motor 1', motorColor(1)],
      ['Motor 3', motorColor(3)],
    ]);
  });

  it('hands every chart the shared cursor, zoom group and hover shading', () => {
    const onCursor = () => {};
    const time: TimeContext = { cursorT: 1.5, onCursor, group: 'flight-1', hover: [[2, 5]] };
    expect(followReviewTime(time)).toEqual({
      cursorT: 1.5,
      onCursor,
      group: 'flight-1',
      bands: [[2, 5]],
    });
  });
});
