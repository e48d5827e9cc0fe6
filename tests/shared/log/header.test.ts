import { describe, expect, it } from 'vitest';
import { inspectHeader } from '../../../shared/log/header';
import { enc, formatError } from './helpers';

describe('inspectHeader', () => {
  it('previews a canonical file: delimiter, headers, metadata and sample rows', () => {
    const p = inspectHeader(
      enc(
        '\ufeff# aircraft: Kite\n# battery: 6S 1300\ntime;motor1;"gyro_x [rad/s]"\n0;0,4;1\n0,001;0,41;2\n0,002;0,4',
      ),
    );
    expect(p.delimiter).toBe(';');
    expect(p.headers).toEqual(['time', 'motor1', 'gyro_x [rad/s]']);
    expect(p.metadata).toEqual({ aircraft: 'Kite', battery: '6S 1300' });
    expect(p.headerLine).toBe(3);
    expect(p.canonical).toBe(true);
    // The unfinished last line of the first bytes is not a sample.
    expect(p.sampleRows).toEqual([
      ['0', '0,4', '1'],
      ['0,001', '0,41', '2'],
    ]);
    expect(p.proposal.missing).toEqual([]);
  });

  it('marks foreign headers and proposes a map for them', () => {
    const p = inspectHeader(enc('Time (s)\tMotor 1\tFlight Mode\r\n0\t1500\tACRO\r\n'));
    expect(p.delimiter).toBe('\t');
    expect(p.canonical).toBe(false);
    expect(p.proposal.entries.map((e) => e.channel)).toEqual(['time', 'motor1', null]);
    expect(p.sampleRows).toEqual([['0', '1500', 'ACRO']]);
  });

  it('stops at ten sample rows', () => {
    let s = 'time,motor1\n';
    for (let i = 0; i < 50; i++) s += `${i},0.5\n`;
    expect(inspectHeader(enc(s)).sampleRows).toHaveLength(10);
  });

  it('names the problem when there is no header', () => {
    expect(formatError(() => inspectHeader(enc(''))).code).toBe('empty-file');
    expect(formatError(() => inspectHeader(enc('# only: metadata\n'))).code).toBe('no-header');
    expect(formatError(() => inspectHeader(new Uint8Array([0x1f, 0x8b, 8, 0]))).code).toBe(
      'gzip-needs-stream',
    );
  });
});
