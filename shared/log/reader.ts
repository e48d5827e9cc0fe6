import { isIdentity } from './channels';
import { describePlace, LogFormatError } from './errors';
import { readPreamble, type Delimiter, type Preamble } from './preamble';
import { resolveColumns, type ColumnPlan, type ReadOptions } from './resolve-columns';
import { analyseTimeBase } from './time-base';
import { checkUnits } from './unit-checks';
import type { Column, LogWarning, ParsedLog } from './types';
import { decodeUtf8 } from './utf8';

export type { ReadOptions } from './resolve-columns';

/** A data line longer than this is not a log row (binary data, or no line endings). */
export const MAX_LINE_BYTES = 1 << 20;
const INITIAL_ROWS = 4096;

const STORE = 0;
const CONVERT = 1;
const SKIP = 2;

const LF = 10;
const CR = 13;
const QUOTE = 34;
const HASH = 35;
const MINUS = 45;
const DOT = 46;
const MAX_EXACT = 9007199254740991; // 2^53 − 1: integers up to here are exact doubles
/** 10^k, exact as doubles for k ≤ 22, so m / 10^k rounds once, like parseFloat. */
const POW10 = Float64Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/**
 * Streaming CSV → typed columns. Push byte chunks in any sizes (a row, a number or a CRLF may
 * straddle chunks), then `finish()`. Numbers are decoded straight from the bytes; only the
 * preamble and error messages ever become strings. `push` copies what it keeps (an unfinished
 * line), so the caller may reuse the chunk's buffer as soon as it returns.
 */
export class LogReader {
  private bytes = 0;
  private readonly options: ReadOptions;
  private phase: 'preamble' | 'data' | 'done' = 'preamble';
  private head = new Uint8Array(0);
  private headLen = 0;
  private carry = new Uint8Array(0);
  private carryLen = 0;
  private skipLF = false;

  private preamble: Preamble | null = null;
  private plans: ColumnPlan[] = [];
  private warnings: LogWarning[] = [];
  private optionalLast = false;
  private nCols = 0;
  private delim = 44;
  private decimalAlt = DOT;
  private kinds = new Uint8Array(0);
  private scale = new Float64Array(0);
  private offset = new Float64Array(0);
  private shift = new Float64Array(0);
  private mul = new Float64Array(0);
  private div = new Float64Array(0);
  private sinks: (Column | null)[] = [];
  /** Index of the time field: its sink is the one Float64Array. */
  private timeCol = 0;
  /** Out-values of slowCell (kept on the reader to avoid an object per slow cell). */
  private cellValue = 0;
  private cellEmpty = false;
  private cellBad = false;
  /** The file's last line had no line ending (finish() supplied one). */
  private finalWithoutEol = false;
  private capacity = 0;
  private rows = 0;
  private line = 1;
  private estimated = false;
  private dataBytes = 0;

  private emptyCounts = new Float64Array(0);
  private firstEmptyLine = new Int32Array(0);
  private rowEmpties = new Int32Array(0);

  /** Error held back until we know whether its line is the file's last (a cut-short line). */
  private pending: LogFormatError | null = null;
  private pendingLine = 0;
  /** [row, extra lines before it] pairs for blank and comment lines among the samples. */
  private skipRows: number[] = [];
  private skipExtra: number[] = [];
  private blankLines = 0;
  private commentLines = 0;
  private firstCommentLine = 0;

  constructor(options: ReadOptions = {}) {
    this.options = options;
  }

  /** Bytes pushed so far. */
  get bytesRead(): number {
    return this.bytes;
  }

  /** 1-based line the reader is at (for messages about where the input stopped). */
  get currentLine(): number {
    return this.line;
  }

  /** Complete rows read so far. */
  get rowsRead(): number {
    return this.rows;
  }

  push(chunk: Uint8Array): void {
    if (this.phase === 'done') throw new Error('LogReader.push after finish()');
    this.bytes += chunk.length;
    if (chunk.length === 0) return;
    if (this.phase === 'preamble') {
      this.appendHead(chunk);
      const pre = readPreamble(this.head.subarray(0, this.headLen), false);
      if (!pre) return;
      this.startData(pre);
      const rest = this.head.subarray(pre.dataStart, this.headLen);
      this.head = new Uint8Array(0);
      this.feed(rest);
      return;
    }
    this.feed(chunk);
  }

