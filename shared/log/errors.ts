import type { ProposedColumnMap } from './column-map';

/** Stable codes a caller (UI, CLI, server) can branch on. */
export type LogErrorCode =
  | 'empty-file'
  | 'no-header'
  | 'no-rows'
  | 'unsupported-encoding'
  | 'needs-column-map'
  | 'bad-column-map'
  | 'unknown-unit'
  | 'needs-poles'
  | 'empty-header'
  | 'duplicate-channel'
  | 'missing-channel'
  | 'bad-number'
  | 'stray-quote'
  | 'ragged-row'
  | 'line-too-long'
  | 'missing-time'
  | 'too-few-samples'
  | 'time-stalled'
  | 'bad-gzip'
  | 'gzip-needs-stream';

export interface LogFormatErrorDetails {
  /** 1-based line as an editor shows it; metadata and header lines count. */
  line: number;
  /** 1-based column (field) number. */
  column?: number;
  /** The header of that column as written in the file. */
  header?: string;
  /** Every header of the file, when the error is about the header row. */
  headers?: string[];
  /** A suggested column map, when the headers are not ours. */
  proposal?: ProposedColumnMap;
}

/**
 * A file the engine cannot read. The message is written for a pilot and names the line (and
 * column); `code` is stable for programs.
 */
export class LogFormatError extends Error {
  override readonly name = 'LogFormatError';
  readonly code: LogErrorCode;
  readonly line: number;
  readonly column?: number;
  readonly header?: string;
  readonly headers?: string[];
  readonly proposal?: ProposedColumnMap;

  constructor(code: LogErrorCode, message: string, details: LogFormatErrorDetails) {
    super(message);
    this.code = code;
    this.line = details.line;
    if (details.column !== undefined) this.column = details.column;
    if (details.header !== undefined) this.header = details.header;
    if (details.headers !== undefined) this.headers = details.headers;
    if (details.proposal !== undefined) this.proposal = details.proposal;
  }
}

/** Thrown when a caller's abort signal fired between chunks; not a problem with the file. */
export class ParseCancelledError extends Error {
  override readonly name = 'ParseCancelledError';
  constructor() {
    super('The import was cancelled.');
  }
}

/** "line 12, column 3 (gyro_x)" — the place part of every message. */
export function describePlace(line: number, column?: number, header?: string): string {
  let s = `line ${line}`;
  if (column !== undefined) s += `, column ${column}`;
  if (header !== undefined && header !== '') s += ` (${header})`;
  return s;
}
