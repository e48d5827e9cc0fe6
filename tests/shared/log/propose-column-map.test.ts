import { describe, expect, it } from 'vitest';
import { proposalToColumnMap } from '../../../shared/log/column-map';
import { parseLog } from '../../../shared/log/parse';
import { proposeColumnMap } from '../../../shared/log/propose-column-map';
import { enc } from './helpers';

describe('proposeColumnMap', () => {
  it('proposes channels and units from the words in foreign headers, with reasons', () => {
    const p = proposeColumnMap([
      'Timestamp [us]',
      'Motor 0',
      'Motor 1',
      'Motor 2',
      'Motor 3',
      'GyroX (rad/s)',
      'gyro pitch',
      'Accel Z [m/s^2]',
      'Roll Setpoint',
      'Throttle %',
      'Battery Voltage (mV)',
      'Current',
      'ESC 1 current',
      'eRPM 1',
      'Flight Mode',
    ]);
    const by = Object.fromEntries(p.entries.map((e) => [e.header, e]));
    expect(by['Timestamp [us]']).toMatchObject({ channel: 'time', unit: 'us' });
    // Numbered from 0 in the file, so every motor moves up by one.
    expect(['Motor 0', 'Motor 1', 'Motor 2', 'Motor 3'].map((h) => by[h]!.channel)).toEqual([
      'motor1',
      'motor2',
      'motor3',
      'motor4',
    ]);
    expect(by['Motor 0']!.reason).toMatch(/numbered from 0/);
    expect(by['GyroX (rad/s)']).toMatchObject({ channel: 'gyro_x', unit: 'rad/s' });
    expect(by['gyro pitch']).toMatchObject({ channel: 'gyro_y', unit: null });
    expect(by['gyro pitch']!.reason).toMatch(/no unit/);
    expect(by['Accel Z [m/s^2]']).toMatchObject({ channel: 'acc_z', unit: 'm/s2' });
    expect(by['Roll Setpoint']).toMatchObject({ channel: 'sp_roll' });
    expect(by['Throttle %']!.channel).toBe('throttle');
    expect(by['Battery Voltage (mV)']).toMatchObject({ channel: 'vbat', unit: 'mV' });
    expect(by['Current']!.channel).toBe('ibat');
    expect(by['ESC 1 current']!.channel).toBe('imotor1');
    expect(by['eRPM 1']).toMatchObject({ channel: 'rpm1', unit: 'erpm' });
    expect(by['Flight Mode']).toMatchObject({ channel: null, unit: null });
    expect(p.missing).toEqual([]);
  });

  it.each([
    ['Motor', 'motor'],
    ['rpm', 'rpm'],
    ['RPM', 'rpm'],
    ['imotor', 'imotor'],
  ])(
    'shifts a whole set numbered from 0 (%s0…), even headers that read like our own names',
    (stem, family) => {
      const headers = [0, 1, 2, 3].map((n) => `${stem}${n}`);
      const p = proposeColumnMap(['time', ...headers]);
      expect(p.entries.slice(1).map((e) => [e.header, e.channel])).toEqual(
        headers.map((h, k) => [h, `${family}${k + 1}`]),
      );
      for (const e of p.entries.slice(1)) expect(e.reason).toMatch(/numbered from 0/);
    },
  );

  it('keeps our own motor numbers when an unrelated column is numbered from 0', () => {
    const p = proposeColumnMap(['time', 'motor1', 'motor2', 'motor3', 'motor4', 'ESC0 temp']);
    expect(p.entries.map((e) => e.channel)).toEqual([
      'time',
      'motor1',
      'motor2',
      'motor3',
      'motor4',
      null,
    ]);
    expect(p.entries[1]!.reason).toBe('our own channel name');
    expect(p.entries[5]!.reason).toMatch(/already taken by "motor1"/);
  });

  it('never proposes one channel twice and lists what is still missing', () => {
    const p = proposeColumnMap(['gyro x', 'rate x', 'voltage']);
    expect(p.entries[0]!.channel).toBe('gyro_x');
    expect(p.entries[1]).toMatchObject({ channel: null });
    expect(p.entries[1]!.reason).toMatch(/already taken/);
    expect(p.missing).toEqual(['time', 'motor1']);
  });

  it('only proposes: the reader still needs the map handed to it', () => {
    const text = 'Timestamp [ms],Motor 1 (%)\n0,50\n10,55\n';
    expect(() => parseLog(enc(text))).toThrow(/column map/);
    const map = proposalToColumnMap(proposeColumnMap(['Timestamp [ms]', 'Motor 1 (%)']));
    expect(map).toEqual({
      columns: {
        'Timestamp [ms]': { channel: 'time', unit: 'ms' },
        'Motor 1 (%)': { channel: 'motor1', unit: '%' },
      },
    });
    const log = parseLog(enc(text), { columnMap: map });
    expect(Array.from(log.columns.motor1!)).toEqual([0.5, 0.55].map(Math.fround));
  });
});

