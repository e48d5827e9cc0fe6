import { z } from 'zod';
import { Id, IsoDateTime, UserRef } from './common';

export const CommentBody = z.string().trim().min(1, 'write something').max(10_000);

/** `PUT /api/comments/:id` — the id is the client's UUID, so an offline retry stores one comment. */
export const CommentPutInput = z.object({
  flightId: Id,
  /** Moment in the flight, s. */
  tS: z.number().min(0).max(1e6),
  body: CommentBody,
  /** Reply to this root comment. */
  parentId: Id.optional(),
  /** Channel the comment is about, e.g. `gyro_x` or `motor3`. */
  channel: z.string().trim().min(1).max(40).optional(),
  /** Team members @mentioned in the body; each gets an e-mail. */
  mentions: z.array(Id).max(20).default([]),
});
export type CommentPutInput = z.input<typeof CommentPutInput>;

/** Edit own text, or resolve / reopen a thread. */
export const CommentPatch = z
  .object({
    body: CommentBody.optional(),
    mentions: z.array(Id).max(20).optional(),
    resolved: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'nothing to change');
export type CommentPatch = z.infer<typeof CommentPatch>;

export const Comment = z.object({
  id: Id,
  flightId: Id,
  parentId: Id.nullable(),
  tS: z.number(),
  channel: z.string().nullable(),
  /** Empty when deleted; the thread stays so replies keep their place. */
  body: z.string(),
  deleted: z.boolean(),
  author: UserRef,
  mentions: z.array(UserRef),
  resolvedAt: IsoDateTime.nullable(),
  resolvedBy: UserRef.nullable(),
  editedAt: IsoDateTime.nullable(),
  createdAt: IsoDateTime,
  /** Adds one on every write; send it back in If-Match to refuse overwriting a newer one. */
  version: z.number().int().positive(),
});
export type Comment = z.infer<typeof Comment>;

/** Ordered by time in the flight, then creation; replies carry parentId. */
export const CommentList = z.object({ comments: z.array(Comment) });
export type CommentList = z.infer<typeof CommentList>;
