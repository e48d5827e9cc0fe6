import { ipKeyGenerator, rateLimit, type Options, type Store } from 'express-rate-limit';
import { HOUR_MS, limits } from '../limits';
import type { Config } from '../config';
import { AppError } from './errors';
import { errorCodes } from '../../shared/api/error';
import { Email } from '../../shared/schemas/auth';
import { TeamIdParam } from '../../shared/schemas/common';

const tooMany =
  (what: string): Options['handler'] =>
  (_req, _res, next, options) => {
    next(
      new AppError(
        429,
        errorCodes.rateLimited,
        `${what} Try again in ${Math.ceil(options.windowMs / 60_000)} minutes.`,
      ),
    );
  };

/**
 * Per-address limit for the routes that guess passwords or send mail. Pass the shared store
 * (see rate-limit-store.ts) so the limit holds across server processes.
 */
export function authRateLimit(config: Pick<Config, 'authRateLimit'>, store?: Store) {
  return rateLimit({
    ...(store && { store }),
    windowMs: config.authRateLimit.windowMs,
    limit: config.authRateLimit.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: tooMany('Too many attempts.'),
  });
}

/**
 * Failed sign-ins per client address and account: good sign-ins are not counted, so a crew
 * signing in all day from one field router is never locked out, and guessing one account's
 * password from one address stops at the limit.
 */
export function signInRateLimit(config: Pick<Config, 'authRateLimit'>, store?: Store) {
  return rateLimit({
    ...(store && { store }),
    windowMs: config.authRateLimit.windowMs,
    limit: config.authRateLimit.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    // The account is the address as sign-in reads it. Anything else counts under the client
    // address alone: the limiter runs before the route's parse, and raw text as a key would
    // let each request open a fresh counter and park up to a body's size in the store.
    keyGenerator: (req) => {
      const email = Email.safeParse((req.body as { email?: unknown } | undefined)?.email);
      return `${ipKeyGenerator(req.ip ?? '')}|${email.success ? email.data : ''}`;
    },
    handler: tooMany('Too many failed sign-ins.'),
  });
}

/**
 * Invitations per inviter and per team per hour. Refused requests (not a member, not the
 * owner, bad input) are not counted, so nobody can use up another team's allowance.
 */
export function inviteRateLimits(stores: { store(name: string): Store | undefined }) {
  const perInviter = stores.store('invites-per-inviter');
  const perTeam = stores.store('invites-per-team');
  const common = {
    windowMs: HOUR_MS,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipFailedRequests: true,
    handler: tooMany('Too many invitations sent in the last hour.'),
  } as const;
  return [
    rateLimit({
      ...common,
      ...(perInviter && { store: perInviter }),
      limit: limits.invitesPerInviterPerHour,
      keyGenerator: (req) => `inviter:${req.auth?.user.id ?? 'anonymous'}`,
    }),
    rateLimit({
      ...common,
      ...(perTeam && { store: perTeam }),
      limit: limits.invitesPerTeamPerHour,
      // Parsed like the route's own path: a malformed id is refused there, so never counted.
      keyGenerator: (req) => {
        const team = TeamIdParam.safeParse(req.params);
        return `team:${team.success ? team.data.teamId : 'malformed'}`;
      },
    }),
  ];
}