  finish(): ParsedLog {
    if (this.phase === 'done') throw new Error('LogReader.finish called twice');
    if (this.phase === 'preamble') {
      const pre = readPreamble(this.head.subarray(0, this.headLen), true);
      if (!pre) throw new LogFormatError('no-header', 'Line 1: no header row found.', { line: 1 });
      this.startData(pre);
      const rest = this.head.subarray(pre.dataStart, this.headLen);
      this.head = new Uint8Array(0);
      this.feed(rest);
    }
    this.phase = 'done';
    if (this.carryLen > 0) {
      // The last line has no line ending: give it one, and remember it had none.
      this.appendCarry(new Uint8Array([LF]), 0, 1);
      this.finalWithoutEol = true;
      this.consume(this.carry, 0, this.carryLen);
      this.carryLen = 0;
    }
    return this.result();
  }

  private appendHead(chunk: Uint8Array): void {
    if (this.headLen + chunk.length > this.head.length) {
      const next = new Uint8Array(
        Math.max(this.headLen + chunk.length, this.head.length * 2, 4096),
      );
      next.set(this.head.subarray(0, this.headLen));
      this.head = next;
    }
    this.head.set(chunk, this.headLen);
    this.headLen += chunk.length;
  }

  private startData(pre: Preamble): void {
    this.preamble = pre;
    const resolved = resolveColumns(pre.headers, pre.headerLine, this.options);
    this.plans = resolved.plans;
    this.warnings.push(...resolved.warnings);
    this.optionalLast = resolved.optionalLast;
    const n = (this.nCols = this.plans.length);
    this.delim = pre.delimiter.charCodeAt(0);
    // A decimal comma is read as a decimal point when the comma is not the delimiter.
    this.decimalAlt = pre.delimiter === ',' ? DOT : 44;
    this.kinds = new Uint8Array(n);
    this.scale = new Float64Array(n);
    this.offset = new Float64Array(n);
    this.shift = new Float64Array(n);
    this.mul = new Float64Array(n);
    this.div = new Float64Array(n);
    this.emptyCounts = new Float64Array(n);
    this.firstEmptyLine = new Int32Array(n).fill(-1);
    this.rowEmpties = new Int32Array(n + 1);
    this.capacity = INITIAL_ROWS;
    this.sinks = this.plans.map((p, i) => {
      const c = p.conversion;
      this.scale[i] = p.scale;
      this.offset[i] = p.offset;
      this.shift[i] = c.shift;
      this.mul[i] = c.mul;
      this.div[i] = c.div;
      if (p.channel === null) {
        this.kinds[i] = SKIP;
        return null;
      }
      this.kinds[i] = p.scale === 1 && p.offset === 0 && isIdentity(c) ? STORE : CONVERT;
      return p.channel === 'time' ? new Float64Array(INITIAL_ROWS) : new Float32Array(INITIAL_ROWS);
    });
    this.timeCol = this.plans.findIndex((p) => p.channel === 'time');
    this.line = pre.headerLine + 1;
    this.skipLF = pre.endsWithCR;
    this.phase = 'data';
  }

  /** Reads every complete line of `chunk` and keeps the unfinished tail for the next one. */
  private feed(chunk: Uint8Array): void {
    let last = chunk.length - 1;
    while (last >= 0 && chunk[last] !== LF && chunk[last] !== CR) last--;
    if (last < 0) {
      this.appendCarry(chunk, 0, chunk.length);
      return;
    }
    let start = 0;
    if (this.carryLen > 0) {
      let first = 0;
      while (chunk[first] !== LF && chunk[first] !== CR) first++;
      this.appendCarry(chunk, 0, first + 1);
      this.consume(this.carry, 0, this.carryLen);
      this.carryLen = 0;
      start = first + 1;
    }
    if (start <= last) this.consume(chunk, start, last + 1);
    if (last + 1 < chunk.length) this.appendCarry(chunk, last + 1, chunk.length);
  }

