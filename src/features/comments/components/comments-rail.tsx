import { forwardRef, useImperativeHandle, useMemo, useRef, useState } from 'react';
import type { Role, UserRef } from '../../../../shared/schemas/common';
import {
  useAddComment,
  useDeleteComment,
  useFlightComments,
  useReloadComments,
  useUpdateComment,
} from '../../../api/comments';
import { unlessConflict, VersionConflict } from '../../../components/ui/version-conflict';
import { useMembers } from '../../../api/members';
import { useRequestReview } from '../../../api/reviews';
import { commentRights } from '../model/permissions';
import { toThreads } from '../model/threads';
import { CommentComposer, type ComposerHandle } from './comment-composer';
import { CommentThread } from './comment-thread';

export interface CommentsRailHandle {
  /** Open the box at the cursor (the `c` key). */
  composeAtCursor: () => void;
}

export interface CommentsRailProps {
  flightId: string;
  /** The flight's team, or null while it lives only on this device. */
  teamId: string | null;
  /** The flight has a team but the sync has not sent it yet. */
  waitingForSync?: boolean;
  me: UserRef | null;
  role: Role | null;
  /** Who flew it: a pilot resolves threads on their own flights. */
  pilotId: string | null;
  cursorT: number | null;
  onSeek: (tS: number) => void;
  /** Comment to highlight (from a link or a pin). */
  selectedId: string | null;
  onSelect: (id: string) => void;
}

