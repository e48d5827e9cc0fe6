import { expose } from 'comlink';
import {
  analyzeFlight,
  type AnalyzeOptions,
  type FlightAnalysis,
} from '../shared/analysis/analyze-flight';
import { benchFilters, type FilterBenchResult } from '../shared/analysis/filters/filter-bench';
import type { FilterSpec } from '../shared/analysis/filters/filter-spec';
import { findSegments } from '../shared/analysis/segments';
import { resolveThresholds } from '../shared/analysis/thresholds';
import type { ParsedLog } from '../shared/log/types';

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

const api = {
  /** Full report and chart detail for a flight; keeps the log for the filter bench. */
  analyze(flightId: string, log: ParsedLog, options: AnalyzeOptions = {}): FlightAnalysis {
    const result = analyzeFlight(log, options);
    remember(flightId, log, options);
    return result;
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

  /** Drops a flight's log from the cache. */
  forget(flightId: string): boolean {
    return cache.delete(flightId);
  },
};

export type AnalysisApi = typeof api;
expose(api);
