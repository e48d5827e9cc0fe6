import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { paths } from '../../shared/api/paths';
import type { HealthResponse } from '../../shared/schemas/health';
import { AppError } from './errors';

/** `devMail`: whether the fake inbox is mounted (MAIL_FAKE), told to the client. */
export function healthRouter(dataSource: DataSource, devMail: boolean) {
  const router = Router();
  router.get(paths.health, async (req, res) => {
    try {
      const rows = (await dataSource.query('SELECT 1 AS ok')) as { ok: number }[];
      if (rows[0]?.ok !== 1) throw new Error('unexpected answer from SELECT 1');
    } catch (err) {
      req.log?.error({ err }, 'health check: database did not answer');
      throw new AppError(503, 'unavailable', 'The database is not answering.');
    }
    const body: HealthResponse = { ok: true, db: 'ok', devMail };
    res.set('cache-control', 'no-store').json(body);
  });
  return router;
}
