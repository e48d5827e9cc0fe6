import { z } from 'zod';
import {
  Comment,
  CommentList,
  type CommentPatch,
  type CommentPutInput,
} from '../../../../shared/schemas/comments';
import { MemberList } from '../../../../shared/schemas/teams';
import { FlightSummary, type ReviewRequestInput } from '../../../../shared/schemas/flights';
import { pathTo } from '../../../../shared/api/paths';
import { apiFetch } from '../../../lib/api-fetch';

export const commentPath = (id: string) => pathTo('comment', { id });
export const flightCommentsPath = (flightId: string) => pathTo('flightComments', { id: flightId });
export const reviewRequestPath = (flightId: string) => pathTo('reviewRequest', { id: flightId });

export const fetchComments = (flightId: string) =>
  apiFetch(flightCommentsPath(flightId), CommentList);

export const putComment = (id: string, input: CommentPutInput) =>
  apiFetch(commentPath(id), Comment, { method: 'PUT', json: input });

export const patchComment = (id: string, patch: CommentPatch) =>
  apiFetch(commentPath(id), Comment, { method: 'PATCH', json: patch });

/** 204 with no body. */
export const deleteComment = (id: string) =>
  apiFetch(commentPath(id), z.undefined(), { method: 'DELETE' });

export const fetchMembers = (teamId: string) => apiFetch(pathTo('members', { teamId }), MemberList);

/** The pilot asks team members (a coach) to review; they get an e-mail. */
export const requestReview = (flightId: string, input: ReviewRequestInput) =>
  apiFetch(reviewRequestPath(flightId), FlightSummary, { method: 'POST', json: input });
