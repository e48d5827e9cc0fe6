import { describe, expect, it } from 'vitest';
import { LogFormatError } from '../../../shared/log/errors';
import { parseLog } from '../../../shared/log/parse';
import { LogReader } from '../../../shared/log/reader';
import { enc, formatError } from './helpers';

const parse = (s: string, options = {}) => parseLog(enc(s), options);
const values = (c: Float32Array | Float64Array | undefined) => Array.from(c ?? []);

describe('canonical header', () => {
  it('reads a small Kite log into typed columns in canonical units', () => {
    const log = parse(
      '# aircraft: Kite\n# pilot note: gusty\ntime [ms],motor1 [%],motor2,gyro_x [rad/s],acc_z [m/s2]\n' +
        '0,40,0.4,0,-9.80665\n1,41,0.41,3.141592653589793,-9.80665\n2,42,0.42,0,-9.80665\n',
    );
    expect(log.channels).toEqual(['time', 'motor1', 'motor2', 'gyro_x', 'acc_z']);
    expect(log.columns.time).toBeInstanceOf(Float64Array);
    expect(log.columns.motor1).toBeInstanceOf(Float32Array);
    expect(values(log.columns.time)).toEqual([0, 0.001, 0.002]);
    expect(values(log.columns.motor1)).toEqual([0.4, 0.41, 0.42].map(Math.fround));
    expect(log.columns.gyro_x![1]).toBeCloseTo(180, 4);
    expect(values(log.columns.acc_z)).toEqual([-1, -1, -1]);
    expect(log.rows).toBe(3);
    expect(log.sampleRateHz).toBeCloseTo(1000, 9);
    expect(log.durationS).toBeCloseTo(0.002, 12);
    expect(log.metadata).toEqual({ aircraft: 'Kite', 'pilot note': 'gusty' });
    expect(log.headerLine).toBe(3);
    expect(log.sourceUnits).toMatchObject({ time: 'ms', motor1: '%', motor2: 'frac' });
    expect(log.warnings).toEqual([]);
  });

  it.each([
    ['comma', ','],
    ['semicolon', ';'],
    ['tab', '\t'],
  ])('detects the %s delimiter', (_name, d) => {
    const log = parse(
      ['time', 'motor1', 'motor2'].join(d) +
        '\n' +
        ['0', '0.5', '0.6'].join(d) +
        '\n' +
        ['0.01', '0.7', '0.8'].join(d),
    );
    expect(log.delimiter).toBe(d);
    expect(values(log.columns.motor2)).toEqual([0.6, 0.8].map(Math.fround));
  });

  it('accepts a BOM, CRLF line endings and quoted header cells', () => {
    const log = parse(
      '\ufeff# site: club field\r\n"time","motor1 [%]", "gyro_z"\r\n0,10,1\r\n0.5,20,2\r\n',
    );
    expect(log.channels).toEqual(['time', 'motor1', 'gyro_z']);
    expect(log.metadata).toEqual({ site: 'club field' });
    expect(values(log.columns.motor1)).toEqual([0.1, 0.2].map(Math.fround));
    expect(log.headerLine).toBe(2);
  });

  it('reads a decimal comma when the delimiter is a semicolon', () => {
    const log = parse('time;motor1;vbat [mV]\n0;0,25;16800\n0,002;0,5;16750,5\n');
    expect(values(log.columns.time)).toEqual([0, 0.002]);
    expect(values(log.columns.motor1)).toEqual([0.25, 0.5]);
    expect(values(log.columns.vbat)).toEqual([16.8, 16.7505].map(Math.fround));
  });

  it('tolerates a trailing delimiter on every line', () => {
    const log = parse('time,motor1,\n0,0.5,\n1,0.6\n2,0.7,\n');
    expect(log.channels).toEqual(['time', 'motor1']);
    expect(log.rows).toBe(3);
  });
});

