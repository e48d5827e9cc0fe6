import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import { InviteParam, TeamIdParam, TokenParam } from '../../shared/schemas/common';
import {
  InviteInput,
  type AcceptInviteResponse,
  type Invite,
  type InviteList,
  type InvitePreview,
} from '../../shared/schemas/teams';
import { inviteRateLimits } from '../http/rate-limit';
import { deleteRoute } from '../http/routes';
import { requireUser } from '../http/session';
import type { Services } from '../services';

export function invitesRouter({ invites, rateLimits }: Services) {
  const router = Router();

  router.get(paths.invites, async (req, res) => {
    const user = requireUser(req);
    res.json({
      invites: await invites.list(user.id, TeamIdParam.parse(req.params).teamId),
    } satisfies InviteList);
  });
  router.post(paths.invites, ...inviteRateLimits(rateLimits), async (req, res) => {
    const user = requireUser(req);
    const { teamId } = TeamIdParam.parse(req.params);
    const { invite, created } = await invites.create(user.id, teamId, InviteInput.parse(req.body));
    res.status(created ? 201 : 200).json(invite satisfies Invite);
  });
  router.delete(
    paths.teamInvite,
    deleteRoute(InviteParam, (userId, { teamId, inviteId }) =>
      invites.withdraw(userId, teamId, inviteId),
    ),
  );
  /** Shown on the invite page before signing in. */
  router.get(paths.invite, async (req, res) => {
    res.json((await invites.preview(TokenParam.parse(req.params).token)) satisfies InvitePreview);
  });
  router.post(paths.acceptInvite, async (req, res) => {
    const user = requireUser(req);
    const team = await invites.accept(user.id, TokenParam.parse(req.params).token);
    res.json({ team } satisfies AcceptInviteResponse);
  });

  return router;
}
