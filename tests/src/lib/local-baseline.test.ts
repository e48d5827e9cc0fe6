import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { driftSample } from '../../../shared/analysis/drift';
import { deviceBaselineFlights } from '../../../src/lib/local-baseline';
import {
  assignLocalFlight,
  closeLocalDb,
  localDb,
  saveLocalFlight,
} from '../../../src/lib/local-db';
import { sampleDetail, sampleFile, sampleReport } from '../helpers/flight-fixture';

const id = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;
const kite = id(8);
const osprey = id(9);

beforeEach(async () => {
  await localDb().delete();
  await closeLocalDb();
});
afterEach(closeLocalDb);

const base = { file: sampleFile(), detail: sampleDetail() };

describe('offline drift baseline', () => {
  it('gives each kept flight of the aircraft as a drift sample with its time', async () => {
    const heavy = sampleReport({ segments: { hoverS: 40, hover: [[2, 42]] } });
    await saveLocalFlight({
      ...base,
      id: id(1),
      fileName: 'a.csv',
      report: heavy,
      aircraftId: kite,
      recordedAt: '2026-11-30T09:00:00.000Z',
    });
    await saveLocalFlight({ ...base, id: id(2), fileName: 'b.csv', report: sampleReport() });
    await saveLocalFlight({
      ...base,
      id: id(3),
      fileName: 'c.csv',
      report: sampleReport(),
      aircraftId: osprey,
    });

    const flights = await deviceBaselineFlights(kite);
    expect(flights).toEqual([
      { flightId: id(1), recordedAt: '2026-11-30T09:00:00.000Z', sample: driftSample(heavy) },
    ]);

    // Filed under the aircraft later: it joins that aircraft's baseline, timed from its save.
    await assignLocalFlight(id(2), { teamId: id(7), aircraftId: kite });
    const after = await deviceBaselineFlights(kite);
    expect(after.map((f) => f.flightId).sort()).toEqual([id(1), id(2)]);
    const saved = (await localDb().flights.get(id(2)))!.savedAt;
    expect(after.find((f) => f.flightId === id(2))?.recordedAt).toBe(new Date(saved).toISOString());
  });

  it('never reads the flight records, which carry the traces and the raw log', async () => {
    await saveLocalFlight({
      ...base,
      id: id(1),
      fileName: 'a.csv',
      report: sampleReport(),
      aircraftId: kite,
    });
    await closeLocalDb();
    let recordsRead = 0;
    // Dexie's "reading" hook runs for every flight record a query hands back.
    localDb().flights.hook('reading', (record) => {
      recordsRead++;
      return record;
    });
    expect(await deviceBaselineFlights(kite)).toHaveLength(1);
    expect(recordsRead).toBe(0);
    await localDb().flights.get(id(1));
    expect(recordsRead).toBe(1);
  });
});
