import { LogFormatError } from './errors';
import { decodeUtf8 } from './utf8';

/**
 * The part of a file before the samples: optional BOM, blank lines, `# key: value` metadata,
 * then the header row. Works on the first bytes of a file; the data path starts at `dataStart`.
 */

export type Delimiter = ',' | ';' | '\t';

export interface Preamble {
  metadata: Record<string, string>;
  /** Header cells as written: trimmed, quotes removed. */
  headers: string[];
  delimiter: Delimiter;
  /** 1-based line of the header row. */
  headerLine: number;
  /** Byte offset just past the header row's line ending. */
  dataStart: number;
  /** True when the header ended with '\r' at the very end of the bytes (a '\n' may follow). */
  endsWithCR: boolean;
}

/** Longest preamble we wait for before deciding the file has no header. */
export const MAX_PREAMBLE_BYTES = 1 << 20;

/**
 * Reads the preamble from `bytes`. Returns null when the header row is not complete yet and
 * `final` is false (more bytes will come).
 */
export function readPreamble(bytes: Uint8Array, final: boolean): Preamble | null {
  if (
    bytes.length >= 2 &&
    ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))
  ) {
    throw new LogFormatError(
      'unsupported-encoding',
      'Line 1: this file is saved as UTF-16 text. Save or export it as UTF-8 (plain CSV) and drop it again.',
      { line: 1 },
    );
  }
  let pos = 0;
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) pos = 3;
  const metadata: Record<string, string> = {};
  let line = 1;
  for (;;) {
    let end = pos;
    while (end < bytes.length && bytes[end] !== 10 && bytes[end] !== 13) end++;
    if (end === bytes.length && !final) {
      if (bytes.length > MAX_PREAMBLE_BYTES) {
        throw new LogFormatError(
          'no-header',
          `No header row found in the first ${MAX_PREAMBLE_BYTES >> 10} KB (line ${line} never ends). Is this a CSV log?`,
          { line },
        );
      }
      return null;
    }
    let next = end;
    let endsWithCR = false;
    if (next < bytes.length) {
      if (bytes[next] === 13) {
        next++;
        if (next < bytes.length) {
          if (bytes[next] === 10) next++;
        } else endsWithCR = true;
      } else next++;
    }
    const text = decodeUtf8(bytes, pos, end);
    const trimmed = text.trim();
    if (trimmed === '') {
      if (end === bytes.length) {
        throw new LogFormatError(
          line === 1 && Object.keys(metadata).length === 0 ? 'empty-file' : 'no-header',
          line === 1 && Object.keys(metadata).length === 0
            ? 'Line 1: the file is empty; there is nothing to import.'
            : `Line ${line}: the file ends before a header row (time, motor1, …) was found.`,
          { line },
        );
      }
    } else if (trimmed.startsWith('#')) {
      const body = trimmed.slice(1).trim();
      const colon = body.indexOf(':');
      if (colon > 0) setKey(metadata, body.slice(0, colon).trim(), body.slice(colon + 1).trim());
      else if (body !== '') setKey(metadata, body, '');
      if (end === bytes.length) {
        throw new LogFormatError(
          'no-header',
          `Line ${line}: the file ends before a header row (time, motor1, …) was found.`,
          { line },
        );
      }
    } else {
      if (bytes.indexOf(0, pos) !== -1 && bytes.indexOf(0, pos) < end) {
        throw new LogFormatError(
          'no-header',
          `Line ${line}: the header row contains binary data. Is this a CSV log?`,
          { line },
        );
      }
      const delimiter = detectDelimiter(text);
      const headers = splitCells(text, delimiter, line);
      return { metadata, headers, delimiter, headerLine: line, dataStart: next, endsWithCR };
    }
    pos = next;
    line++;
  }
}

/** Stores a key from the file as an own property, even one named like `__proto__`. */
function setKey(target: Record<string, string>, key: string, value: string): void {
  Object.defineProperty(target, key, {
    value,
    enumerable: true,
    writable: true,
    configurable: true,
  });
}

/** The delimiter that occurs most often outside quotes; comma on a tie or none. */
export function detectDelimiter(text: string): Delimiter {
  const counts = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of text) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++;
  }
  let best: Delimiter = ',';
  if (counts[';'] > counts[best]) best = ';';
  if (counts['\t'] > counts[best]) best = '\t';
  return best;
}

/** Splits one line into cells, honouring "quoted, cells" with "" as an escaped quote. */
export function splitCells(text: string, delimiter: string, line: number): string[] {
  const cells: string[] = [];
  let i = 0;
  for (;;) {
    while (i < text.length && (text[i] === ' ' || (text[i] === '\t' && delimiter !== '\t'))) i++;
    let cell = '';
    if (text[i] === '"') {
      const startCol = cells.length + 1;
      i++;
      for (;;) {
        if (i >= text.length) {
          throw new LogFormatError(
            'stray-quote',
            `Line ${line}, column ${startCol}: a quote opens here but never closes.`,
            { line, column: startCol },
          );
        }
        if (text[i] === '"') {
          if (text[i + 1] === '"') {
            cell += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        cell += text[i];
        i++;
      }
      while (i < text.length && text[i] !== delimiter) {
        if (text[i] !== ' ' && text[i] !== '\t') {
          throw new LogFormatError(
            'stray-quote',
            `Line ${line}, column ${startCol}: text follows the closing quote; expected "${delimiter === '\t' ? 'tab' : delimiter}" or the end of the line.`,
            { line, column: startCol },
          );
        }
        i++;
      }
    } else {
      const next = text.indexOf(delimiter, i);
      const stop = next === -1 ? text.length : next;
      cell = text.slice(i, stop).trim();
      i = stop;
    }
    cells.push(cell);
    if (i >= text.length) return cells;
    i++; // past the delimiter
  }
}
