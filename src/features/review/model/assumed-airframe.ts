import { defaultQuadX, presetAirframe } from '../../../../shared/airframe/presets';
import type { Airframe } from '../../../../shared/schemas/airframe';

/**
 * The airframe drawn when the flight's own is not at hand (flight imported as "unknown", or the
 * aircraft cannot be fetched offline): the same assumption the analysis made for that motor count.
 */
export function assumedAirframe(motorCount: number): Airframe {
  if (motorCount === 6) return presetAirframe('hex-x');
  if (motorCount === 8) return presetAirframe('octo-x');
  return defaultQuadX;
}
