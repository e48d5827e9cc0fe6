import { rateLimit, type Store } from 'express-rate-limit';
import type { Config } from '../config';
import { AppError } from './errors';
import { errorCodes } from '../../shared/api/error';

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
    handler: (_req, _res, next, options) => {
      next(
        new AppError(
          429,
          errorCodes.rateLimited,
          `Too many attempts. Try again in ${Math.ceil(options.windowMs / 60_000)} minutes.`,
        ),
      );
    },
  });
}
