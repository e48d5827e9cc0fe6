import { canonicalReading, type ProposedColumnMap } from './column-map';
import { LogFormatError } from './errors';
import { isGzip } from './gzip';
import { proposeColumnMap } from './propose-column-map';
import { readPreamble, splitCells, type Delimiter } from './preamble';
import { decodeUtf8 } from './utf8';

/** What the column-map screen shows before anything is imported. */
export interface HeaderPreview {
  delimiter: Delimiter;
  /** Header cells as written (trimmed, quotes removed). */
  headers: string[];
  metadata: Record<string, string>;
  /** 1-based line of the header row. */
  headerLine: number;
  /** True when every header is one of our channel names with an accepted unit. */
  canonical: boolean;
  proposal: ProposedColumnMap;
  /** The first complete data rows, split into cells, as text. */
  sampleRows: string[][];
}

const MAX_SAMPLE_ROWS = 10;

/**
 * Reads the preamble and the first rows from the start of a file (plain CSV; decompress a
 * .gz first). Throws LogFormatError when there is no header in these bytes.
 */
export function inspectHeader(firstBytes: Uint8Array): HeaderPreview {
  if (isGzip(firstBytes)) {
    throw new LogFormatError(
      'gzip-needs-stream',
      'Line 1: these bytes are gzip-compressed; decompress them before reading the header.',
      { line: 1 },
    );
  }
  // The bytes are the start of a file: a header cut by the end of them is still shown.
  const pre = readPreamble(firstBytes, true);
  if (!pre) throw new LogFormatError('no-header', 'Line 1: no header row found.', { line: 1 });
  const sampleRows: string[][] = [];
  let pos = pre.dataStart;
  if (pre.endsWithCR && firstBytes[pos] === 10) pos++;
  let line = pre.headerLine + 1;
  while (sampleRows.length < MAX_SAMPLE_ROWS && pos < firstBytes.length) {
    let end = pos;
    while (end < firstBytes.length && firstBytes[end] !== 10 && firstBytes[end] !== 13) end++;
    if (end === firstBytes.length) break; // an unfinished line: not a sample
    const text = decodeUtf8(firstBytes, pos, end);
    if (text.trim() !== '' && !text.startsWith('#')) {
      try {
        sampleRows.push(splitCells(text, pre.delimiter, line));
      } catch {
        sampleRows.push([text]);
      }
    }
    pos = end + 1;
    if (firstBytes[end] === 13 && firstBytes[pos] === 10) pos++;
    line++;
  }
  const canonical = pre.headers.every(
    (h, i) => canonicalReading(h) !== null || (h === '' && i === pre.headers.length - 1 && i > 0),
  );
  return {
    delimiter: pre.delimiter,
    headers: pre.headers,
    metadata: pre.metadata,
    headerLine: pre.headerLine,
    canonical,
    proposal: proposeColumnMap(pre.headers, sampleRows, pre.delimiter),
    sampleRows,
  };
}
