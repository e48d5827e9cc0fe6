import type { DataSource } from 'typeorm';
import { AuthService } from './auth/auth.service';
import { CommentsService } from './comments/comments.service';
import type { Config } from './config';
import { AircraftService } from './aircraft/aircraft.service';
import { BaselineService } from './baseline/baseline.service';
import { FlightsService } from './flights/flights.service';
import { openRawStore } from './flights/open-raw-store';
import { RawLogsService } from './flights/raw-logs.service';
import type { RawStore } from './flights/raw-store';
import { ReviewsService } from './flights/reviews.service';
import { createRateLimitStores, type RateLimitStores } from './http/rate-limit-store';
import { HOUR_MS, limits } from './limits';
import { MailQuota } from './mail/mail-quota';
import type { Mailer } from './mail/mailer';
import { PresetsService } from './presets/presets.service';
import { InvitesService } from './teams/invites.service';
import { TeamsService } from './teams/teams.service';
import { ThresholdsService } from './teams/thresholds.service';

export interface Services {
  auth: AuthService;
  teams: TeamsService;
  invites: InvitesService;
  thresholds: ThresholdsService;
  aircraft: AircraftService;
  baseline: BaselineService;
  flights: FlightsService;
  rawLogs: RawLogsService;
  reviews: ReviewsService;
  comments: CommentsService;
  presets: PresetsService;
  mailer: Mailer;
  /** Counters of every rate limiter (Redis when REDIS_URL is set). */
  rateLimits: RateLimitStores;
}

/**
 * Every service, callable without HTTP (demo loading, CLIs, tests). Each method takes the
 * acting user's id first and checks that user's role itself.
 */
export function createServices(
  dataSource: DataSource,
  config: Config,
  mailer: Mailer,
  rawStore: RawStore = openRawStore(config),
): Services {
  const teams = new TeamsService(dataSource);
  const rateLimits = createRateLimitStores(config);
  // The records release raw logs they no longer refer to, and the raw logs check access
  // through the records; the callback reaches `rawLogs` only once both exist.
  const flights: FlightsService = new FlightsService(dataSource, teams, (key) =>
    rawLogs.release(key),
  );
  const rawLogs: RawLogsService = new RawLogsService(dataSource, flights, rawStore);
  const thresholds = new ThresholdsService(dataSource, teams);
  const aircraft = new AircraftService(dataSource, teams, (key) => rawLogs.release(key));
  return {
    auth: new AuthService(dataSource, config, mailer),
    teams,
    invites: new InvitesService(dataSource, config, mailer, teams),
    thresholds,
    aircraft,
    baseline: new BaselineService(dataSource, aircraft, thresholds),
    flights,
    rawLogs,
    reviews: new ReviewsService(
      dataSource,
      config,
      flights,
      teams,
      mailer,
      new MailQuota(
        limits.reviewRequestMailsPerPersonPerHour,
        HOUR_MS,
        rateLimits.store('review-request-mail'),
      ),
    ),
    comments: new CommentsService(
      dataSource,
      config,
      flights,
      mailer,
      new MailQuota(limits.mentionMailsPerPersonPerHour, HOUR_MS, rateLimits.store('mention-mail')),
    ),
    presets: new PresetsService(dataSource, teams),
    mailer,
    rateLimits,
  };
}
