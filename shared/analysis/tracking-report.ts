import type { FlightReport } from '../schemas/report';
import type { ReviewDetail } from './review-detail';
import type { AxisTrackingResult, TrackingResult } from './tracking';

const round = (v: number, digits: number) => {
  const f = 10 ** digits;
  return Math.round(v * f) / f;
};
const orNull = (v: number | null | undefined, digits: number) =>
  v === null || v === undefined || !Number.isFinite(v) ? null : round(v, digits);

function axisReport(t: AxisTrackingResult): NonNullable<FlightReport['tracking']>['roll'] {
  const r = t.response;
  return {
    rmsDegS: round(t.rmsDegS, 2),
    lagMs: orNull(t.lagMs, 2),
    bandwidthHz: orNull(r?.bandwidthHz, 2),
    peakGainDb: orNull(r?.peakGainDb, 2),
    phaseDelayMs: orNull(r?.phaseDelayMs, 2),
    coherence: orNull(r?.coherence, 3),
  };
}

/** The Tracking part of the report: RMS error and lag, and the Stick response figures. */
export function trackingReport(t: TrackingResult): NonNullable<FlightReport['tracking']> {
  return { roll: axisReport(t.roll), pitch: axisReport(t.pitch), yaw: axisReport(t.yaw) };
}

/** The Stick response curves the review draws, rounded for storage. */
export function responseCurves(t: TrackingResult): NonNullable<ReviewDetail['stickResponse']> {
  const curve = (a: AxisTrackingResult) => {
    const c = a.response?.curve;
    if (!c) return null;
    return {
      hz: c.hz.map((v) => round(v, 3)),
      gainDb: c.gainDb.map((v) => round(Math.max(-120, v), 2)),
      phaseDeg: c.phaseDeg.map((v) => round(v, 1)),
      coherence: c.coherence.map((v) => round(v, 3)),
    };
  };
  return { roll: curve(t.roll), pitch: curve(t.pitch), yaw: curve(t.yaw) };
}
