import { And, In, LessThan, LessThanOrEqual, MoreThanOrEqual, type DataSource } from 'typeorm';
import {
  CONFIG_CHANGES,
  sampleOfTrend,
  selectBaseline,
  type StoredTrend,
} from '../../shared/analysis/baseline';
import type { ServiceKind } from '../../shared/schemas/aircraft';
import type {
  AircraftBaseline,
  BaselineCut,
  BaselineFlight,
  BaselineQuery,
} from '../../shared/schemas/baseline';
import type { AircraftService } from '../aircraft/aircraft.service';
import { ServiceEntry } from '../aircraft/service-entry.entity';
import { Flight } from '../flights/flight.entity';
import type { ThresholdsService } from '../teams/thresholds.service';
import { iso } from '../util';

/**
 * How many of the latest earlier flights are read to find the baseline: the team's most
 * baseline flights four times over, so a run of short flights (too little hover) does not empty
 * it, and never more than this many rows, so the answer stays small whatever the history.
 */
const SCAN_PER_FLIGHT = 4;
const SCAN_MAX = 200;

/** The aircraft's recent flights a flight's drift is judged against (shared/analysis/baseline.ts). */
export class BaselineService {
  constructor(
    private readonly ds: DataSource,
    private readonly aircraft: AircraftService,
    private readonly thresholds: ThresholdsService,
  ) {}

  async before(userId: string, aircraftId: string, q: BaselineQuery): Promise<AircraftBaseline> {
    const { aircraft } = await this.aircraft.access(userId, aircraftId, 'team.read');
    const th = (await this.thresholds.get(userId, aircraft.teamId)).thresholds;
    const beforeMs = Date.parse(q.before);
    // The latest configuration change on or before the flight's day: one row from the
    // (aircraftId, date) index.
    const entry = await this.ds.getRepository(ServiceEntry).findOne({
      where: {
        aircraftId,
        kind: In(CONFIG_CHANGES as ServiceKind[]),
        date: LessThanOrEqual(q.before.slice(0, 10)),
      },
      order: { date: 'DESC', createdAt: 'DESC' },
    });
    const cut: BaselineCut | null = entry
      ? { date: entry.date, kind: entry.kind as ServiceKind, motor: entry.motor, note: entry.note }
      : null;
    const sinceMs = cut ? Date.parse(`${cut.date}T00:00:00Z`) : 0;
    // A bounded walk back along the (aircraftId, recordedAt, id) index, reading only the small
    // trend JSON of each flight.
    const rows = await this.ds.getRepository(Flight).find({
      where: { aircraftId, recordedAt: And(MoreThanOrEqual(sinceMs), LessThan(beforeMs)) },
      order: { recordedAt: 'DESC', id: 'DESC' },
      take: Math.min(SCAN_MAX, th.driftMaxFlights * SCAN_PER_FLIGHT),
      select: { id: true, recordedAt: true, trend: true },
    });
    const candidates: BaselineFlight[] = rows.map((f) => ({
      flightId: f.id,
      recordedAt: iso(f.recordedAt),
      sample: sampleOfTrend(JSON.parse(f.trend) as StoredTrend),
    }));
    const picked = selectBaseline(
      candidates,
      { beforeIso: q.before, excludeId: q.exclude, cut },
      th,
    );
    return { aircraftId, aircraftName: aircraft.name, since: cut, ...picked };
  }
}
