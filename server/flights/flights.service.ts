import type { DataSource } from 'typeorm';
import { can, canOnRecord, type Action } from '../../shared/auth/permissions';
import type { Role } from '../../shared/schemas/common';
import {
  FlightPutInput,
  type FlightDetail,
  type FlightListQuery,
  type FlightPage,
  type FlightPutResponse,
} from '../../shared/schemas/flights';
import { FlightReport } from '../../shared/schemas/report';
import type { ReviewDetail } from '../../shared/analysis/review-detail';
import { Aircraft } from '../aircraft/aircraft.entity';
import { User } from '../auth/user.entity';
import { cachedQuery } from '../db/sql';
import { ConflictError, ForbiddenError, NotFoundError } from '../http/errors';
import { Membership } from '../teams/membership.entity';
import type { TeamsService } from '../teams/teams.service';
import { FlightPayload } from './flight-payload.entity';
import { Flight } from './flight.entity';
import { loadSummary } from './flight-rows';
import { FlightListQueries } from './flight-list.query';
import { findingStats, trendOf } from './flight-summary';

/**
 * Flight records: create or replace by the client's id, read, delete, and the team's list. The
 * raw log (raw-logs.service.ts) and reviews (reviews.service.ts) build on `access`.
 */
export class FlightsService {
  constructor(
    private readonly ds: DataSource,
    private readonly teams: TeamsService,
    /** Removes a raw log no flight refers to any more. */
    private readonly releaseRaw: (key: string) => Promise<void>,
  ) {}

  private readonly lists = new FlightListQueries(this.ds);

  private get repo() {
    return this.ds.getRepository(Flight);
  }

  private readonly accessQuery = cachedQuery<
    { userId: string; flightId: string },
    {
      id: string;
      teamId: string;
      pilotId: string;
      aircraftId: string;
      role: Role | null;
      userName: string | null;
    }
  >(this.ds, (p) =>
    this.ds
      .getRepository(Flight)
      .createQueryBuilder('f')
      .leftJoin(Membership, 'm', 'm.teamId = f.teamId AND m.userId = :userId', { userId: p.userId })
      .leftJoin(User, 'cu', 'cu.id = m.userId')
      .select([
        'f.id AS id',
        'f.teamId AS "teamId"',
        'f.pilotId AS "pilotId"',
        'f.aircraftId AS "aircraftId"',
        'm.role AS role',
        'cu.name AS "userName"',
      ])
      .where('f.id = :flightId', { flightId: p.flightId }),
  );

  /**
   * The flight's team-level facts plus the caller's role and name, in one query. 404 for a
   * missing flight and for outsiders alike; 403 when the role may not do `action`.
   */
  async access(userId: string, flightId: string, action: Action) {
    const [row] = await this.accessQuery({ userId, flightId });
    if (!row || !row.role) throw new NotFoundError('Flight');
    if (!can(row.role, action)) throw new ForbiddenError();
    return { ...row, role: row.role, userName: row.userName ?? '' };
  }

  async list(userId: string, teamId: string, q: FlightListQuery): Promise<FlightPage> {
    await this.teams.authorize(userId, teamId, 'team.read');
    return this.lists.page(teamId, q);
  }

