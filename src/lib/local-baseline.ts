import type { BaselineFlight } from '../../shared/schemas/baseline';
import { localDb } from './local-db';

/**
 * The flights of one aircraft kept on this device, as drift samples: the baseline when the team's
 * server cannot be asked (offline, signed out). Read from the samples kept beside each flight,
 * never from the flight records, which carry whole logs and traces. Flights without a recorded
 * time count from when they were stored here.
 */
export async function deviceBaselineFlights(aircraftId: string): Promise<BaselineFlight[]> {
  const rows = await localDb().driftSamples.where('aircraftId').equals(aircraftId).toArray();
  return rows.map(({ flightId, recordedAt, sample }) => ({ flightId, recordedAt, sample }));
}
