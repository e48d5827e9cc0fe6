import type { Remote } from 'comlink';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseLog } from '../../shared/log/parse';
import type { SampleApi } from '../../workers/protocol';
import { loadWorker } from './harness';

let api: Remote<SampleApi>;
let close: () => void;

beforeAll(async () => {
  ({ api, close } = await loadWorker<SampleApi>(() => import('../../workers/sample.worker')));
});

afterAll(() => close());

describe('sample worker', () => {
  it('writes a minute of the demo quad as a canonical CSV the reader takes without a map', async () => {
    const { csv, fileName } = await api.sampleFlight();
    expect(fileName).toBe('sample-weak-motor.csv');
    const log = parseLog(new Uint8Array(await csv.arrayBuffer()));
    // A minute at 1 kHz, both ends included.
    const time = log.columns.time!;
    expect(time[time.length - 1]! - time[0]!).toBeCloseTo(60, 3);
    expect(log.rows).toBe(60_001);
    expect(log.metadata['scenario']).toBe('weak-motor');
    expect(['motor1', 'motor2', 'motor3', 'motor4'].every((m) => m in log.columns)).toBe(true);
  });

  it('refuses a scenario it does not know, by name', async () => {
    await expect(api.sampleFlight('no-such-flight')).rejects.toThrow(/no-such-flight/);
  });
});
