import { rm } from 'node:fs/promises';
import type { DataSource } from 'typeorm';
import { errorCodes } from '../../shared/api/error';
import type { Role } from '../../shared/schemas/common';
import {
  FlightPutInput,
  ReviewRequestInput,
  ReviewStateInput,
  type FlightDetail,
  type FlightListQuery,
  type FlightPage,
  type FlightPutResponse,
  type FlightSummary,
  type RawUploadResponse,
  type ReviewState,
} from '../../shared/schemas/flights';
import { FlightReport } from '../../shared/schemas/report';
import type { ReviewDetail } from '../../shared/analysis/review-detail';
import { User } from '../auth/user.entity';
import type { Config } from '../config';
import { Aircraft } from '../fleet/aircraft.entity';
import {
  AppError,
  BadRequestError,
  ConflictError,
  ForbiddenError,
  NotFoundError,
} from '../http/errors';
import type { MailQuota } from '../mail/mail-quota';
import type { Mailer } from '../mail/mailer';
import { reviewDoneMail, reviewRequestMail } from '../mail/templates';
import { Membership } from '../teams/membership.entity';
import { can, type Action } from '../../shared/auth/permissions';
import type { TeamsService } from '../teams/teams.service';
import { iso } from '../util';
import { FlightPayload } from './flight-payload.entity';
import { cachedQuery } from '../db/sql';
import { Flight } from './flight.entity';
import { findingStats, severityName, severityRank, trendOf } from './flight-summary';
import { rawKey, type RawStore } from './raw-store';
import { notCsvReason, type StagedFile } from './raw-upload';

/** Columns of a list row; never the report or detail JSON. */
const summaryColumns = [
  'f.id AS id',
  'f.teamId AS "teamId"',
  'f.aircraftId AS "aircraftId"',
  'a.name AS "aircraftName"',
  'f.pilotId AS "pilotId"',
  'u.name AS "pilotName"',
  'f.recordedAt AS "recordedAt"',
  'f.durationS AS "durationS"',
  'f.sampleRateHz AS "sampleRateHz"',
  'f.fileName AS "fileName"',
  'f.sha256 AS sha256',
  'f.sizeBytes AS "sizeBytes"',
  'f.rawKey AS "rawKey"',
  'f.worstSeverity AS "worstSeverity"',
  'f.noteCount AS "noteCount"',
  'f.watchCount AS "watchCount"',
  'f.actCount AS "actCount"',
  'f.commentCount AS "commentCount"',
  'f.openComments AS "openComments"',
  'f.reviewState AS "reviewState"',
  'f.note AS note',
  'f.createdAt AS "createdAt"',
  'f.updatedAt AS "updatedAt"',
];

interface SummaryRow {
  id: string;
  teamId: string;
  aircraftId: string;
  aircraftName: string;
  pilotId: string;
  pilotName: string;
  recordedAt: number;
  durationS: number;
  sampleRateHz: number;
  fileName: string;
  sha256: string;
  sizeBytes: number | null;
  rawKey: string | null;
  worstSeverity: number;
  noteCount: number;
  watchCount: number;
  actCount: number;
  commentCount: number;
  openComments: number;
  reviewState: string;
  note: string;
  createdAt: number;
  updatedAt: number;
}

function toSummary(r: SummaryRow): FlightSummary {
  return {
    id: r.id,
    teamId: r.teamId,
    aircraftId: r.aircraftId,
    aircraftName: r.aircraftName,
    pilot: { id: r.pilotId, name: r.pilotName },
    recordedAt: iso(Number(r.recordedAt)),
    durationS: Number(r.durationS),
    sampleRateHz: Number(r.sampleRateHz),
    fileName: r.fileName,
    sha256: r.sha256,
    sizeBytes: r.sizeBytes === null ? null : Number(r.sizeBytes),
    hasRaw: r.rawKey !== null,
    worstSeverity: severityName(Number(r.worstSeverity)),
    findingCounts: {
      note: Number(r.noteCount),
      watch: Number(r.watchCount),
      act: Number(r.actCount),
    },
    commentCount: Number(r.commentCount),
    openComments: Number(r.openComments),
    reviewState: r.reviewState as ReviewState,
    note: r.note,
    createdAt: iso(Number(r.createdAt)),
    updatedAt: iso(Number(r.updatedAt)),
  };
}

