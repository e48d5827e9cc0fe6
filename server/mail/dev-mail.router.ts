import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import type { DevMailList } from '../../shared/schemas/mail';
import type { Mailer } from './mailer';

/** The dev inbox: only mounted while the fake SMTP server catches mail. */
export function devMailRouter(mailer: Mailer) {
  const router = Router();
  const inbox = mailer.inbox;
  if (!inbox) return router;
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