  private appendCarry(chunk: Uint8Array, from: number, to: number): void {
    const len = to - from;
    if (this.carryLen + len > this.carry.length) {
      const next = new Uint8Array(Math.max(this.carryLen + len, this.carry.length * 2, 1024));
      next.set(this.carry.subarray(0, this.carryLen));
      this.carry = next;
    }
    this.carry.set(chunk.subarray(from, to), this.carryLen);
    this.carryLen += len;
    if (this.carryLen > MAX_LINE_BYTES) {
      throw new LogFormatError(
        'line-too-long',
        `Line ${this.line} is longer than ${MAX_LINE_BYTES >> 10} KB without ending. A log row is a few hundred bytes; this part of the file is not CSV rows (binary data or missing line endings).`,
        { line: this.line },
      );
    }
  }

  private grow(rows: number): void {
    let next: number;
    const expected = this.options.expectedBytes;
    if (
      !this.estimated &&
      expected !== undefined &&
      expected > 0 &&
      rows > 0 &&
      this.dataBytes > 0
    ) {
      // Size once from the bytes per row seen so far, with a little room for longer numbers.
      const perRow = this.dataBytes / rows;
      next = Math.ceil((Math.max(0, expected - this.bytes) / perRow) * 1.03) + rows + 1024;
      this.estimated = true;
    } else if (this.estimated) {
      next = Math.ceil(this.capacity * 1.25) + 1024;
    } else {
      next = this.capacity * 2;
    }
    this.capacity = next;
    this.sinks = this.sinks.map((col) => {
      if (col === null) return null;
      const grown = col instanceof Float64Array ? new Float64Array(next) : new Float32Array(next);
      grown.set(col.subarray(0, rows));
      return grown;
    });
  }

  /** Line of a row: header line + 1 + row + blank or comment lines before it. */
  lineOfRow(row: number): number {
    const base = (this.preamble?.headerLine ?? 0) + 1 + row;
    const rs = this.skipRows;
    let lo = 0;
    let hi = rs.length - 1;
    let extra = 0;
    while (lo <= hi) {
      const mid = (lo + hi) >>> 1;
      if (rs[mid]! <= row) {
        extra = this.skipExtra[mid]!;
        lo = mid + 1;
      } else hi = mid - 1;
    }
    return base + extra;
  }

  private noteSkippedLine(rows: number): void {
    const last = this.skipRows.length - 1;
    const total = (last >= 0 ? this.skipExtra[last]! : 0) + 1;
    if (last >= 0 && this.skipRows[last] === rows) this.skipExtra[last] = total;
    else {
      this.skipRows.push(rows);
      this.skipExtra.push(total);
    }
  }

  /** Index just past the line ending at `p` (LF, CR or CR LF); flags a CR that ends `end`. */
  private pastLineEnd(buf: Uint8Array, p: number, end: number): number {
    if (buf[p] === CR) {
      if (p + 1 < end) return buf[p + 1] === LF ? p + 2 : p + 1;
      this.skipLF = true;
    }
    return p + 1;
  }

  /**
   * When the line at `pos` is blank, spaces only, or a `#` comment, notes it and returns where
   * the next line starts; otherwise −1.
   */
  private skipLine(buf: Uint8Array, pos: number, end: number, rows: number, line: number): number {
    const delim = this.delim;
    let q = pos;
    let b = buf[q]!;
    if (b === HASH) {
      while (buf[q] !== LF && buf[q] !== CR) q++;
      if (this.commentLines++ === 0) this.firstCommentLine = line;
    } else {
      while (b === 32 || (b === 9 && delim !== 9)) b = buf[++q]!;
      if (b !== LF && b !== CR) return -1;
      this.blankLines++;
    }
    this.noteSkippedLine(rows);
    return this.pastLineEnd(buf, q, end);
  }

