import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import { InviteParam, MemberParam, TeamIdParam, TokenParam } from '../../shared/schemas/common';
import {
  InviteInput,
  MemberPatch,
  TeamInput,
  TeamPatch,
  type AcceptInviteResponse,
  type Invite,
  type InviteList,
  type InvitePreview,
  type Member,
  type MemberList,
  type Team,
  type TeamList,
} from '../../shared/schemas/teams';
import { ThresholdsInput, type TeamThresholds } from '../../shared/schemas/thresholds';
import { inviteRateLimits } from '../http/rate-limit';
import { requireUser } from '../http/session';
import { expectedVersion, sendVersion } from '../http/versions';
import type { Services } from '../services';

export function teamsRouter({ teams, thresholds, rateLimits }: Services) {
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
  router.delete(paths.member, async (req, res) => {
    const actor = requireUser(req);
    const { teamId, userId } = MemberParam.parse(req.params);
    await teams.removeMember(actor.id, teamId, userId);
    res.status(204).end();
  });

  router.get(paths.invites, async (req, res) => {
    const user = requireUser(req);
    res.json({
      invites: await teams.invites(user.id, TeamIdParam.parse(req.params).teamId),
    } satisfies InviteList);
  });
  router.post(paths.invites, ...inviteRateLimits(rateLimits), async (req, res) => {
    const user = requireUser(req);
    const { teamId } = TeamIdParam.parse(req.params);
    const { invite, created } = await teams.invite(user.id, teamId, InviteInput.parse(req.body));
    res.status(created ? 201 : 200).json(invite satisfies Invite);
  });
  router.delete(paths.teamInvite, async (req, res) => {
    const user = requireUser(req);
    const { teamId, inviteId } = InviteParam.parse(req.params);
    await teams.withdrawInvite(user.id, teamId, inviteId);
    res.status(204).end();
  });
  /** Shown on the invite page before signing in. */
  router.get(paths.invite, async (req, res) => {
    res.json(
      (await teams.previewInvite(TokenParam.parse(req.params).token)) satisfies InvitePreview,
    );
  });
  router.post(paths.acceptInvite, async (req, res) => {
    const user = requireUser(req);
    const team = await teams.acceptInvite(user.id, TokenParam.parse(req.params).token);
    res.json({ team } satisfies AcceptInviteResponse);
  });

  router.get(paths.thresholds, async (req, res) => {
    const user = requireUser(req);
    const t = await thresholds.get(user.id, TeamIdParam.parse(req.params).teamId);
    sendVersion(res, t.version).json(t satisfies TeamThresholds);
  });
  router.put(paths.thresholds, async (req, res) => {
    const user = requireUser(req);
    const { teamId } = TeamIdParam.parse(req.params);
    const t = await thresholds.put(
      user.id,
      teamId,
      ThresholdsInput.parse(req.body),
      expectedVersion(req),
    );
    sendVersion(res, t.version).json(t satisfies TeamThresholds);
  });

  return router;
}
