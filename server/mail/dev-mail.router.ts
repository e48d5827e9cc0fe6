import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import type { DevMailList } from '../../shared/schemas/mail';
import type { Config } from '../config';
import { ForbiddenError, NotFoundError } from '../http/errors';
import type { Mailer } from './mailer';

const loopback = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);
/** Any of these means a proxy relayed the request, so "it came from loopback" proves nothing. */
const proxyHeaders = ['x-forwarded-for', 'forwarded', 'x-real-ip'];

/**
 * The dev inbox, mounted only with MAIL_FAKE=1. It shows invite and reset links, so it answers
 * only requests made directly on this machine: anything relayed by a proxy is refused, and
 * outside development a request from another address is told the route does not exist (a
 * demo reachable on the field LAN must not hand out other people's reset links).
 */
export function devMailRouter(mailer: Mailer, config: Pick<Config, 'env'>) {
  const router = Router();
  const inbox = mailer.inbox;
  if (!inbox) return router;
  router.use(paths.devMail, (req, _res, next) => {
    if (proxyHeaders.some((h) => req.headers[h] !== undefined))
      throw new ForbiddenError('The dev inbox does not answer requests relayed by a proxy.');
    if (config.env === 'production' && !loopback.has(req.socket.remoteAddress ?? ''))
      throw new NotFoundError(`Route ${req.method} ${req.path}`);
    next();
  });
  router.get(paths.devMail, async (_req, res) => {
    await mailer.idle();
    res.set('cache-control', 'no-store').json({ messages: inbox.messages() } satisfies DevMailList);
  });
  router.delete(paths.devMail, (_req, res) => {
    inbox.clear();
    res.status(204).end();
  });
  return router;
}
