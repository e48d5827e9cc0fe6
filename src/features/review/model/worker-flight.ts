import type { FilterSpec } from '../../../../shared/schemas/filters';
import { mapCoveringHeaders } from '../../../../shared/log/column-map';
import type { ReadOptions } from '../../../../shared/log/parse';
import type { Airframe } from '../../../../shared/schemas/airframe';
import { getRereadMap } from '../../../lib/local-db';
import { benchFilters, readIntoAnalysis } from '../../../lib/log-pipeline/pipeline';
import { fetchRawLog, type ReviewFlight } from '../../../api/flights';
import { fetchPresets } from '../../../api/presets';

/** The raw log's headers need a column map that neither this device nor the team has. */
export class NeedsColumnMapError extends Error {
  override name = 'NeedsColumnMapError';
}

const loading = new Map<string, Promise<void>>();

/**
 * The analysis worker keeps a log only for the tab that imported it. After a reload, or for a
 * flight stored by the team, the raw log is read again (from this device, else the server) the
 * way it was read at import: with the column map kept with the flight, or one confirmed on this
 * device for it, or else the team's import preset that covers its headers.
 */
async function loadIntoWorker(flight: ReviewFlight, airframe: Airframe): Promise<void> {
  const file = flight.file ?? (await fetchRawLog(flight.id));
  const poles = flight.readOptions.poles ?? airframe.poles;
  const base: ReadOptions = poles !== undefined ? { poles } : {};
  const kept =
    flight.readOptions.columnMap ?? (await getRereadMap(flight.id).catch(() => undefined));
  let failure = await readIntoAnalysis(
    flight.id,
    file,
    kept ? { ...base, columnMap: kept } : base,
    { airframe },
  );
  if (!failure) return;
  if (failure.code === 'needs-column-map' && !kept) {
    const presets =
      flight.teamId === null
        ? []
        : await fetchPresets(flight.teamId).then(
            (r) => r.presets,
            () => [], // offline or signed out: no presets to try
          );
    const preset = mapCoveringHeaders(presets, failure.headers ?? []);
    if (!preset) {
      throw new NeedsColumnMapError(
        'The raw log’s columns need a column map to be read again, and none is kept for this flight or among the team’s import presets.',
      );
    }
    failure = await readIntoAnalysis(flight.id, file, { ...base, columnMap: preset }, { airframe });
    if (!failure) return;
  }
  throw new Error(`The raw log could not be read again: ${failure.message}`);
}

/** Filter response and before/after spectra for one channel; reloads the log once if needed. */
export async function runFilterBench(
  flight: ReviewFlight,
  airframe: Airframe,
  channel: string,
  specs: FilterSpec,
) {
  try {
    return await benchFilters(flight.id, channel, specs);
  } catch {
    // Not loaded in this tab's worker (a reload, or a team flight): read the raw log again.
    let pending = loading.get(flight.id);
    if (!pending) {
      pending = loadIntoWorker(flight, airframe).finally(() => loading.delete(flight.id));
      loading.set(flight.id, pending);
    }
    await pending;
    return benchFilters(flight.id, channel, specs);
  }
}
