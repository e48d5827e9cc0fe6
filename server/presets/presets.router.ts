import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import { IdParam, TeamIdParam } from '../../shared/schemas/common';
import {
  PresetInput,
  PresetPatch,
  type Preset,
  type PresetList,
} from '../../shared/schemas/presets';
import { requireUser } from '../http/session';
import { createRoute, deleteRoute, versionedWriteRoute } from '../http/routes';
import type { Services } from '../services';

/** A team's import presets: saved column maps for log layouts it meets often. */
export function presetsRouter({ presets }: Services) {
  const router = Router();

  router.get(paths.presets, async (req, res) => {
    const user = requireUser(req);
    res.json({
      presets: await presets.list(user.id, TeamIdParam.parse(req.params).teamId),
    } satisfies PresetList);
  });
  router.post(
    paths.presets,
    createRoute(
      TeamIdParam,
      PresetInput,
      (userId, { teamId }, input) =>
        presets.create(userId, teamId, input) satisfies Promise<Preset>,
    ),
  );
  router.patch(
    paths.preset,
    versionedWriteRoute(
      IdParam,
      PresetPatch,
      (userId, { id }, patch, version) =>
        presets.update(userId, id, patch, version) satisfies Promise<Preset>,
    ),
  );
  router.delete(
    paths.preset,
    deleteRoute(IdParam, (userId, { id }) => presets.remove(userId, id)),
  );

  return router;
}
