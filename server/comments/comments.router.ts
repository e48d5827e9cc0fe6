import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import {
  CommentPatch,
  CommentPutInput,
  type Comment,
  type CommentList,
} from '../../shared/schemas/comments';
import { IdParam } from '../../shared/schemas/common';
import { requireUser } from '../http/session';
import { expectedVersion, sendVersion } from '../http/versions';
import type { Services } from '../services';

export function commentsRouter({ comments }: Services) {
  const router = Router();

  router.get(paths.flightComments, async (req, res) => {
    const user = requireUser(req);
    res.json({
      comments: await comments.list(user.id, IdParam.parse(req.params).id),
    } satisfies CommentList);
  });

  /** 201 when stored now, 200 when this id was already stored by the same author (a retry). */
  router.put(paths.comment, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    const { comment, created } = await comments.put(user.id, id, CommentPutInput.parse(req.body));
    res.status(created ? 201 : 200).json(comment satisfies Comment);
  });

  router.patch(paths.comment, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    const comment = await comments.patch(
      user.id,
      id,
      CommentPatch.parse(req.body),
      expectedVersion(req),
    );
    sendVersion(res, comment.version).json(comment satisfies Comment);
  });

  router.delete(paths.comment, async (req, res) => {
    const user = requireUser(req);
    await comments.remove(user.id, IdParam.parse(req.params).id);
    res.status(204).end();
  });

  return router;
}
