import type { FlightReport } from '../../../../shared/schemas/report';
import type { ReviewDetail } from '../../../../shared/analysis/review-detail';
import type { Airframe } from '../../../../shared/schemas/airframe';

/**
 * The geometry the review draws and judges by: the one the analysis itself used (kept in the
 * detail), so the top view matches the figures even if the aircraft was edited since; for a
 * flight stored before the detail carried it, the fallback (the aircraft from the server, or
 * an assumed preset offline).
 */
export function drawnAirframe(
  flight: { report: FlightReport; detail: ReviewDetail },
  fallback: { airframe: Airframe; assumed: boolean },
): { airframe: Airframe; assumed: boolean } {
  const own = flight.detail.airframe;
  return own ? { airframe: own, assumed: flight.report.airframe.assumed } : fallback;
}
