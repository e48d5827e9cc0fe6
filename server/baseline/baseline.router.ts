import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import { BaselineQuery, type AircraftBaseline } from '../../shared/schemas/baseline';
import { IdParam } from '../../shared/schemas/common';
import { requireUser } from '../http/session';
import type { Services } from '../services';

export function baselineRouter({ baseline }: Services) {
  const router = Router();
  router.get(paths.aircraftBaseline, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    res.json(
      (await baseline.before(
        user.id,
        id,
        BaselineQuery.parse(req.query),
      )) satisfies AircraftBaseline,
    );
  });
  return router;
}
