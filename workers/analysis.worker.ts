import { expose } from 'comlink';
import {
  analyzeFlight,
  type AnalyzeOptions,
  type FlightAnalysis,
} from '../shared/analysis/analyze-flight';
import { benchFilters, type FilterBenchResult } from '../shared/analysis/filters/filter-bench';
import type { FilterSpec } from '../shared/schemas/filters';
import {
  stripTrace,
  type DetailPart,
  type DetailParts,
  type Trace,
} from '../shared/analysis/review-detail';
import { findSegments } from '../shared/analysis/segments';
import { resolveThresholds } from '../shared/schemas/thresholds';
import type { ParsedLog } from '../shared/log/types';
import { receiveDelivery, type AnalysedHead } from './protocol';

/** Logs kept so the filter bench can rerun without the page resending columns (a 300 s, 4 kHz log is ~100 MB). */
const CACHE_SIZE = 3;
const cache = new Map<string, { log: ParsedLog; options: AnalyzeOptions }>();

function remember(flightId: string, log: ParsedLog, options: AnalyzeOptions) {
  cache.delete(flightId);
  cache.set(flightId, { log, options });
  while (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
}

class FlightNotLoadedError extends Error {
  override name = 'FlightNotLoadedError';
}

/** The parse worker said no log is coming on the port (the read failed or was cancelled). */
class LogNotDeliveredError extends Error {
  override name = 'LogNotDeliveredError';
}

/** The log the parse worker posts on a hand-off port. */
async function receiveLog(port: MessagePort): Promise<ParsedLog> {
  const delivery = await receiveDelivery(port);
  if (!delivery.ok) throw new LogNotDeliveredError('No log arrived from the reader.');
  return delivery.log;
}

function analyse(flightId: string, log: ParsedLog, options: AnalyzeOptions): FlightAnalysis {
  const result = analyzeFlight(log, options);
  // The strip is thinned here, off the page's thread, so its first paint stays short.
  result.detail.strip = stripTrace(result.detail.effort);
  remember(flightId, log, options);
  return result;
}

/** Bulky detail parts `analyzeDelivered` held back, until `detailPart` hands each over. */
const heldParts = new Map<string, Partial<DetailParts>>();

const api = {
  /**
   * As `analyze`, for a log the parse worker posts on `port` (parse worker `parseInto`), so
   * the columns never pass through the page. Rejects with LogNotDeliveredError when the read
   * did not produce a log.
   */
  async analyzeDelivered(
    flightId: string,
    port: MessagePort,
    options: AnalyzeOptions = {},
  ): Promise<AnalysedHead> {
    const { report, detail } = analyse(flightId, await receiveLog(port), options);
    const { effort, tracking, power, campbell, spectra, ...head } = detail;
    heldParts.set(flightId, { effort, tracking, power, campbell, spectra });
    return { report, head };
  },

  /**
   * One bulky part of the detail `analyzeDelivered` held back (DETAIL_PARTS), as `{ [key]: part }`;
   * each part is handed over once.
   */
  detailPart(flightId: string, key: DetailPart): Partial<DetailParts> {
    const held = heldParts.get(flightId);
    if (!held || !(key in held)) {
      throw new FlightNotLoadedError(`No ${key} is waiting for flight ${flightId}.`);
    }
    const part = { [key]: held[key] };
    delete held[key];
    if (Object.keys(held).length === 0) heldParts.delete(flightId);
    return part;
  },

  /** Keeps a log delivered on `port` for the filter bench without analysing it again. */
  async loadDelivered(flightId: string, port: MessagePort, options: AnalyzeOptions = {}) {
    remember(flightId, await receiveLog(port), options);
  },

  /** The strip for a flight stored before the detail carried one. */
  strip(effort: Trace): Trace {
    return stripTrace(effort);
  },

  /** Filter preview on one channel of a flight analysed earlier in this worker. */
  filterBench(flightId: string, channel: string, specs: FilterSpec): FilterBenchResult {
    const entry = cache.get(flightId);
    if (!entry) {
      throw new FlightNotLoadedError(
        `Flight ${flightId} is not loaded in the analysis worker; analyse it first.`,
      );
    }
    const seg = findSegments(entry.log, resolveThresholds(entry.options.thresholds));
    return benchFilters(entry.log, channel, specs, seg.armed.length ? seg.armed : undefined);
  },

  /** Drops a flight's log (and any detail still held) from the worker. */
  forget(flightId: string): boolean {
    heldParts.delete(flightId);
    return cache.delete(flightId);
  },
};

export type AnalysisApi = typeof api;
expose(api);
