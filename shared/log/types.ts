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

export interface ParsedLog {
  /** Canonical channel names in file order: 'time', 'motor1', 'gyro_x', … */
  channels: string[];
  /** One typed column per channel, all of length `rows`. `time` is always present. */
  columns: Record<string, Column>;
  rows: number;
  sampleRateHz: number;
  durationS: number;
  /** `# key: value` lines before the header. */
  metadata: Record<string, string>;
  warnings: LogWarning[];
}
