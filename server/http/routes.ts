import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { requireUser } from './session';
import { expectedVersion, sendVersion } from './versions';

/**
 * Handlers for the three route shapes every resource repeats, so a route names only its schemas
 * and its service call. Each reads the request in the order the routes always have — session
 * (401), path parameters, then body (400), then If-Match — all before the service runs, so a
 * refused request changes nothing.
 */

/** POST that makes something new: 201 with what was stored. */
export function createRoute<P extends z.ZodType, B extends z.ZodType, T>(
  params: P,
  body: B,
  create: (userId: string, params: z.output<P>, body: z.output<B>) => Promise<T>,
): RequestHandler {
  return async (req, res) => {
    const user = requireUser(req);
    const p = params.parse(req.params);
    res.status(201).json(await create(user.id, p, body.parse(req.body)));
  };
}

/**
 * PATCH or PUT of a versioned record: passes the If-Match version to the service (which answers
 * 412 when it is stale) and sends the saved version as the ETag.
 */
export function versionedWriteRoute<
  P extends z.ZodType,
  B extends z.ZodType,
  T extends { version: number },
>(
  params: P,
  body: B,
  write: (
    userId: string,
    params: z.output<P>,
    body: z.output<B>,
    expected: number | undefined,
  ) => Promise<T>,
): RequestHandler {
  return async (req, res) => {
    const user = requireUser(req);
    const p = params.parse(req.params);
    const saved = await write(user.id, p, body.parse(req.body), expectedVersion(req));
    sendVersion(res, saved.version).json(saved);
  };
}

/** DELETE: 204 with no body. */
export function deleteRoute<P extends z.ZodType>(
  params: P,
  remove: (userId: string, params: z.output<P>) => Promise<unknown>,
): RequestHandler {
  return async (req, res) => {
    const user = requireUser(req);
    await remove(user.id, params.parse(req.params));
    res.status(204).end();
  };
}
