import { describe, expect, it } from 'vitest';
import { defaultQuadX, presetAirframe } from '../../../../../shared/airframe/presets';
import { drawnAirframe } from '../../../../../src/features/review/model/drawn-airframe';
import { sampleDetail, sampleReport } from '../../../helpers/flight-fixture';

const fromServer = presetAirframe('wide-front-x', { name: 'Heron (edited since)' });

describe('the airframe the review draws', () => {
  it('is the one the analysis used, even when the aircraft on the server differs', () => {
    const heron = presetAirframe('wide-front-x', { name: 'Heron' });
    const flight = { report: sampleReport(), detail: { ...sampleDetail(), airframe: heron } };
    expect(drawnAirframe(flight, { airframe: fromServer, assumed: false })).toEqual({
      airframe: heron,
      assumed: false,
    });
  });

  it('keeps the analysis’s own word that its airframe was assumed', () => {
    const flight = {
      report: sampleReport({ airframe: { name: defaultQuadX.name, assumed: true } }),
      detail: { ...sampleDetail(), airframe: defaultQuadX },
    };
    expect(drawnAirframe(flight, { airframe: fromServer, assumed: false }).assumed).toBe(true);
  });

  it('falls back to the server’s aircraft for a flight stored without one', () => {
    const flight = { report: sampleReport(), detail: sampleDetail() };
    expect(drawnAirframe(flight, { airframe: fromServer, assumed: false })).toEqual({
      airframe: fromServer,
      assumed: false,
    });
  });
});
