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
import { expectedVersion, sendVersion } from '../http/versions';
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
  router.post(paths.presets, async (req, res) => {
    const user = requireUser(req);
    const { teamId } = TeamIdParam.parse(req.params);
    res
      .status(201)
      .json((await presets.create(user.id, teamId, PresetInput.parse(req.body))) satisfies Preset);
  });
  router.patch(paths.preset, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    const preset = await presets.update(
      user.id,
      id,
      PresetPatch.parse(req.body),
      expectedVersion(req),
    );
    sendVersion(res, preset.version).json(preset satisfies Preset);
  });
  router.delete(paths.preset, async (req, res) => {
    const user = requireUser(req);
    await presets.remove(user.id, IdParam.parse(req.params).id);
    res.status(204).end();
  });

  return router;
}