  /**
   * Reads the rows of buf[start, end), which holds whole lines only (buf[end − 1] is a line
   * ending), so no scan below needs a bounds check: every one stops at a line ending.
   */
  private consume(buf: Uint8Array, start: number, end: number): void {
    const nCols = this.nCols;
    const kinds = this.kinds;
    const delim = this.delim;
    const decAlt = this.decimalAlt;
    const emptyCounts = this.emptyCounts;
    const rowEmpties = this.rowEmpties;
    const timeCol = this.timeCol;
    let time = this.sinks[timeCol] as Float64Array;
    let f32 = this.sinks as Float32Array[];
    let cap = this.capacity;
    let rows = this.rows;
    let line = this.line;
    let pos = start;
    if (this.skipLF) {
      if (buf[pos] === LF) pos++;
      this.skipLF = false;
    }
    rowLoop: while (pos < end) {
      let b = buf[pos]!;
      // Rows almost always start with a digit; blank and comment lines start below '0'.
      if (b < 48) {
        const next = this.skipLine(buf, pos, end, rows, line);
        if (next >= 0) {
          pos = next;
          line++;
          continue;
        }
      }
      if (this.pending !== null) throw this.pending;
      if (rows === cap) {
        this.dataBytes = this.bytes - (this.preamble?.dataStart ?? 0) - (end - pos);
        this.grow(rows);
        time = this.sinks[timeCol] as Float64Array;
        f32 = this.sinks as Float32Array[];
        cap = this.capacity;
      }
      let emptyN = 0;
      let c = 0;
      for (;;) {
        const kind = kinds[c]!;
        let p = pos;
        let v: number;
        if (kind !== SKIP) {
          // Fast path: [-]digits[.digits] straight into a double.
          let neg = false;
          let m = 0;
          let fd = 0;
          b = buf[p]!;
          if (b === MINUS) {
            neg = true;
            b = buf[++p]!;
          }
          const digits0 = p;
          let d = b - 48;
          while (d >>> 0 < 10) {
            m = m * 10 + d;
            d = buf[++p]! - 48;
          }
          b = d + 48;
          let nd = p - digits0;
          if (b === DOT || b === decAlt) {
            const frac0 = ++p;
            d = buf[p]! - 48;
            while (d >>> 0 < 10) {
              m = m * 10 + d;
              d = buf[++p]! - 48;
            }
            b = d + 48;
            fd = p - frac0;
            nd += fd;
          }
          if ((b === delim || b === LF || b === CR) && nd > 0 && m <= MAX_EXACT && fd < 23) {
            v = fd === 0 ? m : m / POW10[fd]!;
            if (neg) v = -v;
          } else {
            p = this.slowCell(buf, pos, line, c);
            if (this.cellBad) {
              this.undoEmpties(emptyN, line);
              pos = this.badCell(buf, pos, p, end, line, c);
              line++;
              continue rowLoop;
            }
            v = this.cellValue;
            if (this.cellEmpty) {
              emptyCounts[c]!++;
              rowEmpties[emptyN++] = c;
              if (this.firstEmptyLine[c]! < 0) this.firstEmptyLine[c] = line;
            }
            b = buf[p]!;
          }
          if (kind !== STORE) {
            v =
              ((v * this.scale[c]! + this.offset[c]! + this.shift[c]!) * this.mul[c]!) /
              this.div[c]!;
          }
          // Two typed stores, each seeing one array type, keep both sites monomorphic.
          if (c === timeCol) time[rows] = v;
          else f32[c]![rows] = v;
        } else {
          p = this.skipCell(buf, p, line, c);
          b = buf[p]!;
        }
        if (b === delim) {
          c++;
          pos = p + 1;
          if (c < nCols) continue;
          // One trailing delimiter at the end of a full row is harmless.
          b = buf[pos]!;
          if (b !== LF && b !== CR) {
            throw this.raggedError(line, nCols + 1 + this.countDelims(buf, pos));
          }
          p = pos;
          c--;
        }
        // End of the row at the line ending at p.
        const cells = c + 1;
        if (cells < nCols && !(this.optionalLast && cells === nCols - 1)) {
          this.undoEmpties(emptyN, line);
          this.hold(this.raggedError(line, cells), line);
        } else {
          rows++;
        }
        line++;
        pos = this.pastLineEnd(buf, p, end);
        break;
      }
    }
    this.rows = rows;
    this.line = line;
  }

