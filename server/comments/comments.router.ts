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
import { deleteRoute, versionedWriteRoute } from '../http/routes';
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

  router.patch(
    paths.comment,
    versionedWriteRoute(
      IdParam,
      CommentPatch,
      (userId, { id }, patch, version) =>
        comments.patch(userId, id, patch, version) satisfies Promise<Comment>,
    ),
  );

  router.delete(
    paths.comment,
    deleteRoute(IdParam, (userId, { id }) => comments.remove(userId, id)),
  );

  return router;
}