const encodeCursor = (recordedAt: number, id: string) =>
  Buffer.from(JSON.stringify([recordedAt, id])).toString('base64url');

function decodeCursor(cursor: string): [number, string] {
  try {
    const v = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as unknown;
    if (Array.isArray(v) && typeof v[0] === 'number' && typeof v[1] === 'string')
      return [v[0], v[1]];
  } catch {
    // fall through
  }
  throw new BadRequestError('The page cursor is not one this server gave out.');
}

export class FlightsService {
  constructor(
    private readonly ds: DataSource,
    private readonly config: Pick<Config, 'publicUrl'>,
    private readonly teams: TeamsService,
    private readonly mailer: Mailer,
    readonly rawStore: RawStore,
    private readonly reviewRequestQuota: MailQuota,
  ) {}

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

  private async summary(id: string): Promise<FlightSummary> {
    const row = await this.summaryQuery().where('f.id = :id', { id }).getRawOne<SummaryRow>();
    if (!row) throw new NotFoundError('Flight');
    return toSummary(row);
  }

  private summaryQuery() {
    return this.repo
      .createQueryBuilder('f')
      .innerJoin(Aircraft, 'a', 'a.id = f.aircraftId')
      .innerJoin(User, 'u', 'u.id = f.pilotId')
      .select(summaryColumns);
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
      if (existing.pilotId !== userId && !can(role, 'flights.replaceAny')) {
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
      if (same) return { outcome: 'unchanged', flight: await this.summary(id) };
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
      return { outcome: 'replaced', flight: await this.summary(id) };
    }

    const dup = await this.repo.findOne({
      where: { teamId: input.teamId, sha256: input.sha256 },
      select: { id: true },
    });
    if (dup) return { outcome: 'duplicate', flight: await this.summary(dup.id) };

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
    return { outcome: 'created', flight: await this.summary(id) };
  }