describe('units suggested by the first values', () => {
  it('fills in units the headers do not state, and says why', () => {
    const p = proposeColumnMap(
      ['Stamp', 'Motor 1', 'Motor 2', 'Thr', 'Battery'],
      [
        ['1000000', '1012', '48.5', '0.31', '16650'],
        ['1000250', '1498', '52', '0.35', '16640'],
        ['1000500', '1990', '55.5', '0.4', '16620'],
      ],
    );
    expect(p.entries.map((e) => e.unit)).toEqual([null, 'us', '%', 'frac', 'mV']);
    expect(p.entries[1]!.reason).toMatch(/1012…1990 look like a 1000–2000 µs pulse: check it/);
    // "Stamp" is not a time word, so it gets no channel and no unit.
    expect(p.entries[0]!.channel).toBeNull();
    const t = proposeColumnMap(['elapsed'], [['0'], ['4'], ['8']]);
    expect(t.entries[0]).toMatchObject({ channel: 'time', unit: 'ms' });
  });

  it('leaves the unit open when values say nothing', () => {
    const p = proposeColumnMap(
      ['gyro x', 'Motor 1'],
      [
        ['12.5', '-3'],
        ['13', '4000'],
      ],
    );
    expect(p.entries.map((e) => e.unit)).toEqual([null, null]);
  });
});

describe('indexed headers and units from values', () => {
  it('reads name[0]-style headers as a set numbered from 0', () => {
    const p = proposeColumnMap(
      [
        'time',
        'esc_out[0]',
        'esc_out[1]',
        'esc_out[2]',
        'esc_out[3]',
        'rpm[0] [erpm]',
        'rpm[1] [erpm]',
      ],
      [
        ['0', '1000', '1100', '1200', '1300', '7000', '7100'],
        ['0.001', '1010', '1110', '1210', '1310', '7000', '7100'],
      ],
    );
    expect(p.entries.map((e) => e.channel)).toEqual([
      'time',
      'motor1',
      'motor2',
      'motor3',
      'motor4',
      'rpm1',
      'rpm2',
    ]);
    expect(p.entries.map((e) => e.unit)).toEqual(['s', 'us', 'us', 'us', 'us', 'erpm', 'erpm']);
    expect(p.entries[1]!.reason).toMatch(/numbered from 0 in the file/);
    expect(p.missing).toEqual([]);
  });

  it('proposes the digital command range and carries it into the column map', () => {
    const p = proposeColumnMap(
      ['t_ms', 'out1'],
      [
        ['0', '48'],
        ['2', '1400'],
        ['4', '2047'],
      ],
    );
    expect(p.entries[1]).toMatchObject({ channel: 'motor1', unit: 'raw', min: 48, max: 2047 });
    expect(proposalToColumnMap(p).columns.out1).toEqual({
      channel: 'motor1',
      unit: 'raw',
      min: 48,
      max: 2047,
    });
  });

  it('gives the accelerometer axes the unit its vertical axis shows at rest (±9.8 → m/s²)', () => {
    const p = proposeColumnMap(
      ['time', 'motor1', 'accX', 'accY', 'accZ'],
      [
        ['0', '0.1', '0.12', '-0.05', '-9.79'],
        ['0.001', '0.1', '0.08', '-0.02', '-9.83'],
      ],
    );
    expect(p.entries.slice(2).map((e) => e.unit)).toEqual(['m/s2', 'm/s2', 'm/s2']);
    expect(p.entries[2]!.reason).toMatch(/same unit as acc_z/);
  });

  it('reads a decimal comma in the first rows when semicolons delimit', () => {
    const p = proposeColumnMap(
      ['elapsed', 'Thr'],
      [
        ['0,000', '0,31'],
        ['0,004', '0,35'],
      ],
      ';',
    );
    expect(p.entries.map((e) => e.unit)).toEqual(['s', 'frac']);
  });
});
