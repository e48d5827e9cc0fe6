import type { Remote } from 'comlink';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AnalysisApi, LogDelivery } from '../../workers/protocol';
import { DETAIL_PARTS, STRIP_POINTS, type DetailParts } from '../../shared/analysis/review-detail';
import { scenarios } from '../../shared/sim/scenarios';
import { simulate } from '../../shared/sim/simulate';
import { handoffPorts, loadWorker } from './harness';

/**
 * The analysis worker's side of the hand-off over real MessageChannels: the test plays the
 * parse worker, posting one LogDelivery on the port the analysis worker listens on.
 */
let analysis: Remote<AnalysisApi>;
let close: () => void;

beforeAll(async () => {
  ({ api: analysis, close } = await loadWorker<AnalysisApi>(
    () => import('../../workers/analysis.worker'),
  ));
});

afterAll(() => close());

/** The analysis worker listens on `port`; `send` plays the parse worker's one delivery. */
function handoff(delivery: LogDelivery) {
  const ports = handoffPorts();
  return { port: ports.port, send: () => ports.send(delivery) };
}

const kite = (seconds: number) =>
  simulate(scenarios['weak-motor']!, { seconds, rateHz: 1000, seed: 3 }).log;

describe('analysis worker handoff', () => {
  it('analyses a delivered log, thins the strip in the worker and hands the bulk over part by part', async () => {
    const log = kite(20);
    const rows = log.rows;
    const { port, send } = handoff({ ok: true, log });
    const analysed = analysis.analyzeDelivered('flight-a', port);
    send();
    const { report, head } = await analysed;
    expect(report.rows).toBe(rows);
    expect(head.strip).toBeDefined();
    expect(head.strip!.t.length).toBe(STRIP_POINTS);
    expect(Object.keys(head.strip!.series).sort()).toEqual(['collective', 'throttle']);
    for (const key of DETAIL_PARTS) expect(key in head).toBe(false);

    const parts = {};
    for (const key of DETAIL_PARTS) {
      const part = await analysis.detailPart('flight-a', key);
      expect(Object.keys(part)).toEqual([key]);
      Object.assign(parts, part);
    }
    const detail = { ...head, ...(parts as DetailParts) };
    expect(detail.effort.t.length).toBeGreaterThan(STRIP_POINTS);
    expect(Object.keys(detail.spectra)).toContain('gyro_x');
    // Each part is handed over once.
    await expect(analysis.detailPart('flight-a', 'effort')).rejects.toMatchObject({
      name: 'FlightNotLoadedError',
    });

    // The log stayed in the worker: the filter bench runs on it without a resend.
    const bench = await analysis.filterBench('flight-a', 'gyro_x', [{ kind: 'lowpass1', hz: 100 }]);
    expect(bench.after.hz.length).toBeGreaterThan(0);
  });

  it('rejects with a named error when word comes that no log is coming', async () => {
    const { port, send } = handoff({ ok: false });
    const analysed = analysis.analyzeDelivered('flight-b', port);
    send();
    await expect(analysed).rejects.toMatchObject({ name: 'LogNotDeliveredError' });
  });

  it('keeps a re-read log for the filter bench without analysing it again', async () => {
    await expect(
      analysis.filterBench('flight-c', 'gyro_y', [{ kind: 'notch', hz: 200 }]),
    ).rejects.toMatchObject({ name: 'FlightNotLoadedError' });
    const { port, send } = handoff({ ok: true, log: kite(10) });
    const loaded = analysis.loadDelivered('flight-c', port);
    send();
    await loaded;
    const bench = await analysis.filterBench('flight-c', 'gyro_y', [{ kind: 'notch', hz: 200 }]);
    expect(bench.response.hz.length).toBeGreaterThan(0);
  });

  it('thins an older flight’s effort trace for the strip on request', async () => {
    const t = Array.from({ length: 4000 }, (_, i) => i / 20);
    const strip = await analysis.strip({
      t,
      series: { throttle: t.map((v) => Math.abs(Math.sin(v))) },
    });
    expect(strip.t.length).toBe(STRIP_POINTS);
    expect(strip.series.throttle!.length).toBe(STRIP_POINTS);
  });
});
