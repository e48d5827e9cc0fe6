import { describe, expect, it } from 'vitest';
import { whyNotAnalysable } from '../../../shared/log/analysable';
import { parseLog } from '../../../shared/log/parse';
import { enc } from './helpers';

const rows = (times: number[]) => times.map((t) => `${t},0.5,0.5`).join('\n');

describe('whyNotAnalysable', () => {
  it('passes a log with a forward-moving time', () => {
    const log = parseLog(enc(`time,motor1,motor2\n${rows([0, 0.01, 0.02])}\n`));
    expect(whyNotAnalysable(log)).toBeNull();
  });

  it('refuses one sample, naming its line (metadata and header lines count)', () => {
    const log = parseLog(enc(`# aircraft: Heron\ntime,motor1,motor2\n${rows([0])}\n`));
    expect(log.rows).toBe(1); // the reader itself keeps it
    const e = whyNotAnalysable(log)!;
    expect(e.code).toBe('too-few-samples');
    expect(e.line).toBe(3);
    expect(e.message).toMatch(/^Line 3: the log holds one sample/);
  });

  it('refuses a time that stands still, naming the time column', () => {
    const log = parseLog(
      enc(`motor1,time,motor2\n${[1, 2, 3].map(() => '0.5,4,0.5').join('\n')}\n`),
    );
    const e = whyNotAnalysable(log)!;
    expect(e.code).toBe('time-stalled');
    expect(e).toMatchObject({ line: 2, column: 2, header: 'time' });
    expect(e.message).toMatch(/time reads 4 s on every sample from line 2 to line 4/);
  });

  it('refuses a time that mostly runs backwards, naming where it starts and ends', () => {
    const log = parseLog(enc(`time,motor1,motor2\n${rows([0.3, 0.2, 0.1, 0.2])}\n`));
    const e = whyNotAnalysable(log)!;
    expect(e.code).toBe('time-stalled');
    expect(e.message).toMatch(/0\.3 s at line 2, 0\.2 s at line 5/);
  });

  it('keeps a log whose time stalls only now and then (the reader warns about those steps)', () => {
    const log = parseLog(enc(`time,motor1,motor2\n${rows([0, 0.01, 0.01, 0.02, 0.03])}\n`));
    expect(whyNotAnalysable(log)).toBeNull();
    expect(log.warnings.map((w) => w.code)).toContain('time-not-increasing');
  });
});
