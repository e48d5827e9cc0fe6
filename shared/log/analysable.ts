import { LogFormatError } from './errors';
import type { ParsedLog } from './types';

/**
 * The reader accepts any well-formed file, even one sample long, so a pilot can look at what
 * was logged. An analysis needs more: at least two samples and a time that moves forward (the
 * sample rate is one over the median step). This says, with line and column, why a log is not
 * one to analyse; null when it is.
 */
export function whyNotAnalysable(log: ParsedLog): LogFormatError | null {
  const lines = log.sampleLines ?? { first: (log.headerLine ?? 0) + 1, last: log.rows };
  const where = log.sourceColumns?.time;
  const details = where ? { column: where.column, header: where.header } : {};
  const place = where ? `, column ${where.column} (${where.header})` : '';
  if (log.rows < 2) {
    return new LogFormatError(
      'too-few-samples',
      `Line ${lines.first}: the log holds ${log.rows === 1 ? 'one sample' : 'no samples'}; an analysis needs at least two, a time step apart. Was logging stopped right after it started?`,
      { line: lines.first },
    );
  }
  if (log.sampleRateHz > 0) return null;
  const time = log.columns.time;
  // As the logger wrote them: the reader starts time at 0.
  const start = log.timeStartS ?? 0;
  const first = time ? time[0]! + start : NaN;
  const last = time ? time[log.rows - 1]! + start : NaN;
  const allSame = time !== undefined && time.every((t) => t === time[0]);
  const said = allSame
    ? `time reads ${first} s on every sample from line ${lines.first} to line ${lines.last}`
    : `time does not move forward from one sample to the next in most of the log (${first} s at line ${lines.first}, ${last} s at line ${lines.last})`;
  return new LogFormatError(
    'time-stalled',
    `Line ${lines.first}${place}: ${said}, so the log has no sample rate to analyse with. Check that this column is the sample time (and its unit), or map the right column as time.`,
    { line: lines.first, ...details },
  );
}