  private undoEmpties(n: number, line: number): void {
    for (let i = 0; i < n; i++) {
      const c = this.rowEmpties[i]!;
      this.emptyCounts[c]!--;
      if (this.firstEmptyLine[c] === line) this.firstEmptyLine[c] = -1;
    }
  }

  private hold(err: LogFormatError, line: number): void {
    this.pending = err;
    this.pendingLine = line;
  }

  /**
   * Reads one cell the general way: spaces, quotes, exponents, NaN/inf, empty. Returns the
   * index of its terminator (delimiter or line ending). Sets cellValue / cellEmpty / cellBad.
   */
  private slowCell(buf: Uint8Array, start: number, line: number, c: number): number {
    const delim = this.delim;
    let s = start;
    while (buf[s] === 32 || (buf[s] === 9 && delim !== 9)) s++;
    let textStart = s;
    let textEnd: number;
    let p: number;
    if (buf[s] === QUOTE) {
      p = this.closingQuote(buf, s + 1, line, c);
      textStart = s + 1;
      textEnd = p;
      p++;
      while (buf[p] === 32 || (buf[p] === 9 && delim !== 9)) p++;
      if (buf[p] !== delim && buf[p] !== LF && buf[p] !== CR) {
        throw new LogFormatError(
          'stray-quote',
          `${this.placeText(line, c)}: text follows a closing quote; expected a ${this.delimName()} or the end of the line.`,
          { line, column: c + 1, header: this.plans[c]?.header },
        );
      }
    } else {
      p = s;
      for (;;) {
        const b = buf[p]!;
        if (b === delim || b === LF || b === CR) break;
        if (b === QUOTE) throw this.quoteError(line, c);
        p++;
      }
      textEnd = p;
    }
    while (textEnd > textStart && (buf[textEnd - 1] === 32 || buf[textEnd - 1] === 9)) textEnd--;
    this.cellEmpty = false;
    this.cellBad = false;
    if (textStart === textEnd) {
      this.cellValue = NaN;
      this.cellEmpty = true;
      return p;
    }
    const v = parseNumberBytes(buf, textStart, textEnd, this.decimalAlt);
    if (v === null) this.cellBad = true;
    else this.cellValue = v;
    return p;
  }

  /**
   * Index of the quote that closes a quoted field whose text starts at `p`; a doubled quote
   * inside is an escaped one. A quoted field never spans lines.
   */
  private closingQuote(buf: Uint8Array, p: number, line: number, c: number): number {
    for (;;) {
      const b = buf[p]!;
      if (b === LF || b === CR) throw this.quoteError(line, c);
      if (b === QUOTE) {
        if (buf[p + 1] !== QUOTE) return p;
        p += 2;
        continue;
      }
      p++;
    }
  }

  /** Skips a field we do not import, honouring quotes; returns its terminator's index. */
  private skipCell(buf: Uint8Array, start: number, line: number, c: number): number {
    const delim = this.delim;
    let p = start;
    while (buf[p] === 32) p++;
    if (buf[p] === QUOTE) p = this.closingQuote(buf, p + 1, line, c) + 1;
    for (;;) {
      const b = buf[p]!;
      if (b === delim || b === LF || b === CR) return p;
      p++;
    }
  }

  /**
   * A cell that is not a number. When it is the last cell of a line that is short, or of the
   * file's last line without a line ending, the line may have been cut off by a power loss:
   * hold the error until we know whether more rows follow, and return where the next line
   * starts. Otherwise throw.
   */
  private badCell(
    buf: Uint8Array,
    cellStart: number,
    cellEnd: number,
    end: number,
    line: number,
    c: number,
  ): number {
    let p = cellEnd;
    let more = 0;
    while (buf[p] !== LF && buf[p] !== CR) {
      if (buf[p] === this.delim) more++;
      p++;
    }
    const err = this.numberError(buf, cellStart, cellEnd, line, c);
    const cells = c + 1 + more;
    if (more === 0 && (cells < this.nCols || this.finalWithoutEol)) {
      this.hold(err, line);
      return this.pastLineEnd(buf, p, end);
    }
    throw err;
  }

  private countDelims(buf: Uint8Array, from: number): number {
    let n = 0;
    for (let p = from; buf[p] !== LF && buf[p] !== CR; p++) if (buf[p] === this.delim) n++;
    return n;
  }

