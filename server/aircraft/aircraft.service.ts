import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type {
  Aircraft as AircraftDto,
  AircraftPatch,
  BenchRun as BenchRunDto,
  ServiceEntry as ServiceEntryDto,
  ServiceKind,
  TrendPoint,
  Trends,
} from '../../shared/schemas/aircraft';
import { AircraftInput, BenchRunInput, ServiceEntryInput } from '../../shared/schemas/aircraft';
import type { Role } from '../../shared/schemas/common';
import { User } from '../auth/user.entity';
import { BadRequestError, ForbiddenError, NotFoundError } from '../http/errors';
import { VersionConflictError } from '../http/versions';
import { Flight } from '../flights/flight.entity';
import { severityName } from '../flights/flight-summary';
import { can, canDeleteServiceEntry, type Action } from '../../shared/auth/permissions';
import type { TeamsService } from '../teams/teams.service';
import { withUserNames } from '../db/with-user-names';
import { iso } from '../util';
import { Aircraft } from './aircraft.entity';
import { BenchRun } from './bench-run.entity';
import { ServiceEntry } from './service-entry.entity';

export class AircraftService {
  constructor(
    private readonly ds: DataSource,
    private readonly teams: TeamsService,
    /** Removes a raw log no flight refers to any more (the flights service's rule). */
    private readonly releaseRaw: (key: string) => Promise<void>,
  ) {}

  /** Loads an aircraft and checks the caller may do `action` in its team (404 for outsiders). */
  async access(
    userId: string,
    aircraftId: string,
    action: Action,
  ): Promise<{ aircraft: Aircraft; role: Role }> {
    const aircraft = await this.ds.getRepository(Aircraft).findOneBy({ id: aircraftId });
    if (!aircraft) throw new NotFoundError('Aircraft');
    const role = await this.teams
      .authorize(userId, aircraft.teamId, action)
      .catch((err: unknown) => {
        if (err instanceof NotFoundError) throw new NotFoundError('Aircraft');
        throw err;
      });
    return { aircraft, role };
  }

  private async toDtos(rows: Aircraft[]): Promise<AircraftDto[]> {
    if (rows.length === 0) return [];
    const ids = rows.map((a) => a.id);
    // Two counts that each stay inside an index: all flights from the aircraft index alone, and
    // the few awaiting review through the team's review-state index (rather than reading every
    // flight row of the fleet to look at its review state).
    const counts = await this.ds
      .getRepository(Flight)
      .createQueryBuilder('f')
      .select('f.aircraftId', 'aircraftId')
      .addSelect('COUNT(*)', 'n')
      .where('f.aircraftId IN (:...ids)', { ids })
      .groupBy('f.aircraftId')
      .getRawMany<{ aircraftId: string; n: number }>();
    const awaiting = await this.ds
      .getRepository(Flight)
      .createQueryBuilder('f')
      .select('f.aircraftId', 'aircraftId')
      .addSelect('COUNT(*)', 'n')
      .where("f.teamId = :teamId AND f.reviewState = 'requested'", { teamId: rows[0]!.teamId })
      .andWhere('f.aircraftId IN (:...ids)', { ids })
      .groupBy('f.aircraftId')
      .getRawMany<{ aircraftId: string; n: number }>();
    const flightCount = new Map(counts.map((c) => [c.aircraftId, Number(c.n)]));
    const awaitingReview = new Map(awaiting.map((c) => [c.aircraftId, Number(c.n)]));
    const out: AircraftDto[] = [];
    for (const a of rows) {
      const last = await this.ds.getRepository(Flight).findOne({
        where: { aircraftId: a.id },
        order: { recordedAt: 'DESC', id: 'DESC' },
        select: {
          id: true,
          recordedAt: true,
          worstSeverity: true,
          noteCount: true,
          watchCount: true,
          actCount: true,
        },
      });
      out.push({
        id: a.id,
        teamId: a.teamId,
        name: a.name,
        airframe: a.airframe,
        version: a.version,
        components: a.components,
        notes: a.notes,
        flightCount: flightCount.get(a.id) ?? 0,
        awaitingReview: awaitingReview.get(a.id) ?? 0,
        lastFlight: last
          ? {
              id: last.id,
              recordedAt: iso(last.recordedAt),
              worstSeverity: severityName(last.worstSeverity),
              findingCount: last.noteCount + last.watchCount + last.actCount,
            }
          : null,
        createdAt: iso(a.createdAt),
        updatedAt: iso(a.updatedAt),
      });
    }
    return out;
  }