describe('numbers', () => {
  it('reads signs, exponents, NaN and inf spellings, spaces and quotes', () => {
    const log = parse(
      'time,motor1,gyro_x\n' +
        '0,1e-1,-0\n1,+0.5,1.5E2\n2,NaN,-inf\n3,nan,Infinity\n4, 0.25 ,"7"\n5,.5,-.5e+1\n',
    );
    const g = values(log.columns.gyro_x);
    expect(Object.is(g[0], -0)).toBe(true);
    expect(g.slice(1)).toEqual([150, -Infinity, Infinity, 7, -5]);
    const m = values(log.columns.motor1);
    expect(m[0]).toBe(Math.fround(0.1));
    expect(m[1]).toBe(0.5);
    expect(Number.isNaN(m[2])).toBe(true);
    expect(Number.isNaN(m[3])).toBe(true);
    expect(m[4]).toBe(0.25);
    expect(m[5]).toBe(0.5);
    expect(log.emptyCells).toEqual({});
  });

  it('reads long mantissas exactly as JavaScript does', () => {
    const log = parse('time,motor1\n123456.78901234567891,0.1\n123456.78901234567892,0.2\n');
    expect(log.timeStartS).toBe(Number('123456.78901234567891'));
  });

  it('reads empty cells as NaN and counts them per column with the first line', () => {
    const log = parse('time,motor1,motor2\n0,,0.5\n1,0.2,\n2,,0.7\n');
    expect(log.emptyCells).toEqual({ motor1: 2, motor2: 1 });
    const w = log.warnings.filter((x) => x.code === 'empty-cells');
    expect(w.map((x) => x.line)).toEqual([2, 3]);
    expect(w[0]!.message).toMatch(/motor1.*2 empty cells.*line 2/);
  });
});

describe('errors name the line and column', () => {
  it('rejects text in a numeric column mid-file, naming line, column and header', () => {
    const err = formatError(() =>
      parse('# a: b\ntime,motor1,gyro_x\n0,0.5,1\n1,0.5,fast\n2,0.5,3\n'),
    );
    expect(err).toBeInstanceOf(LogFormatError);
    expect(err.name).toBe('LogFormatError');
    expect(err.code).toBe('bad-number');
    expect(err.line).toBe(4);
    expect(err.column).toBe(3);
    expect(err.header).toBe('gyro_x');
    expect(err.message).toMatch(/^Line 4, column 3 \(gyro_x\): expected a number.*found "fast"/);
  });

  it('rejects a row with too many or too few values in the middle of the file', () => {
    const long = formatError(() => parse('time,motor1\n0,0.5\n1,0.5,9\n2,0.5\n'));
    expect(long.code).toBe('ragged-row');
    expect(long.line).toBe(3);
    expect(long.message).toMatch(/Line 3 has 3 values but the header has 2 columns/);
    const short = formatError(() => parse('time,motor1,motor2\n0,0.5,0.5\n1,0.5\n2,0.5,0.5\n'));
    expect(short.code).toBe('ragged-row');
    expect(short.line).toBe(3);
  });

  it('rejects a quote that never closes', () => {
    const err = formatError(() => parse('time,motor1\n0,"0.5\n1,0.5\n'));
    expect(err.code).toBe('stray-quote');
    expect(err.line).toBe(2);
    expect(err.column).toBe(2);
  });

  it('rejects a channel written twice', () => {
    const err = formatError(() => parse('time,motor1,gyro_x,motor1 [%]\n0,0.5,1,50\n'));
    expect(err.code).toBe('duplicate-channel');
    expect(err.line).toBe(1);
    expect(err.column).toBe(4);
    expect(err.message).toMatch(/motor1 appears twice.*column 2/);
  });

  it('rejects a log without time or without motor1', () => {
    expect(formatError(() => parse('motor1,motor2\n0.5,0.5\n')).message).toMatch(/no time column/);
    const noMotor = formatError(() => parse('# k: v\ntime,gyro_x\n0,1\n'));
    expect(noMotor.code).toBe('missing-channel');
    expect(noMotor.line).toBe(2);
    expect(noMotor.message).toMatch(/motor1/);
  });

  it('rejects motor columns with a hole in the numbering', () => {
    const err = formatError(() => parse('time,motor1,motor2,motor4\n0,1,1,1\n'));
    expect(err.code).toBe('missing-channel');
    expect(err.message).toMatch(/motor3 is missing/);
  });

  it('rejects a unit the channel does not accept', () => {
    const err = formatError(() => parse('time,motor1,gyro_x [g]\n0,1,1\n'));
    expect(err.code).toBe('unknown-unit');
    expect(err.column).toBe(3);
    expect(err.message).toMatch(/deg\/s, rad\/s/);
  });

  it('asks for the pole count before reading erpm', () => {
    const text = 'time,motor1,rpm1 [erpm]\n0,0.5,70000\n';
    expect(formatError(() => parse(text)).code).toBe('needs-poles');
    expect(parse(text, { poles: 14 }).columns.rpm1![0]).toBe(10000);
  });

  it('rejects an empty file, a header with no samples, and a metadata-only file', () => {
    const empty = formatError(() => parse(''));
    expect(empty.code).toBe('empty-file');
    expect(empty.line).toBe(1);
    const headerOnly = formatError(() => parse('time,motor1\n'));
    expect(headerOnly.code).toBe('no-rows');
    expect(headerOnly.line).toBe(1);
    expect(formatError(() => parse('# aircraft: Heron\n# date: 2026-05-01\n')).code).toBe(
      'no-header',
    );
  });

  it('rejects a missing time value', () => {
    const err = formatError(() => parse('time,motor1\n0,0.5\n,0.5\n2,0.5\n'));
    expect(err.code).toBe('missing-time');
    expect(err.line).toBe(3);
    expect(err.column).toBe(1);
  });

  it('rejects UTF-16 text with advice', () => {
    const utf16 = new Uint8Array([0xff, 0xfe, 0x74, 0, 0x69, 0]);
    const err = formatError(() => parseLog(utf16));
    expect(err.code).toBe('unsupported-encoding');
    expect(err.message).toMatch(/UTF-8/);
  });
});

