import type { DataSource } from 'typeorm';
import { errorCodes } from '../../shared/api/error';
import { can, canOnRecord } from '../../shared/auth/permissions';
import {
  ReviewRequestInput,
  ReviewStateInput,
  type FlightSummary,
} from '../../shared/schemas/flights';
import { User } from '../auth/user.entity';
import type { Config } from '../config';
import { AppError, BadRequestError, ForbiddenError } from '../http/errors';
import type { MailQuota } from '../mail/mail-quota';
import type { Mailer } from '../mail/mailer';
import { reviewDoneMail, reviewRequestMail } from '../mail/templates';
import { Membership } from '../teams/membership.entity';
import type { TeamsService } from '../teams/teams.service';
import { Flight } from './flight.entity';
import { loadSummary } from './flight-rows';
import type { FlightsService } from './flights.service';

/** Asking team members to review a flight, and their answer; both mailed. */
export class ReviewsService {
  constructor(
    private readonly ds: DataSource,
    private readonly config: Pick<Config, 'publicUrl'>,
    private readonly flights: FlightsService,
    private readonly teams: TeamsService,
    private readonly mailer: Mailer,
    private readonly reviewRequestQuota: MailQuota,
  ) {}

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
    const f = await this.flights.access(userId, id, 'flights.requestReview');
    const own = f.pilotId === userId;
    if (!canOnRecord(f.role, 'flights.requestReviewAny', 'flights.requestReview', own))
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
    await this.ds
      .getRepository(Flight)
      .update({ id }, { reviewState: 'requested', updatedAt: Date.now() });
    const summary = await loadSummary(this.ds, id);
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
    const f = await this.flights.access(userId, id, 'flights.review');
    await this.ds
      .getRepository(Flight)
      .update({ id }, { reviewState: input.state, updatedAt: Date.now() });
    const summary = await loadSummary(this.ds, id);
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
