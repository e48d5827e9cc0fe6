import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import { MemberParam, TeamIdParam } from '../../shared/schemas/common';
import {
  MemberPatch,
  TeamInput,
  TeamPatch,
  type Member,
  type MemberList,
  type Team,
  type TeamList,
} from '../../shared/schemas/teams';
import { ThresholdsInput, type TeamThresholds } from '../../shared/schemas/thresholds';
import { requireUser } from '../http/session';
import { deleteRoute, versionedWriteRoute } from '../http/routes';
import { sendVersion } from '../http/versions';
import type { Services } from '../services';

export function teamsRouter({ teams, thresholds }: Services) {
  const router = Router();

  router.get(paths.teams, async (req, res) => {
    res.json({ teams: await teams.list(requireUser(req).id) } satisfies TeamList);
  });
  router.post(paths.teams, async (req, res) => {
    const user = requireUser(req);
    res
      .status(201)
      .json((await teams.create(user.id, TeamInput.parse(req.body).name)) satisfies Team);
  });
  router.get(paths.team, async (req, res) => {
    const user = requireUser(req);
    res.json((await teams.get(user.id, TeamIdParam.parse(req.params).teamId)) satisfies Team);
  });
  router.patch(paths.team, async (req, res) => {
    const user = requireUser(req);
    const { teamId } = TeamIdParam.parse(req.params);
    res.json((await teams.rename(user.id, teamId, TeamPatch.parse(req.body).name)) satisfies Team);
  });

  router.get(paths.members, async (req, res) => {
    const user = requireUser(req);
    res.json({
      members: await teams.members(user.id, TeamIdParam.parse(req.params).teamId),
    } satisfies MemberList);
  });
  router.patch(paths.member, async (req, res) => {
    const actor = requireUser(req);
    const { teamId, userId } = MemberParam.parse(req.params);
    res.json(
      (await teams.setRole(
        actor.id,
        teamId,
        userId,
        MemberPatch.parse(req.body).role,
      )) satisfies Member,
    );
  });
  router.delete(
    paths.member,
    deleteRoute(MemberParam, (actorId, { teamId, userId }) =>
      teams.removeMember(actorId, teamId, userId),
    ),
  );

  router.get(paths.thresholds, async (req, res) => {
    const user = requireUser(req);
    const t = await thresholds.get(user.id, TeamIdParam.parse(req.params).teamId);
    sendVersion(res, t.version).json(t satisfies TeamThresholds);
  });
  router.put(
    paths.thresholds,
    versionedWriteRoute(
      TeamIdParam,
      ThresholdsInput,
      (userId, { teamId }, input, version) =>
        thresholds.put(userId, teamId, input, version) satisfies Promise<TeamThresholds>,
    ),
  );

  return router;
}
