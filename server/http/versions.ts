import type { Request, Response } from 'express';
import { errorCodes } from '../../shared/api/error';
import { AppError, BadRequestError } from './errors';

/**
 * The version a write expects, from `If-Match: "7"` (a weak `W/"7"` or a bare 7 too); undefined
 * when the header is absent, so writes without it keep working as before.
 */
export function expectedVersion(req: Request): number | undefined {
  const raw = req.headers['if-match'];
  if (raw === undefined || raw.trim() === '*') return undefined;
  const m = /^\s*(?:W\/)?"?(\d{1,15})"?\s*$/.exec(raw);
  if (!m) throw new BadRequestError('If-Match must name a version, e.g. "3".');
  return Number(m[1]);
}

/** The version of what a response carries, as its ETag. */
export function sendVersion(res: Response, version: number): Response {
  return res.set('etag', `"${version}"`);
}

/** 412: someone else saved first. Carries the current version so the client can offer both. */
export class VersionConflictError extends AppError {
  constructor(
    readonly currentVersion: number,
    what: string,
  ) {
    super(
      412,
      errorCodes.versionConflict,
      `${what} was changed by someone else (now version ${currentVersion}). Reload to see their change, or save again to overwrite it.`,
    );
  }
}
