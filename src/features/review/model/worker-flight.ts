import type { FilterSpec } from '../../../../shared/analysis/filters/filter-spec';
import type { Airframe } from '../../../../shared/schemas/airframe';
import { analysisWorker } from '../../../lib/analysis-worker';
import { parseWorker } from '../../../lib/parse-worker';
import { fetchRawLog, type ReviewFlight } from '../api/flight-api';

const loading = new Map<string, Promise<void>>();

/**
 * The analysis worker keeps a log only for the tab that imported it. After a reload, or for a
 * flight stored by the team, the raw log is read again (from this device, else the server) so
 * the filter bench can run on the flight's own gyro.
 */
async function loadIntoWorker(flight: ReviewFlight, airframe: Airframe): Promise<void> {
  const file = flight.file ?? (await fetchRawLog(flight.id));
  const parsed = await parseWorker().parseFile(`bench-${flight.id}`, file, {
    ...(airframe.poles ? { poles: airframe.poles } : {}),
  });
  if (!parsed.ok) throw new Error(`The raw log could not be read again: ${parsed.error.message}`);
  await analysisWorker().analyze(flight.id, parsed.log, { airframe });
}

/** Filter response and before/after spectra for one channel; reloads the log once if needed. */
export async function runFilterBench(
  flight: ReviewFlight,
  airframe: Airframe,
  channel: string,
  specs: FilterSpec,
) {
  try {
    return await analysisWorker().filterBench(flight.id, channel, specs);
  } catch (first) {
    let pending = loading.get(flight.id);
    if (!pending) {
      pending = loadIntoWorker(flight, airframe).finally(() => loading.delete(flight.id));
      loading.set(flight.id, pending);
    }
    try {
      await pending;
    } catch (e) {
      throw new Error(
        `${e instanceof Error ? e.message : String(e)} (first attempt: ${first instanceof Error ? first.message : String(first)})`,
        { cause: e },
      );
    }
    return analysisWorker().filterBench(flight.id, channel, specs);
  }
}
