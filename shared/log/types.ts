/**
 * The contract between the import engine and everything that reads a log.
 * Columns are stored in canonical units (see channel registry): time in s, motor outputs as
 * a 0–1 fraction, rpm in rpm, gyro and setpoints in deg/s, acc in g, vbat in V, currents in A.
 * Time is Float64Array because a 300 s log at 4 kHz needs sub-microsecond resolution over a
 * large offset; every other channel is Float32Array (24-bit mantissa is far finer than any
 * sensor we read, and it halves memory on 100 MB logs).
 */
export type Column = Float32Array | Float64Array;

export interface LogWarning {
  /** Stable machine code, e.g. 'log-gap', 'truncated-line', 'time-jitter', 'empty-cells'. */
  code: string;
  message: string;
  /** 1-based line of the file as an editor shows it, when the warning is about a place. */
  line?: number;
  /** Time in the flight, in seconds, when the warning is about a moment. */
  tS?: number;
}

/** A stretch of `time` where samples are missing: from `tS` for `durationS` seconds. */
export interface TimeGap {
  /** Time of the last sample before the gap, s. */
  tS: number;
  /** Length of the step across the gap, s. */
  durationS: number;
  /** 1-based file line of the first sample after the gap. */
  line: number;
}

/** What the reader learnt about the `time` column. */
export interface TimeBase {
  /** Median step between samples, s. */
  medianStepS: number;
  /** Steps ≤ 0 (time repeating or running backwards). */
  nonIncreasingSteps: number;
  /** Root-mean-square deviation of regular steps (gaps excluded) from the median, as % of it. */
  jitterPct: number;
  gaps: TimeGap[];
}

export interface ParsedLog {
  /** Canonical channel names in file order: 'time', 'motor1', 'gyro_x', … */
  channels: string[];
  /**
   * One typed column per channel, all of length `rows`. `time` is always present. A column
   * may be a view on a slightly longer buffer (at most 1/16 spare); use its length, not its
   * buffer's.
   */
  columns: Record<string, Column>;
  rows: number;
  sampleRateHz: number;
  durationS: number;
  /** `# key: value` lines before the header. */
  metadata: Record<string, string>;
  warnings: LogWarning[];
  /** Unit each channel was written in before conversion, e.g. { gyro_x: 'rad/s' }. */
  sourceUnits?: Record<string, string>;
  /** Empty cells per channel (read as NaN); channels with none are left out. */
  emptyCells?: Record<string, number>;
  timeBase?: TimeBase;
  /** 1-based line of the header row. */
  headerLine?: number;
  /**
   * The first sample's time as the logger wrote it, s. `time` itself starts at 0: the reader
   * subtracts this, so a flight reads from 0 s whatever the logger's clock said.
   */
  timeStartS?: number;
  /** Where each channel was read from: 1-based column and its header as written. */
  sourceColumns?: Record<string, { column: number; header: string }>;
  /** 1-based file lines of the first and last samples. */
  sampleLines?: { first: number; last: number };
  /** Field delimiter detected from the header. */
  delimiter?: ',' | ';' | '\t';
}