  async list(userId: string, teamId: string): Promise<AircraftDto[]> {
    await this.teams.authorize(userId, teamId, 'team.read');
    const rows = await this.ds
      .getRepository(Aircraft)
      .find({ where: { teamId }, order: { name: 'ASC' } });
    return this.toDtos(rows);
  }

  async create(userId: string, teamId: string, input: AircraftInput): Promise<AircraftDto> {
    await this.teams.authorize(userId, teamId, 'aircraft.create');
    const parsed = AircraftInput.parse(input);
    const now = Date.now();
    const aircraft: Aircraft = {
      id: randomUUID(),
      teamId,
      ...parsed,
      createdAt: now,
      updatedAt: now,
      version: 1,
    };
    await this.ds.getRepository(Aircraft).insert(aircraft);
    return (await this.toDtos([aircraft]))[0]!;
  }

  async get(userId: string, id: string): Promise<AircraftDto> {
    const { aircraft } = await this.access(userId, id, 'team.read');
    return (await this.toDtos([aircraft]))[0]!;
  }

  /** `expected`: the version the editor saw (If-Match); a newer one answers 412. */
  async update(
    userId: string,
    id: string,
    patch: AircraftPatch,
    expected?: number,
  ): Promise<AircraftDto> {
    const { aircraft } = await this.access(userId, id, 'aircraft.update');
    if (expected !== undefined && expected !== aircraft.version)
      throw new VersionConflictError(aircraft.version, 'This aircraft');
    const next: Aircraft = {
      ...aircraft,
      ...patch,
      updatedAt: Date.now(),
      version: aircraft.version + 1,
    };
    const done = await this.ds.getRepository(Aircraft).update(
      { id, version: aircraft.version },
      {
        name: next.name,
        airframe: next.airframe,
        components: next.components,
        notes: next.notes,
        updatedAt: next.updatedAt,
        version: next.version,
      },
    );
    if (!done.affected) {
      const now = await this.ds.getRepository(Aircraft).findOneByOrFail({ id });
      if (expected !== undefined) throw new VersionConflictError(now.version, 'This aircraft');
      return this.update(userId, id, patch);
    }
    return (await this.toDtos([next]))[0]!;
  }

  /** Deletes the aircraft with its flights, comments, service log and bench runs. */
  async remove(userId: string, id: string): Promise<void> {
    await this.access(userId, id, 'aircraft.delete');
    const raws = await this.ds
      .getRepository(Flight)
      .createQueryBuilder('f')
      .select('DISTINCT f.rawKey', 'rawKey')
      .where('f.aircraftId = :id AND f.rawKey IS NOT NULL', { id })
      .getRawMany<{ rawKey: string }>();
    // Its flights go with it (foreign key cascade); then their raw logs, unless another flight
    // of the team holds the same file.
    await this.ds.getRepository(Aircraft).delete({ id });
    for (const { rawKey } of raws) await this.releaseRaw(rawKey);
  }

  async serviceLog(userId: string, aircraftId: string): Promise<ServiceEntryDto[]> {
    const { role } = await this.access(userId, aircraftId, 'team.read');
    const rows = await withUserNames(
      this.ds
        .getRepository(ServiceEntry)
        .createQueryBuilder('e')
        .where('e.aircraftId = :aircraftId', { aircraftId })
        .orderBy('e.date', 'DESC')
        .addOrderBy('e.createdAt', 'DESC'),
      'e.byId',
    );
    return rows.map(([e, byName]) =>
      this.serviceDto(e, byName, canDeleteServiceEntry(role, userId, e.byId)),
    );
  }

  private serviceDto(e: ServiceEntry, byName: string, canDelete: boolean): ServiceEntryDto {
    return {
      id: e.id,
      aircraftId: e.aircraftId,
      date: e.date,
      kind: e.kind as ServiceKind,
      motor: e.motor,
      note: e.note,
      by: { id: e.byId, name: byName },
      createdAt: iso(e.createdAt),
      canDelete,
    };
  }