/** Comments pinned to moments of the flight; the role decides what can be done here. */
export const CommentsRail = forwardRef<CommentsRailHandle, CommentsRailProps>(
  function CommentsRail(props, ref) {
    const {
      flightId,
      teamId,
      waitingForSync = false,
      me,
      role,
      pilotId,
      cursorT,
      onSeek,
      selectedId,
      onSelect,
    } = props;
    const rights = commentRights(role, me?.id ?? null, pilotId);
    const onServer = teamId !== null && me !== null;
    const comments = useFlightComments(flightId, onServer);
    const membersQ = useMembers(teamId ?? '', onServer);
    const members: UserRef[] = useMemo(
      () =>
        (membersQ.data?.members ?? [])
          .filter((m) => m.userId !== me?.id)
          .map((m) => ({ id: m.userId, name: m.name })),
      [membersQ.data, me?.id],
    );
    const coaches = (membersQ.data?.members ?? []).filter(
      (m) => m.role === 'coach' && m.userId !== me?.id,
    );
    const author = me ?? { id: '00000000-0000-4000-8000-000000000000', name: 'me' };
    const add = useAddComment(flightId, author);
    const update = useUpdateComment(flightId, author);
    const reload = useReloadComments(flightId);
    const remove = useDeleteComment(flightId);
    const review = useRequestReview(flightId);
    const composer = useRef<ComposerHandle>(null);
    const [coachId, setCoachId] = useState('');
    const [hideResolved, setHideResolved] = useState(false);

    useImperativeHandle(ref, () => ({ composeAtCursor: () => composer.current?.focus() }));

    const threads = toThreads(comments.data?.comments ?? []).filter(
      (t) => !hideResolved || t.root.resolvedAt === null,
    );
    const open = (comments.data?.comments ?? []).filter(
      (c) => c.parentId === null && c.resolvedAt === null && !c.deleted,
    ).length;
    const lastError = add.error ?? unlessConflict(update.error) ?? remove.error;

    return (
      <section aria-labelledby="comments-title" className="flex flex-col gap-3">
        <header className="flex items-baseline justify-between">
          <h2 id="comments-title" className="text-base font-semibold text-slate-brand">
            Comments
          </h2>
          {onServer && (
            <span className="num text-xs text-ink-faint">
              {open} open
              <label className="ml-3 font-sans">
                <input
                  type="checkbox"
                  className="mr-1 align-middle"
                  checked={hideResolved}
                  onChange={(e) => setHideResolved(e.target.checked)}
                />
                hide resolved
              </label>
            </span>
          )}
        </header>
        {!onServer && (
          <p className="text-sm text-ink-soft">
            {me === null
              ? 'Sign in to comment. This flight is kept on this device and syncs to your team when you do.'
              : waitingForSync
                ? 'Comments open once this flight has reached your team; it is sent as soon as you are online.'
                : 'This flight has no team yet; comments open once it is synced to one.'}
          </p>
        )}
        {onServer && rights.canComment && (
          <CommentComposer
            ref={composer}
            label="Comment at the cursor"
            atS={cursorT ?? 0}
            members={members}
            submitLabel="Comment"
            busy={add.isPending}
            onSubmit={(body, mentions) =>
              add.mutate(
                { id: crypto.randomUUID(), flightId, tS: cursorT ?? 0, body, mentions },
                // Refused, or offline with nowhere to keep it: the text goes back in the box.
                { onError: () => composer.current?.restore(body) },
              )
            }
          />
        )}
        {onServer && !rights.canComment && role !== null && (
          <p className="text-xs text-ink-faint">
            You can read this review; your role does not comment.
          </p>
        )}
        {add.data?.queued && (
          <p className="text-xs text-ink-soft">
            Offline: your comment is kept and will be sent when you are back online.
          </p>
        )}
        {lastError instanceof Error && (
          <p role="alert" className="text-xs text-sev-act">
            Not saved: {lastError.message}
          </p>
        )}
        {update.data?.queued && (
          <p className="text-xs text-ink-soft">
            Offline: your change is kept and will be sent when you are back online.
          </p>
        )}
        <VersionConflict
          error={update.error}
          what="this comment"
          busy={update.isPending}
          onReload={() => void reload().then(() => update.reset())}
          onOverwrite={(version) =>
            update.variables && update.mutate({ ...update.variables, version })
          }
        />
        {comments.isError && (
          <p role="alert" className="text-sm text-sev-act">
            Comments could not be loaded: {comments.error.message}
          </p>
        )}
        {onServer && comments.isSuccess && threads.length === 0 && (
          <p className="text-sm text-ink-faint">No comments yet.</p>
        )}
        <ol className="flex flex-col gap-2" aria-label="Comment threads">
          {threads.map((t) => (
            <li key={t.root.id}>
              <CommentThread
                thread={t}
                me={me}
                rights={rights}
                members={members}
                selected={selectedId === t.root.id}
                onSeek={(tS) => {
                  onSelect(t.root.id);
                  onSeek(tS);
                }}
                onReply={(parent, body, mentions) =>
                  add.mutate({
                    id: crypto.randomUUID(),
                    flightId,
                    tS: parent.tS,
                    body,
                    mentions,
                    parentId: parent.id,
                  })
                }
                onEdit={(c, body, mentions) =>
                  update.mutate({
                    id: c.id,
                    patch: { body, mentions: mentions.map((m) => m.id) },
                    version: c.version,
                    label: `Edit of your comment at ${c.tS.toFixed(2)} s`,
                  })
                }
                onResolve={(c, resolved) =>
                  update.mutate({
                    id: c.id,
                    patch: { resolved },
                    version: c.version,
                    label: `${resolved ? 'Resolve' : 'Reopen'} the thread at ${c.tS.toFixed(2)} s`,
                  })
                }
                onDelete={(c) => remove.mutate(c.id)}
              />
            </li>
          ))}
        </ol>
        {onServer && rights.canRequestReview && (
          <div className="rounded border border-line bg-paper-sunk px-3 py-2">
            <p className="text-xs font-medium text-ink">Ask for a review</p>
            {coaches.length === 0 ? (
              <p className="text-xs text-ink-faint">
                No coach in this team yet; invite one from the team page.
              </p>
            ) : (
              <form
                className="mt-1 flex gap-2"
                onSubmit={(e) => {
                  e.preventDefault();
                  const id = coachId || coaches[0]!.userId;
                  review.mutate({ userIds: [id] });
                }}
              >
                <select
                  aria-label="Coach"
                  value={coachId}
                  onChange={(e) => setCoachId(e.target.value)}
                  className="min-w-0 flex-1 rounded border border-line-strong bg-paper-raised px-1 py-0.5 text-xs"
                >
                  {coaches.map((c) => (
                    <option key={c.userId} value={c.userId}>
                      {c.name}
                    </option>
                  ))}
                </select>
                <button
                  type="submit"
                  disabled={review.isPending}
                  className="rounded bg-slate-brand px-2 py-0.5 text-xs text-paper disabled:opacity-50"
                >
                  Request review
                </button>
              </form>
            )}
            {review.isSuccess && (
              <p className="mt-1 text-xs text-ok">Review requested; the coach gets an e-mail.</p>
            )}
            {review.isError && (
              <p className="mt-1 text-xs text-sev-act">Not sent: {review.error.message}</p>
            )}
          </div>
        )}
      </section>
    );
  },
);