describe('a log cut short', () => {
  it('drops a final line with missing values and says so', () => {
    const log = parse('time,motor1,motor2\n0,0.5,0.5\n0.1,0.6,0.6\n0.2,0.7');
    expect(log.rows).toBe(2);
    const w = log.warnings.find((x) => x.code === 'truncated-line');
    expect(w?.line).toBe(4);
    expect(w?.message).toMatch(/cut short.*left out/);
  });

  it('drops a final line whose last number was cut mid-write', () => {
    const log = parse('time,motor1,gyro_x\n0,0.5,1\n0.1,0.6,1.5e');
    expect(log.rows).toBe(1);
    expect(log.warnings.map((w) => w.code)).toContain('truncated-line');
  });

  it('also drops a short last line followed by a line ending or blank lines', () => {
    const log = parse('time,motor1,motor2\n0,0.5,0.5\n0.1,0.6\n\n');
    expect(log.rows).toBe(1);
    expect(log.warnings.find((w) => w.code === 'truncated-line')?.line).toBe(3);
  });

  it('drops the zero bytes a memory card leaves after a power cut', () => {
    const bytes = new Uint8Array([
      ...enc('time,motor1\n0,0.5\n0.1,0.6\n'),
      ...new Uint8Array(4096),
    ]);
    const log = parseLog(bytes);
    expect(log.rows).toBe(2);
    const w = log.warnings.find((x) => x.code === 'truncated-line');
    expect(w?.line).toBe(4);
    expect(w?.message.includes('\u0000')).toBe(false);
  });

  it('keeps a complete last line without a line ending', () => {
    const log = parse('time,motor1\n0,0.5\n0.1,0.75');
    expect(log.rows).toBe(2);
    expect(log.columns.motor1![1]).toBe(0.75);
    expect(log.warnings).toEqual([]);
  });
});

describe('lines among the samples', () => {
  it('skips blank and # lines, reporting them, and keeps line numbers true', () => {
    const log = parse('time,motor1\n0,0.5\n\n# pause\n0.001,0.5\n0.002,0.5\n');
    expect(log.rows).toBe(3);
    expect(log.warnings.map((w) => w.code).sort()).toEqual(['blank-lines', 'comment-lines']);
    expect(log.warnings.find((w) => w.code === 'comment-lines')?.line).toBe(4);
    const err = formatError(() => parse('time,motor1\n0,0.5\n\n# pause\n1,0.5\n2,x\n3,0.5\n'));
    expect(err.line).toBe(6);
  });
});

