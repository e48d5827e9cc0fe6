import { driftSample } from '../../shared/analysis/drift';
import type { BaselineFlight } from '../../shared/schemas/baseline';
import { localDb } from './local-db';

/**
 * The flights of one aircraft kept on this device, as drift samples: the baseline when the team's
 * server cannot be asked (offline, signed out). Flights without a recorded time count from when
 * they were stored here.
 */
export async function deviceBaselineFlights(aircraftId: string): Promise<BaselineFlight[]> {
  const rows = await localDb().flights.where('aircraftId').equals(aircraftId).toArray();
  return rows.map((f) => ({
    flightId: f.id,
    recordedAt: f.recordedAt ?? new Date(f.savedAt).toISOString(),
    sample: driftSample(f.report),
  }));
}
