import { z } from 'zod';
import {
  Comment,
  CommentList,
  type CommentPatch,
  type CommentPutInput,
} from '../../../../shared/schemas/comments';
import { MemberList } from '../../../../shared/schemas/teams';
import { OkResponse } from '../../../../shared/schemas/auth';
import type { ReviewRequestInput } from '../../../../shared/schemas/flights';
import { apiFetch } from '../../../lib/api-fetch';

export const commentPath = (id: string) => `/api/comments/${encodeURIComponent(id)}`;
export const flightCommentsPath = (flightId: string) =>
  `/api/flights/${encodeURIComponent(flightId)}/comments`;
export const reviewRequestPath = (flightId: string) =>
  `/api/flights/${encodeURIComponent(flightId)}/review-request`;

export const fetchComments = (flightId: string) =>
  apiFetch(flightCommentsPath(flightId), CommentList);

export const putComment = (id: string, input: CommentPutInput) =>
  apiFetch(commentPath(id), Comment, { method: 'PUT', json: input });

export const patchComment = (id: string, patch: CommentPatch) =>
  apiFetch(commentPath(id), Comment, { method: 'PATCH', json: patch });

export const deleteComment = (id: string) =>
  apiFetch(commentPath(id), z.unknown(), { method: 'DELETE' });

export const fetchMembers = (teamId: string) =>
  apiFetch(`/api/teams/${encodeURIComponent(teamId)}/members`, MemberList);

export const requestReview = (flightId: string, input: ReviewRequestInput) =>
  apiFetch(reviewRequestPath(flightId), z.union([OkResponse, z.object({}).loose()]), {
    method: 'POST',
    json: input,
  });
