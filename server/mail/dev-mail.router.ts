import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import type { DevMailList } from '../../shared/schemas/mail';
import type { Config } from '../config';
import { NotFoundError } from '../http/errors';
import type { Mailer } from './mailer';

const loopback = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

/**
 * The dev inbox: only mounted while the fake SMTP server catches mail. It shows invite and
 * reset links, so outside development it answers only requests from this machine (a demo
 * reachable on the field LAN must not hand out other people's reset links).
 */
export function devMailRouter(mailer: Mailer, config: Pick<Config, 'env'>) {
  const router = Router();
  const inbox = mailer.inbox;
  if (!inbox) return router;
  if (config.env === 'production') {
    router.use(paths.devMail, (req, _res, next) => {
      if (!loopback.has(req.socket.remoteAddress ?? ''))
        throw new NotFoundError(`Route ${req.method} ${req.path}`);
      next();
    });
  }
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
