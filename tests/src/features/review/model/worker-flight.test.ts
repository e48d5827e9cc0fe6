import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ColumnMap } from '../../../../../shared/log/column-map';
import type { ReadOptions } from '../../../../../shared/log/parse';
import type { ReviewFlight } from '../../../../../src/api/flights';
import { closeLocalDb, localDb, saveRereadMap } from '../../../../../src/lib/local-db';
import { defaultQuadX } from '../../../../../shared/airframe/presets';
import { sampleDetail, sampleFile, sampleReport } from '../../../helpers/flight-fixture';

/**
 * Which way the filter bench reads a kept raw log again. The workers are replaced by stand-ins
 * that answer like the real ones (a foreign header needs a map; any map covering it reads), and
 * the team's presets come from a stubbed network.
 */
const reads: ReadOptions[] = [];
let loaded = false;
const headers = ['Timestamp (s)', 'Out0'];
const covers = (map: ColumnMap | undefined) => !!map && headers.every((h) => h in map.columns);

vi.mock('../../../../../src/lib/log-pipeline/workers', () => ({
  parseWorker: () => ({
    parseInto: async (_job: string, _file: Blob, options: ReadOptions, port: MessagePort) => {
      reads.push(options);
      const ok = covers(options.columnMap);
      port.postMessage(ok ? { ok: true } : { ok: false });
      return ok
        ? { ok: true, summary: { rows: 2 } }
        : {
            ok: false,
            error: { code: 'needs-column-map', message: 'Unknown headers.', headers },
          };
    },
  }),
  analysisWorker: () => ({
    filterBench: async () => {
      if (!loaded) throw Object.assign(new Error('not loaded'), { name: 'FlightNotLoadedError' });
      return { bench: 'ran' };
    },
    loadDelivered: (_id: string, port: MessagePort) =>
      new Promise<void>((resolve, reject) => {
        port.onmessage = (e: MessageEvent<{ ok: boolean }>) => {
          port.close();
          if (e.data.ok) {
            loaded = true;
            resolve();
          } else reject(Object.assign(new Error('none'), { name: 'LogNotDeliveredError' }));
        };
      }),
  }),
}));

const { runFilterBench } = await import('../../../../../src/features/review/model/worker-flight');

const kiteMap: ColumnMap = {
  columns: {
    'Timestamp (s)': { channel: 'time', unit: 's' },
    Out0: { channel: 'motor1', unit: 'frac' },
  },
};

function flight(over: Partial<ReviewFlight> = {}): ReviewFlight {
  return {
    id: '00000000-0000-4000-8000-000000000031',
    source: 'server',
    fileName: 'kite-export.csv',
    report: sampleReport(),
    detail: sampleDetail(),
    teamId: '00000000-0000-4000-8000-0000000000aa',
    aircraftId: null,
    aircraftName: null,
    pilotId: null,
    recordedAt: null,
    file: sampleFile('Timestamp (s),Out0\n0,0.5\n'),
    readOptions: {},
    syncedToTeam: true,
    reviewState: null,
    ...over,
  };
}

function servePresets(presets: { columnMap: ColumnMap }[]) {
  const fetchMock = vi.fn(async () =>
    Response.json({
      presets: presets.map((p, i) => ({
        id: `00000000-0000-4000-8000-00000000010${i}`,
        teamId: '00000000-0000-4000-8000-0000000000aa',
        name: `Preset ${i}`,
        columnMap: p.columnMap,
        createdBy: { id: '00000000-0000-4000-8000-0000000000bb', name: 'Mara Quill' },
        createdAt: '2026-04-01T10:00:00.000Z',
        updatedAt: '2026-04-01T10:00:00.000Z',
        version: 1,
      })),
    }),
  );
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

beforeEach(async () => {
  reads.length = 0;
  loaded = false;
  await localDb().delete();
  await closeLocalDb();
});
afterEach(async () => {
  vi.unstubAllGlobals();
  await closeLocalDb();
});

describe('filter bench re-read', () => {
  it('reads a local flight again with the column map kept beside it', async () => {
    const fetchMock = servePresets([]);
    const f = flight({ source: 'local', readOptions: { columnMap: kiteMap, poles: 12 } });
    await expect(runFilterBench(f, defaultQuadX, 'gyro_x', [])).resolves.toEqual({ bench: 'ran' });
    expect(reads).toEqual([{ columnMap: kiteMap, poles: 12 }]);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('uses a map confirmed on this device for a team flight before asking the server', async () => {
    const fetchMock = servePresets([]);
    const f = flight({ id: '00000000-0000-4000-8000-000000000032' });
    await saveRereadMap(f.id, kiteMap);
    await runFilterBench(f, defaultQuadX, 'gyro_x', []);
    // The pole count comes from the airframe when the flight kept none.
    expect(reads).toEqual([{ columnMap: kiteMap, poles: defaultQuadX.poles }]);
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('falls back to the team preset that covers the headers', async () => {
    const partial: ColumnMap = { columns: { 'Timestamp (s)': { channel: 'time', unit: 's' } } };
    servePresets([{ columnMap: partial }, { columnMap: kiteMap }]);
    const f = flight({ id: '00000000-0000-4000-8000-000000000033' });
    await runFilterBench(f, defaultQuadX, 'gyro_x', []);
    const poles = defaultQuadX.poles;
    expect(reads).toEqual([{ poles }, { poles, columnMap: kiteMap }]);
  });

  it('says a column map is needed when nothing covers the headers', async () => {
    servePresets([]);
    const f = flight({ id: '00000000-0000-4000-8000-000000000034' });
    await expect(runFilterBench(f, defaultQuadX, 'gyro_x', [])).rejects.toMatchObject({
      name: 'NeedsColumnMapError',
    });
  });
});
