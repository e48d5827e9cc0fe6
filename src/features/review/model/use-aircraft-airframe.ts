import { useAircraft } from '../../../api/aircraft';
import type { ReviewFlight } from '../../../api/flights';
import type { Airframe } from '../../../../shared/schemas/airframe';
import { assumedAirframe } from './assumed-airframe';

/**
 * The airframe of the aircraft that flew, as the team keeps it now (the same cache entry the
 * aircraft page edits), or the assumed one for the motor count while it is unknown or out of reach.
 */
export function useAircraftAirframe(
  flight: Pick<ReviewFlight, 'aircraftId' | 'report'>,
  signedIn: boolean,
): { airframe: Airframe; assumed: boolean; aircraftName: string | null } {
  const aircraft = useAircraft(flight.aircraftId ?? '', signedIn && flight.aircraftId !== null);
  return aircraft.data
    ? { airframe: aircraft.data.airframe, assumed: false, aircraftName: aircraft.data.name }
    : { airframe: assumedAirframe(flight.report.motorCount), assumed: true, aircraftName: null };
}
