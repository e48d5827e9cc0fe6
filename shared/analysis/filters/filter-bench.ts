import type { ParsedLog } from '../../log/types';
import type { Spectrum } from '../review-detail';
import { chooseSegment, welch } from '../dsp/welch';
import { toReviewSpectrum } from '../vibration';
import { applyFilters } from './apply';
import { FilterSpec } from '../../schemas/filters';
import { filterResponse, responseGrid, type FilterResponse } from './response';
import type { Ranges } from '../segments';

export interface FilterBenchResult {
  response: FilterResponse;
  before: Spectrum;
  after: Spectrum;
}

/**
 * Filter bench: the cascade's response, and the channel's Welch spectrum before and after
 * running the cascade over it (over `ranges`, normally armed time, so both spectra compare the
 * same stretch). Throws a RangeError for a channel the log doesn't have.
 */
export function benchFilters(
  log: ParsedLog,
  channel: string,
  specs: FilterSpec,
  ranges: Ranges = [[0, log.rows]],
): FilterBenchResult {
  const stages = FilterSpec.parse(specs);
  const col = log.columns[channel];
  if (!col || channel === 'time') throw new RangeError(`The log has no "${channel}" channel.`);
  const fs = log.sampleRateHz;
  const longest = ranges.reduce((m, [a, b]) => Math.max(m, b - a), 0);
  const nperseg = chooseSegment(fs, longest);
  const use = ranges.filter(([a, b]) => b - a >= nperseg);
  const filtered = applyFilters(stages, fs, col);
  const before = welch(col, fs, { nperseg, ranges: use });
  const after = welch(filtered, fs, { nperseg, ranges: use });
  return {
    response: filterResponse(stages, fs, responseGrid(fs, 512)),
    before: toReviewSpectrum(before),
    after: toReviewSpectrum(after),
  };
}