  async addServiceEntry(
    userId: string,
    aircraftId: string,
    body: ServiceEntryInput,
  ): Promise<ServiceEntryDto> {
    const { aircraft, role } = await this.access(userId, aircraftId, 'serviceLog.create');
    const input = ServiceEntryInput.parse(body);
    if (input.motor !== undefined && input.motor > aircraft.airframe.motors.length) {
      throw new BadRequestError(
        `${aircraft.name} has ${aircraft.airframe.motors.length} motors; there is no motor ${input.motor}.`,
      );
    }
    const entry: ServiceEntry = {
      id: randomUUID(),
      aircraftId,
      date: input.date,
      kind: input.kind,
      motor: input.motor ?? null,
      note: input.note,
      byId: userId,
      createdAt: Date.now(),
    };
    await this.ds.getRepository(ServiceEntry).insert(entry);
    const by = await this.ds.getRepository(User).findOneByOrFail({ id: userId });
    return this.serviceDto(entry, by.name, canDeleteServiceEntry(role, userId, userId));
  }

  /** Corrects the log: the owner and tuners delete any entry, a pilot only one they added. */
  async removeServiceEntry(userId: string, aircraftId: string, entryId: string): Promise<void> {
    const { role } = await this.access(userId, aircraftId, 'team.read');
    const repo = this.ds.getRepository(ServiceEntry);
    const entry = await repo.findOneBy({ id: entryId, aircraftId });
    if (!entry) throw new NotFoundError('Service entry');
    if (!canDeleteServiceEntry(role, userId, entry.byId)) {
      throw new ForbiddenError(
        can(role, 'serviceLog.deleteOwn')
          ? 'Pilots delete only the service entries they added.'
          : 'Your role in this team does not allow deleting service entries.',
      );
    }
    await repo.delete({ id: entryId });
  }

  async benchRuns(userId: string, aircraftId: string): Promise<BenchRunDto[]> {
    const { role } = await this.access(userId, aircraftId, 'team.read');
    const rows = await withUserNames(
      this.ds
        .getRepository(BenchRun)
        .createQueryBuilder('b')
        .where('b.aircraftId = :aircraftId', { aircraftId })
        .orderBy('b.date', 'DESC')
        .addOrderBy('b.createdAt', 'DESC'),
      'b.byId',
    );
    const canDelete = can(role, 'benchRuns.delete');
    return rows.map(([b, byName]) => this.benchDto(b, byName, canDelete));
  }

  private benchDto(b: BenchRun, byName: string, canDelete: boolean): BenchRunDto {
    return {
      id: b.id,
      aircraftId: b.aircraftId,
      date: b.date,
      motor: b.motor,
      prop: b.prop,
      note: b.note,
      rows: b.rows,
      by: { id: b.byId, name: byName },
      createdAt: iso(b.createdAt),
      canDelete,
    };
  }

  async addBenchRun(userId: string, aircraftId: string, body: BenchRunInput): Promise<BenchRunDto> {
    const { role } = await this.access(userId, aircraftId, 'benchRuns.create');
    const input = BenchRunInput.parse(body);
    const run: BenchRun = {
      id: randomUUID(),
      aircraftId,
      date: input.date,
      motor: input.motor,
      prop: input.prop,
      note: input.note,
      rows: input.rows,
      byId: userId,
      createdAt: Date.now(),
    };
    await this.ds.getRepository(BenchRun).insert(run);
    const by = await this.ds.getRepository(User).findOneByOrFail({ id: userId });
    return this.benchDto(run, by.name, can(role, 'benchRuns.delete'));
  }

  /** Removes a bench run entered by mistake; the owner and tuners, who keep bench runs. */
  async removeBenchRun(userId: string, aircraftId: string, runId: string): Promise<void> {
    await this.access(userId, aircraftId, 'benchRuns.delete');
    const done = await this.ds.getRepository(BenchRun).delete({ id: runId, aircraftId });
    if (!done.affected) throw new NotFoundError('Bench run');
  }

  /** Per-flight trend points, oldest first, read from the small trend JSON stored with each flight. */
  async trends(userId: string, aircraftId: string, limit = 500): Promise<Trends> {
    await this.access(userId, aircraftId, 'team.read');
    const rows = await this.ds.getRepository(Flight).find({
      where: { aircraftId },
      order: { recordedAt: 'DESC', id: 'DESC' },
      take: limit,
      select: { id: true, recordedAt: true, trend: true, worstSeverity: true },
    });
    const points: TrendPoint[] = rows.reverse().map((f) => ({
      ...(JSON.parse(f.trend) as Omit<TrendPoint, 'flightId' | 'recordedAt' | 'worstSeverity'>),
      flightId: f.id,
      recordedAt: iso(f.recordedAt),
      worstSeverity: severityName(f.worstSeverity),
    }));
    return { aircraftId, points };
  }
}