  private delimName(): string {
    return this.delim === 9 ? 'tab' : this.delim === 59 ? 'semicolon' : 'comma';
  }

  private placeText(line: number, c: number): string {
    const header = this.plans[c]?.header;
    const s = describePlace(line, c + 1, header);
    return s.charAt(0).toUpperCase() + s.slice(1);
  }

  private numberError(
    buf: Uint8Array,
    start: number,
    end: number,
    line: number,
    c: number,
  ): LogFormatError {
    // Control bytes (e.g. the zeros a card leaves after a power cut) are shown as U+FFFD.
    const shown = Array.from(decodeUtf8(buf, start, Math.min(end, start + 40)).trim(), (ch) =>
      ch < ' ' || ch === '\u007f' ? '\ufffd' : ch,
    ).join('');
    const more = end - start > 40 ? '…' : '';
    const unit = this.plans[c]?.unit;
    return new LogFormatError(
      'bad-number',
      `${this.placeText(line, c)}: expected a number${unit ? ` (${this.plans[c]!.channel} in ${unit})` : ''}, found "${shown}${more}". Fix or delete that cell; an empty cell is read as a missing value.`,
      { line, column: c + 1, header: this.plans[c]?.header },
    );
  }

  private quoteError(line: number, c: number): LogFormatError {
    return new LogFormatError(
      'stray-quote',
      `${this.placeText(line, c)}: a quote (") opens here but does not close on the same line.`,
      { line, column: c + 1, header: this.plans[c]?.header },
    );
  }

  private raggedError(line: number, cells: number): LogFormatError {
    const expected = this.optionalLast ? this.nCols - 1 : this.nCols;
    const column = Math.min(cells, this.nCols);
    return new LogFormatError(
      'ragged-row',
      `Line ${line} has ${cells} value${cells === 1 ? '' : 's'} but the header has ${expected} columns. Every row needs one value per column (leave a cell empty for a missing value).`,
      { line, column, header: this.plans[column - 1]?.header },
    );
  }