  /** Create or replace by the client's UUID; a raw file already stored as another flight answers with that flight. */
  async put(userId: string, id: string, body: FlightPutInput): Promise<FlightPutResponse> {
    const input = FlightPutInput.parse(body);
    const role = await this.teams.authorize(userId, input.teamId, 'flights.upload');
    const aircraft = await this.ds
      .getRepository(Aircraft)
      .findOneBy({ id: input.aircraftId, teamId: input.teamId });
    if (!aircraft) throw new NotFoundError('Aircraft');

    const { counts, worst } = findingStats(input.report);
    const now = Date.now();
    const fields = {
      teamId: input.teamId,
      aircraftId: input.aircraftId,
      recordedAt: Date.parse(input.recordedAt),
      durationS: input.report.durationS,
      sampleRateHz: input.report.sampleRateHz,
      fileName: input.fileName,
      sha256: input.sha256,
      sizeBytes: input.sizeBytes ?? null,
      reportVersion: input.report.version,
      trend: JSON.stringify(trendOf(input.report)),
      worstSeverity: worst,
      noteCount: counts.note,
      watchCount: counts.watch,
      actCount: counts.act,
      note: input.note ?? '',
    };

    const payload = {
      flightId: id,
      report: JSON.stringify(input.report),
      detail: input.detail === undefined ? null : JSON.stringify(input.detail),
    };

    const existing = await this.repo.findOneBy({ id });
    if (existing) {
      if (existing.teamId !== input.teamId) {
        throw new ConflictError(
          'This flight id is already used by another team’s flight.',
          'id_taken',
        );
      }
      if (!canOnRecord(role, 'flights.replaceAny', 'flights.upload', existing.pilotId === userId)) {
        throw new ForbiddenError(
          'Only the pilot who uploaded this flight, or the team owner, can replace it.',
        );
      }
      // A retry without sizeBytes keeps the size the raw upload recorded.
      fields.sizeBytes = input.sizeBytes ?? existing.sizeBytes;
      const stored = await this.ds.getRepository(FlightPayload).findOneBy({ flightId: id });
      const same =
        (Object.keys(fields) as (keyof typeof fields)[]).every((k) => existing[k] === fields[k]) &&
        stored?.report === payload.report &&
        stored.detail === payload.detail;
      if (same) return { outcome: 'unchanged', flight: await loadSummary(this.ds, id) };
      const keepRaw = existing.sha256 === input.sha256;
      await this.ds.transaction(async (em) => {
        await em.getRepository(Flight).update(
          { id },
          {
            ...fields,
            rawKey: keepRaw ? existing.rawKey : null,
            rawGzip: keepRaw ? existing.rawGzip : false,
            updatedAt: now,
          },
        );
        await em.getRepository(FlightPayload).upsert(payload, ['flightId']);
      });
      if (!keepRaw && existing.rawKey) await this.releaseRaw(existing.rawKey);
      return { outcome: 'replaced', flight: await loadSummary(this.ds, id) };
    }

    const dup = await this.repo.findOne({
      where: { teamId: input.teamId, sha256: input.sha256 },
      select: { id: true },
    });
    if (dup) return { outcome: 'duplicate', flight: await loadSummary(this.ds, dup.id) };

    await this.ds.transaction(async (em) => {
      await em.getRepository(Flight).insert({
        id,
        ...fields,
        pilotId: userId,
        rawKey: null,
        rawGzip: false,
        commentCount: 0,
        openComments: 0,
        reviewState: 'none',
        createdAt: now,
        updatedAt: now,
      });
      await em.getRepository(FlightPayload).insert(payload);
    });
    return { outcome: 'created', flight: await loadSummary(this.ds, id) };
  }

  async get(userId: string, id: string): Promise<FlightDetail> {
    await this.access(userId, id, 'team.read');
    const summary = await loadSummary(this.ds, id);
    const f = await this.ds.getRepository(FlightPayload).findOneByOrFail({ flightId: id });
    return {
      ...summary,
      report: FlightReport.parse(JSON.parse(f.report)),
      detail: f.detail === null ? null : (JSON.parse(f.detail) as ReviewDetail),
    };
  }

  /** Owner deletes any flight; the pilot who uploaded it deletes their own. */
  async remove(userId: string, id: string): Promise<void> {
    const f = await this.access(userId, id, 'team.read');
    if (!canOnRecord(f.role, 'flights.deleteAny', 'flights.deleteOwn', f.pilotId === userId)) {
      throw new ForbiddenError(
        'Only the pilot who uploaded this flight (while their role allows uploads), or the team owner, can delete it.',
      );
    }
    const row = await this.repo.findOneOrFail({
      where: { id },
      select: { id: true, rawKey: true },
    });
    await this.repo.delete({ id });
    if (row.rawKey) await this.releaseRaw(row.rawKey);
  }
}