describe('column maps', () => {
  const foreign =
    'Time (ms),Motor A,Motor B,Gyro Roll,Pack V,Flight Mode\n0,1000,2000,1,16.8,"ANGLE, LEVEL"\n4,1500,1500,2,16.7,ACRO\n';

  it('asks for a column map, with a proposal, when headers are not ours', () => {
    const err = formatError(() => parse(foreign));
    expect(err.code).toBe('needs-column-map');
    expect(err.line).toBe(1);
    // "Time (ms)" is our time channel in another case, with its unit in parentheses.
    expect(err.column).toBe(2);
    expect(err.header).toBe('Motor A');
    expect(err.message).toMatch(/5 headers are not our channel names/);
    expect(err.headers).toEqual([
      'Time (ms)',
      'Motor A',
      'Motor B',
      'Gyro Roll',
      'Pack V',
      'Flight Mode',
    ]);
    expect(err.proposal?.entries[0]).toMatchObject({ channel: 'time', unit: 'ms' });
    expect(err.proposal?.entries[3]).toMatchObject({ channel: 'gyro_x' });
  });

  it('applies a confirmed map, converting units and skipping unmapped columns with a warning', () => {
    const log = parse(foreign, {
      columnMap: {
        columns: {
          'Time (ms)': { channel: 'time', unit: 'ms' },
          'Motor A': { channel: 'motor1', unit: 'us' },
          'Motor B': { channel: 'motor2', min: 1000, max: 2000 },
          'Gyro Roll': { channel: 'gyro_x', unit: 'deg/s', scale: 2, offset: -1 },
          'Pack V': { channel: 'vbat' },
        },
      },
    });
    expect(log.channels).toEqual(['time', 'motor1', 'motor2', 'gyro_x', 'vbat']);
    expect(values(log.columns.time)).toEqual([0, 0.004]);
    expect(values(log.columns.motor1)).toEqual([0, 0.5]);
    expect(values(log.columns.motor2)).toEqual([1, 0.5]);
    expect(values(log.columns.gyro_x)).toEqual([1, 3]);
    expect(log.warnings.find((w) => w.code === 'skipped-columns')?.message).toMatch(/Flight Mode/);
  });

  it('skips quoted text in unmapped columns, escaped quotes and delimiters included', () => {
    const map = { columns: { t: { channel: 'time' }, m: { channel: 'motor1' } } };
    const log = parse('t,note,m\n0,"gusty, ""left"" side",0.5\n1, "calm" ,0.25\n', {
      columnMap: map,
    });
    expect(values(log.columns.motor1)).toEqual([0.5, 0.25]);
    const err = formatError(() => parse('t,note,m\n0,"gusty,0.5\n1,x,0.5\n', { columnMap: map }));
    expect(err.code).toBe('stray-quote');
    expect([err.line, err.column]).toEqual([2, 2]);
  });

  it('rejects a column map that does not fit the registry', () => {
    const err = formatError(() =>
      parse(foreign, {
        columnMap: { columns: { 'Motor A': { channel: 'motor9', unit: 'deg/s' } } },
      }),
    );
    expect(err.code).toBe('bad-column-map');
    const raw = formatError(() =>
      parse('time,Motor A\n0,5\n', {
        columnMap: { columns: { 'Motor A': { channel: 'motor1', unit: 'raw' } } },
      }),
    );
    expect(raw.code).toBe('bad-column-map');
    expect(raw.message).toMatch(/min/);
  });
});

describe('the streaming reader', () => {
  it('counts bytes and rows as chunks arrive', () => {
    const r = new LogReader();
    r.push(enc('time,motor1\n0,0.5\n1,'));
    expect(r.bytesRead).toBe(20);
    expect(r.rowsRead).toBe(1);
    r.push(enc('0.5\n'));
    expect(r.rowsRead).toBe(2);
    expect(r.finish().rows).toBe(2);
  });

  it('grows its columns past the first allocation and sizes them from a size hint', () => {
    const rows = 20000;
    let text = 'time,motor1\n';
    for (let i = 0; i < rows; i++) text += `${i / 1000},${(i % 100) / 100}\n`;
    for (const expectedBytes of [undefined, text.length, text.length / 3, text.length * 3]) {
      const log = parseLog(enc(text), { expectedBytes });
      expect(log.rows).toBe(rows);
      expect(log.columns.time![rows - 1]).toBe((rows - 1) / 1000);
      expect(log.columns.motor1![rows - 1]).toBe(Math.fround(0.99));
      expect(log.columns.motor1!.buffer.byteLength).toBeLessThanOrEqual(rows * 4 * (17 / 16));
    }
  });
});

describe('whitespace', () => {
  it('treats a line of spaces as blank, not as a row of empty cells', () => {
    const log = parseLog(enc('time,motor1\n0,0.5\n   \n0.001,0.5\n'));
    expect(log.rows).toBe(2);
    expect(log.warnings.map((w) => w.code)).toEqual(['blank-lines']);
  });
});

describe('names that are also JavaScript object keys', () => {
  it('keeps them as plain data in metadata and column maps', () => {
    const text =
      '# __proto__: polluted\n# constructor: x\ntime,motor1,constructor,toString\n0,0.5,1,2\n';
    const log = parseLog(enc(text), { columnMap: { columns: {} } });
    expect(log.metadata['__proto__']).toBe('polluted');
    expect(Object.keys(log.metadata)).toEqual(['__proto__', 'constructor']);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(log.channels).toEqual(['time', 'motor1']);
    expect(formatError(() => parseLog(enc(text))).code).toBe('needs-column-map');
  });
});
