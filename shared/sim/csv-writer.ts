import type { ParsedLog } from '../log/types';

/** Canonical unit and printed decimals per channel family (shared/log/FORMAT.md defaults). */
const FORMATS: [RegExp, string, number][] = [
  [/^time$/, 's', 6],
  [/^motor\d+$/, 'frac', 4],
  [/^rpm\d+$/, 'rpm', 0],
  [/^gyro_[xyz]$/, 'deg/s', 3],
  [/^acc_[xyz]$/, 'g', 4],
  [/^sp_(roll|pitch|yaw)$/, 'deg/s', 2],
  [/^throttle$/, 'frac', 4],
  [/^vbat$/, 'V', 3],
  [/^ibat$/, 'A', 2],
  [/^imotor\d+$/, 'A', 2],
];

function formatOf(channel: string): { unit: string | null; decimals: number } {
  for (const [re, unit, decimals] of FORMATS) if (re.test(channel)) return { unit, decimals };
  return { unit: null, decimals: 4 };
}

export interface CsvOptions {
  /** `# key: value` lines before the header; merged over the log's own metadata. */
  metadata?: Record<string, string>;
  /** Write `channel [unit]` headers (default true). */
  units?: boolean;
  /** Rows per yielded chunk (default 4096). */
  chunkRows?: number;
}

/**
 * Fixed-point text for v with `decimals` places (half away from zero); NaN prints as an empty
 * cell. Integer arithmetic is exact to 2⁵³, ample for logged magnitudes.
 */
export function formatFixed(v: number, decimals: number): string {
  if (v !== v) return '';
  if (decimals === 0) {
    const r = Math.round(Math.abs(v));
    return r === 0 ? '0' : (v < 0 ? '-' : '') + r;
  }
  const scale = 10 ** decimals;
  const n = Math.round(Math.abs(v) * scale);
  if (n === 0) return (0).toFixed(decimals);
  const int = Math.floor(n / scale);
  const frac = n - int * scale;
  return (v < 0 ? '-' : '') + int + '.' + String(scale + frac).slice(1);
}

function clean(text: string): string {
  return text.replace(/[\r\n]+/g, ' ').trim();
}

const MINUS = 45;
const DOT = 46;
const ZERO = 48;
const COMMA = 44;
const NEWLINE = 10;
/** Widest number we print: sign, 16 digits, point. */
const MAX_CELL = 20;

/** Writes v as fixed-point ASCII into buf at pos (same text as formatFixed); returns the new pos. */
function writeFixed(
  buf: Uint8Array,
  pos: number,
  v: number,
  decimals: number,
  scale: number,
  digits: Uint8Array,
): number {
  if (v !== v) return pos;
  let n = Math.round(Math.abs(v) * scale);
  if (!(n < 1e16)) throw new RangeError(`value ${v} is too large for a CSV cell`);
  if (n !== 0 && v < 0) buf[pos++] = MINUS;
  let len = 0;
  do {
    const digit = n % 10;
    digits[len++] = digit;
    n = (n - digit) / 10;
  } while (n > 0 || len <= decimals);
  for (let k = len - 1; k >= 0; k--) {
    if (k === decimals - 1) buf[pos++] = DOT;
    buf[pos++] = ZERO + digits[k]!;
  }
  return pos;
}

function headerText(
  log: ParsedLog,
  options: CsvOptions,
  formats: { unit: string | null }[],
): string {
  const metadata = { ...log.metadata, ...options.metadata };
  let head = '';
  for (const [key, value] of Object.entries(metadata)) {
    const k = clean(key).replace(/:/g, ' ');
    if (k) head += `# ${k}: ${clean(value)}\n`;
  }
  const units = options.units ?? true;
  head +=
    log.channels
      .map((c, i) => (units && formats[i]!.unit ? `${c} [${formats[i]!.unit}]` : c))
      .join(',') + '\n';
  return head;
}

function asciiBytes(text: string): Uint8Array {
  const out = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    // Metadata is free text: anything outside ASCII becomes '?', so byte count = character count.
    out[i] = c < 128 ? c : 63;
  }
  return out;
}

/**
 * The log as canonical CSV bytes (ASCII) in chunks: metadata and header first, then
 * `chunkRows` rows at a time. Each yielded array is fresh; the caller may keep it.
 */
export function* writeCanonicalCsvBytes(
  log: ParsedLog,
  options: CsvOptions = {},
): Generator<Uint8Array> {
  const channels = log.channels;
  const cols = channels.map((c) => {
    const col = log.columns[c];
    if (!col) throw new RangeError(`channel "${c}" has no column`);
    if (col.length < log.rows)
      throw new RangeError(`column "${c}" is shorter than ${log.rows} rows`);
    return col;
  });
  const formats = channels.map(formatOf);
  yield asciiBytes(headerText(log, options, formats));

  const chunkRows = Math.max(1, Math.floor(options.chunkRows ?? 4096));
  const decimals = Int32Array.from(formats, (f) => f.decimals);
  const scales = Float64Array.from(formats, (f) => 10 ** f.decimals);
  const width = cols.length;
  const buf = new Uint8Array(chunkRows * width * (MAX_CELL + 1) + 1);
  const digits = new Uint8Array(24);
  for (let start = 0; start < log.rows; start += chunkRows) {
    const end = Math.min(log.rows, start + chunkRows);
    let pos = 0;
    for (let r = start; r < end; r++) {
      for (let c = 0; c < width; c++) {
        if (c > 0) buf[pos++] = COMMA;
        pos = writeFixed(buf, pos, cols[c]![r]!, decimals[c]!, scales[c]!, digits);
      }
      buf[pos++] = NEWLINE;
    }
    yield buf.slice(0, pos);
  }
}

/**
 * The log as canonical CSV text in chunks (shared/log/FORMAT.md: `# key: value` metadata, then
 * `channel [unit]` headers, then rows), so a 150 MB file never has to exist as one string.
 * Lines end in '\n'.
 */
export function* writeCanonicalCsv(log: ParsedLog, options: CsvOptions = {}): Generator<string> {
  for (const bytes of writeCanonicalCsvBytes(log, options)) {
    let text = '';
    for (let i = 0; i < bytes.length; i += 8192) {
      text += String.fromCharCode.apply(null, bytes.subarray(i, i + 8192) as unknown as number[]);
    }
    yield text;
  }
}
