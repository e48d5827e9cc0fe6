import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ColumnMap } from '../../../shared/log/column-map';
import { parseLog } from '../../../shared/log/parse';
import { enc } from './helpers';

/** The examples in shared/log/FORMAT.md must stay true. */
const doc = readFileSync(new URL('../../../shared/log/FORMAT.md', import.meta.url), 'utf8');
const block = (lang: string) => {
  const m = new RegExp('```' + lang + '\\n([\\s\\S]*?)```').exec(doc);
  if (!m) throw new Error(`no ${lang} block in FORMAT.md`);
  return m[1]!;
};

describe('FORMAT.md', () => {
  it('has a canonical example that imports cleanly', () => {
    const log = parseLog(enc(block('csv')));
    expect(log.channels).toEqual([
      'time',
      'motor1',
      'motor2',
      'motor3',
      'motor4',
      'gyro_x',
      'gyro_y',
      'gyro_z',
      'vbat',
      'ibat',
    ]);
    expect(log.rows).toBe(3);
    expect(log.sampleRateHz).toBeCloseTo(4000, 6);
    expect(log.metadata.aircraft).toBe('Heron');
    expect(log.columns.motor2![0]).toBeCloseTo(0.41, 6);
    expect(log.warnings).toEqual([]);
  });

  it('has a column map example that the shared schema accepts', () => {
    const map = ColumnMap.parse(JSON.parse(block('json')));
    expect(Object.keys(map.columns)).toHaveLength(5);
  });

  it('lists every error code the engine can raise', () => {
    const source = ['errors.ts']
      .map((f) => readFileSync(new URL(`../../../shared/log/${f}`, import.meta.url), 'utf8'))
      .join('');
    const codes = [...source.matchAll(/\| '([a-z-]+)'/g)].map((m) => m[1]!);
    expect(codes.length).toBeGreaterThan(10);
    for (const code of codes) expect(doc, code).toContain(`\`${code}\``);
  });
});