  async get(userId: string, id: string): Promise<FlightDetail> {
    await this.access(userId, id, 'team.read');
    const summary = await this.summary(id);
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
    const own = f.pilotId === userId && can(f.role, 'flights.deleteOwn');
    if (!own && !can(f.role, 'flights.deleteAny')) {
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

  /** Removes a stored raw log once no flight refers to it (keys are per team). */
  async releaseRaw(key: string) {
    const users = await this.repo.countBy({ rawKey: key });
    if (users === 0) await this.rawStore.remove(key);
  }

  /**
   * Startup sweep: removes stored raw logs no flight refers to (left by a crash between a
   * delete and its file removal, or by older versions) and staged uploads nobody finished.
   */
  async sweepRaw(): Promise<number> {
    await this.rawStore.clearStaging();
    const rows = await this.repo
      .createQueryBuilder('f')
      .select('DISTINCT f.rawKey', 'rawKey')
      .where('f.rawKey IS NOT NULL')
      .getRawMany<{ rawKey: string }>();
    const used = new Set(rows.map((r) => r.rawKey));
    let removed = 0;
    for await (const key of this.rawStore.keys()) {
      if (used.has(key)) continue;
      await this.rawStore.remove(key);
      removed++;
    }
    return removed;
  }

  /** One cached SQL text per combination of filters (and page size) a client uses. */
  private readonly listQueries = new Map<
    string,
    (p: Record<string, string | number>) => Promise<SummaryRow[]>
  >();

  async list(userId: string, teamId: string, q: FlightListQuery): Promise<FlightPage> {
    await this.teams.authorize(userId, teamId, 'team.read');
    const params: Record<string, string | number> = { teamId };
    if (q.aircraftId) params.aircraftId = q.aircraftId;
    if (q.pilotId) params.pilotId = q.pilotId;
    if (q.from) params.from = Date.parse(q.from);
    if (q.to) params.to = Date.parse(q.to);
    if (q.review) params.review = q.review;
    if (q.cursor) [params.cr, params.cid] = decodeCursor(q.cursor);
    // The severity rank (one of three) is written into the SQL, not bound: a literal matches the
    // partial indexes for "watch or worse" and "act" in every build (sqlite.org/partialindex.html
    // §2); a bound value is matched only by builds with STAT4, and only after a re-prepare.
    const sev = q.severity ? severityRank(q.severity) : 0;
    const key = `${Object.keys(params).join(',')}|open=${String(q.openComments)}|sev=${sev}|limit=${q.limit}`;
    let run = this.listQueries.get(key);
    if (!run) {
      if (this.listQueries.size > 500) this.listQueries.clear();
      run = cachedQuery<Record<string, string | number>, SummaryRow>(this.ds, (p) => {
        const qb = this.summaryQuery().where('f.teamId = :teamId', { teamId: p.teamId });
        if ('aircraftId' in p)
          qb.andWhere('f.aircraftId = :aircraftId', { aircraftId: p.aircraftId });
        if ('pilotId' in p) qb.andWhere('f.pilotId = :pilotId', { pilotId: p.pilotId });
        if ('from' in p) qb.andWhere('f.recordedAt >= :from', { from: p.from });
        if ('to' in p) qb.andWhere('f.recordedAt < :to', { to: p.to });
        if (q.openComments !== undefined)
          qb.andWhere(q.openComments ? 'f.openComments > 0' : 'f.openComments = 0');
        if (sev > 0) qb.andWhere(`f.worstSeverity >= ${sev}`);
        if ('review' in p) qb.andWhere('f.reviewState = :review', { review: p.review });
        // A row-value comparison seeks straight to the cursor in the (…, recordedAt, id) index;
        // the equivalent OR of two terms walked every newer flight first, so deep pages cost
        // more the further down the list they were.
        if ('cr' in p) {
          qb.andWhere('(f.recordedAt, f.id) < (:cr, :cid)', { cr: p.cr, cid: p.cid });
        }
        return qb
          .orderBy('f.recordedAt', 'DESC')
          .addOrderBy('f.id', 'DESC')
          .limit(q.limit + 1);
      });
      this.listQueries.set(key, run);
    }
    const rows = await run(params);
    const more = rows.length > q.limit;
    const page = rows.slice(0, q.limit);
    const last = page[page.length - 1];
    return {
      flights: page.map(toSummary),
      nextCursor: more && last ? encodeCursor(Number(last.recordedAt), last.id) : null,
    };
  }

  /** Checks the staged upload against the flight and keeps it; removes it on any refusal. */
  async attachRaw(userId: string, id: string, staged: StagedFile): Promise<RawUploadResponse> {
    try {
      const f = await this.access(userId, id, 'flights.upload');
      if (f.pilotId !== userId && !can(f.role, 'flights.replaceAny')) {
        throw new ForbiddenError(
          'Only the pilot who uploaded this flight, or the team owner, can attach its log.',
        );
      }
      const reason = await notCsvReason(staged);
      if (reason)
        throw new AppError(
          415,
          'not_csv',
          `${reason} Send the flight controller's CSV log (.csv or .csv.gz).`,
        );
      const flight = await this.repo.findOneOrFail({
        where: { id },
        select: { id: true, sha256: true, rawKey: true },
      });
      if (flight.sha256 !== staged.sha256) {
        throw new ConflictError(
          'This file is not the one the flight was analysed from (SHA-256 differs).',
          'hash_mismatch',
        );
      }
      const key = rawKey(f.teamId, staged.sha256, staged.gzip);
      const { stored } = await this.rawStore.put(staged.path, key);
      await this.repo.update({ id }, { rawKey: key, rawGzip: staged.gzip, sizeBytes: staged.size });
      return { sha256: staged.sha256, sizeBytes: staged.size, gzip: staged.gzip, stored };
    } finally {
      // put() moved it on success; anything left is refused input.
      await rm(staged.path, { force: true });
    }
  }

  async openRaw(userId: string, id: string) {
    await this.access(userId, id, 'team.read');
    const f = await this.repo.findOneOrFail({
      where: { id },
      select: { id: true, rawKey: true, rawGzip: true, fileName: true },
    });
    if (!f.rawKey) throw new NotFoundError('The raw log of this flight');
    const { stream, size } = await this.rawStore.open(f.rawKey);
    return { stream, size, gzip: f.rawGzip, fileName: f.fileName };
  }

  private flightName(aircraftName: string, fileName: string) {
    return `${aircraftName} · ${fileName}`;
  }

  /** The uploader (or owner/tuner) asks team members to review; each gets an e-mail. */
  async requestReview(
    userId: string,
    id: string,
    body: ReviewRequestInput,
  ): Promise<FlightSummary> {
    const input = ReviewRequestInput.parse(body);
    const f = await this.access(userId, id, 'flights.requestReview');
    if (f.role === 'pilot' && f.pilotId !== userId)
      throw new ForbiddenError('Pilots ask for reviews of their own flights.');
    const reviewers = await this.ds
      .getRepository(Membership)
      .createQueryBuilder('m')
      .innerJoin(User, 'u', 'u.id = m.userId')
      .select(['u.id AS id', 'u.email AS email'])
      .where('m.teamId = :teamId AND m.userId IN (:...ids)', {
        teamId: f.teamId,
        ids: input.userIds,
      })
      .getRawMany<{ id: string; email: string }>();
    if (reviewers.length !== new Set(input.userIds).size)
      throw new BadRequestError('Every reviewer must be a member of the team.');
    const mails = reviewers.filter((r) => r.id !== userId).length;
    if (!(await this.reviewRequestQuota.fits(userId, mails))) {
      throw new AppError(
        429,
        errorCodes.rateLimited,
        `You have asked for ${this.reviewRequestQuota.limit} reviews by mail in the last hour; try again later.`,
      );
    }
    await this.reviewRequestQuota.take(userId, mails);
    await this.repo.update({ id }, { reviewState: 'requested', updatedAt: Date.now() });
    const summary = await this.summary(id);
    const from = await this.ds.getRepository(User).findOneByOrFail({ id: userId });
    for (const r of reviewers) {
      if (r.id === userId) continue;
      this.mailer.queue(
        reviewRequestMail(this.config, {
          to: r.email,
          from: from.name,
          flightName: this.flightName(summary.aircraftName, summary.fileName),
          flightId: id,
          note: input.note,
        }),
      );
    }
    return summary;
  }

  /** A coach or the owner marks the flight reviewed or asks for changes; the pilot is told. */
  async setReview(userId: string, id: string, body: ReviewStateInput): Promise<FlightSummary> {
    const input = ReviewStateInput.parse(body);
    const f = await this.access(userId, id, 'flights.review');
    await this.repo.update({ id }, { reviewState: input.state, updatedAt: Date.now() });
    const summary = await this.summary(id);
    // Only while the pilot is still in the team (a former member gets no team mail).
    const pilotRole = await this.teams.roleIn(f.pilotId, f.teamId).catch(() => null);
    if (f.pilotId !== userId && can(pilotRole, 'team.read')) {
      const [by, pilot] = await Promise.all([
        this.ds.getRepository(User).findOneByOrFail({ id: userId }),
        this.ds.getRepository(User).findOneByOrFail({ id: f.pilotId }),
      ]);
      this.mailer.queue(
        reviewDoneMail(this.config, {
          to: pilot.email,
          by: by.name,
          state: input.state,
          flightName: this.flightName(summary.aircraftName, summary.fileName),
          flightId: id,
          note: input.note,
        }),
      );
    }
    return summary;
  }
}