  private result(): ParsedLog {
    const pre = this.preamble!;
    const warnings = this.warnings;
    if (this.pending !== null) {
      warnings.push({
        code: 'truncated-line',
        message: `The last line (line ${this.pendingLine}) is cut short, as when logging stops mid-write (a battery unplugged); it was left out. ${this.pending.message}`,
        line: this.pendingLine,
      });
    }
    const rows = this.rows;
    if (rows === 0) {
      throw new LogFormatError(
        'no-rows',
        `Line ${pre.headerLine}: the file has a header but no samples after it.`,
        { line: pre.headerLine, headers: pre.headers },
      );
    }
    const channels: string[] = [];
    const columns: Record<string, Column> = {};
    const sourceUnits: Record<string, string> = {};
    const emptyCells: Record<string, number> = {};
    const sourceColumns: Record<string, { column: number; header: string }> = {};
    this.plans.forEach((plan, i) => {
      const sink = this.sinks[i];
      if (plan.channel === null || !sink) return;
      // A column well short of its buffer is copied out so the spare room is freed (and not
      // transferred); a few % of slack is cheaper to keep than to copy 100 MB at the end.
      const slack = sink.length - rows;
      const col =
        slack === 0
          ? sink
          : slack * 16 <= sink.length
            ? sink.subarray(0, rows)
            : sink.slice(0, rows);
      this.sinks[i] = col; // drops the oversized buffer before the next column is copied
      channels.push(plan.channel);
      columns[plan.channel] = col;
      sourceUnits[plan.channel] = plan.unit ?? '';
      sourceColumns[plan.channel] = { column: i + 1, header: plan.header };
      const empty = this.emptyCounts[i]!;
      if (empty > 0) {
        emptyCells[plan.channel] = empty;
        warnings.push({
          code: 'empty-cells',
          message: `${plan.channel} ("${plan.header}") has ${empty} empty cell${empty === 1 ? '' : 's'}, first at line ${this.firstEmptyLine[i]}; they are read as missing values.`,
          line: this.firstEmptyLine[i]!,
        });
      }
    });
    const time = columns.time as Float64Array;
    for (let r = 0; r < rows; r++) {
      const t = time[r]!;
      if (!Number.isFinite(t)) {
        const line = this.lineOfRow(r);
        const column = this.plans.findIndex((p) => p.channel === 'time') + 1;
        throw new LogFormatError(
          'missing-time',
          `Line ${line}, column ${column} ("${this.plans[column - 1]!.header}"): the time is ${Number.isNaN(t) ? 'empty' : 'infinite'}. Every row needs a time to place its samples.`,
          { line, column, header: this.plans[column - 1]!.header },
        );
      }
    }
    if (this.blankLines > 0 && this.skipRows.some((r) => r < rows)) {
      const first = this.skipRows.findIndex((r) => r < rows);
      warnings.push({
        code: 'blank-lines',
        message: `Blank lines among the samples were skipped (first before line ${this.lineOfRow(this.skipRows[first]!)}).`,
        line: this.lineOfRow(this.skipRows[first]!) - 1,
      });
    }
    if (this.commentLines > 0) {
      warnings.push({
        code: 'comment-lines',
        message: `${this.commentLines} line${this.commentLines === 1 ? '' : 's'} starting with # among the samples ${this.commentLines === 1 ? 'was' : 'were'} skipped (first at line ${this.firstCommentLine}).`,
        line: this.firstCommentLine,
      });
    }
    // The review reads time from the first sample; where the logger's clock started is kept.
    const timeStartS = time[0]!;
    if (timeStartS !== 0) for (let r = 0; r < rows; r++) time[r] = time[r]! - timeStartS;
    const tb = analyseTimeBase(time, (r) => this.lineOfRow(r));
    warnings.push(...tb.warnings);
    warnings.push(...checkUnits(this.plans, columns, pre.headerLine));
    return {
      channels,
      columns,
      rows,
      sampleRateHz: tb.sampleRateHz,
      durationS: tb.durationS,
      metadata: pre.metadata,
      warnings,
      sourceUnits,
      emptyCells,
      timeBase: tb.timeBase,
      headerLine: pre.headerLine,
      timeStartS,
      sourceColumns,
      sampleLines: { first: this.lineOfRow(0), last: this.lineOfRow(rows - 1) },
      delimiter: pre.delimiter as Delimiter,
    };
  }
}

const NAN_INF = /^([+-]?)(nan|inf|infinity)$/i;

/**
 * Parses a number written as [sign] digits [. digits] [e [sign] digits], or NaN / inf /
 * infinity in any case; null when the bytes are not one.
 */
export function parseNumberBytes(
  buf: Uint8Array,
  start: number,
  end: number,
  decimalAlt = DOT,
): number | null {
  let p = start;
  let text = '';
  const b0 = buf[p];
  if (b0 === 43 || b0 === MINUS) {
    text += String.fromCharCode(b0);
    p++;
  }
  let digits = 0;
  while (p < end && buf[p]! >= 48 && buf[p]! <= 57) {
    text += String.fromCharCode(buf[p]!);
    p++;
    digits++;
  }
  if (p < end && (buf[p] === DOT || buf[p] === decimalAlt)) {
    text += '.';
    p++;
    while (p < end && buf[p]! >= 48 && buf[p]! <= 57) {
      text += String.fromCharCode(buf[p]!);
      p++;
      digits++;
    }
  }
  if (digits > 0 && p < end && (buf[p] === 101 || buf[p] === 69)) {
    text += 'e';
    p++;
    if (p < end && (buf[p] === 43 || buf[p] === MINUS)) {
      text += String.fromCharCode(buf[p]!);
      p++;
    }
    let expDigits = 0;
    while (p < end && buf[p]! >= 48 && buf[p]! <= 57) {
      text += String.fromCharCode(buf[p]!);
      p++;
      expDigits++;
    }
    if (expDigits === 0) return null;
  }
  if (digits > 0 && p === end) return Number(text);
  if (end - start > 9) return null;
  const m = NAN_INF.exec(decodeUtf8(buf, start, end));
  if (!m) return null;
  if (m[2]!.toLowerCase() === 'nan') return NaN;
  return m[1] === '-' ? -Infinity : Infinity;
}
