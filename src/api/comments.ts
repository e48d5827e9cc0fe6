import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { pathTo } from '../../shared/api/paths';
import {
  Comment,
  CommentList,
  type CommentPatch,
  type CommentPutInput,
} from '../../shared/schemas/comments';
import type { UserRef } from '../../shared/schemas/common';
import { apiFetch } from '../lib/api-fetch';
import { enqueue } from '../lib/local-db';

/** Comments pinned to moments of a flight. Writes made offline wait in the outbox. */
export const commentKeys = {
  all: ['comments'] as const,
  flights: () => [...commentKeys.all, 'flight'] as const,
  flight: (flightId: string) => [...commentKeys.flights(), flightId] as const,
};

const commentPath = (id: string) => pathTo('comment', { id });
const fetchComments = (flightId: string) =>
  apiFetch(pathTo('flightComments', { id: flightId }), CommentList);
const putComment = (id: string, input: CommentPutInput) =>
  apiFetch(commentPath(id), Comment, { method: 'PUT', json: input });
const patchComment = (id: string, patch: CommentPatch, version?: number) =>
  apiFetch(commentPath(id), Comment, { method: 'PATCH', json: patch, version });
/** 204 with no body. */
const deleteComment = (id: string) =>
  apiFetch(commentPath(id), z.undefined(), { method: 'DELETE' });

export const commentQueries = {
  flight: (flightId: string) =>
    queryOptions({
      queryKey: commentKeys.flight(flightId),
      queryFn: () => fetchComments(flightId),
      staleTime: 10_000,
    }),
};

export const useFlightComments = (flightId: string, enabled = true) =>
  useQuery({ ...commentQueries.flight(flightId), enabled });

export interface NewComment {
  id: string;
  flightId: string;
  tS: number;
  body: string;
  parentId?: string;
  channel?: string;
  mentions: UserRef[];
}

/** fetch rejects with a TypeError only when the request never reached a server. */
const isOffline = (e: unknown) =>
  e instanceof TypeError || (typeof navigator !== 'undefined' && navigator.onLine === false);

function optimistic(input: NewComment, author: UserRef): Comment {
  return {
    id: input.id,
    flightId: input.flightId,
    parentId: input.parentId ?? null,
    tS: input.tS,
    channel: input.channel ?? null,
    body: input.body,
    deleted: false,
    author,
    mentions: input.mentions,
    resolvedAt: null,
    resolvedBy: null,
    editedAt: null,
    createdAt: new Date().toISOString(),
    version: 1,
  };
}

type Snapshot = { previous: CommentList | undefined };

/** Shows the change at once; restores the list if the server refuses it. */
function useOptimistic(flightId: string) {
  const queryClient = useQueryClient();
  const key = commentKeys.flight(flightId);
  return {
    queryClient,
    key,
    async apply(change: (list: Comment[]) => Comment[]): Promise<Snapshot> {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<CommentList>(key);
      queryClient.setQueryData<CommentList>(key, { comments: change(previous?.comments ?? []) });
      return { previous };
    },
    rollback(snapshot: Snapshot | undefined) {
      if (snapshot) queryClient.setQueryData(key, snapshot.previous);
    },
    settle: () => queryClient.invalidateQueries({ queryKey: key }),
  };
}

/**
 * Adds a comment (or a reply). Offline, the write waits in the outbox and the comment stays in
 * the list, so nothing typed is lost; the id is the client's, so the later send stores one.
 */
export function useAddComment(flightId: string, author: UserRef) {
  const o = useOptimistic(flightId);
  return useMutation({
    // Offline it must run, to reach the outbox; a paused mutation is lost with the tab.
    networkMode: 'always',
    mutationFn: async (input: NewComment) => {
      const body = {
        flightId: input.flightId,
        tS: input.tS,
        body: input.body,
        mentions: input.mentions.map((m) => m.id),
        ...(input.parentId ? { parentId: input.parentId } : {}),
        ...(input.channel ? { channel: input.channel } : {}),
      };
      try {
        return { comment: await putComment(input.id, body), queued: false };
      } catch (e) {
        if (!isOffline(e)) throw e;
        await enqueue({ id: input.id, method: 'PUT', path: commentPath(input.id), body });
        return { comment: optimistic(input, author), queued: true };
      }
    },
    onMutate: (input) => o.apply((list) => [...list, optimistic(input, author)]),
    onError: (_e, _input, snapshot) => o.rollback(snapshot),
    onSuccess: (result) => (result.queued ? undefined : o.settle()),
  });
}

/** An edit or a resolve; `version` is the comment's as shown, so a newer one is not overwritten. */
export interface CommentEdit {
  id: string;
  patch: CommentPatch;
  version?: number;
  /** In words, for the sync list should it wait offline ("Edit of your comment at 7.50 s"). */
  label?: string;
}

/**
 * Edits or resolves a comment. Offline, the edit waits in the outbox with the version it started
 * from; if someone else changed the comment meanwhile, the sync list offers overwrite or drop.
 */
export function useUpdateComment(flightId: string, me: UserRef) {
  const o = useOptimistic(flightId);
  return useMutation({
    networkMode: 'always',
    mutationFn: async ({ id, patch, version, label }: CommentEdit) => {
      try {
        return { comment: await patchComment(id, patch, version), queued: false };
      } catch (e) {
        if (!isOffline(e)) throw e;
        await enqueue({ id, method: 'PATCH', path: commentPath(id), body: patch, version, label });
        return { comment: null, queued: true };
      }
    },
    onMutate: ({ id, patch }) =>
      o.apply((list) =>
        list.map((c) =>
          c.id !== id
            ? c
            : {
                ...c,
                ...(patch.body !== undefined
                  ? { body: patch.body, editedAt: new Date().toISOString() }
                  : {}),
                ...(patch.resolved === true
                  ? { resolvedAt: new Date().toISOString(), resolvedBy: me }
                  : {}),
                ...(patch.resolved === false ? { resolvedAt: null, resolvedBy: null } : {}),
              },
        ),
      ),
    onError: (_e, _v, snapshot) => o.rollback(snapshot),
    onSuccess: (result, { id, version }) =>
      result.queued
        ? // The queued edit will make the next version: a second edit offline builds on it.
          o.apply((list) =>
            list.map((c) => (c.id === id ? { ...c, version: (version ?? c.version) + 1 } : c)),
          )
        : o.settle(),
  });
}

/** Take the flight's comments as the server holds them now (after someone else saved first). */
export function useReloadComments(flightId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.refetchQueries({ queryKey: commentKeys.flight(flightId), exact: true });
}

export function useDeleteComment(flightId: string) {
  const o = useOptimistic(flightId);
  return useMutation({
    mutationFn: (id: string) => deleteComment(id),
    onMutate: (id) =>
      o.apply((list) => list.map((c) => (c.id === id ? { ...c, body: '', deleted: true } : c))),
    onError: (_e, _v, snapshot) => o.rollback(snapshot),
    onSuccess: () => o.settle(),
  });
}
