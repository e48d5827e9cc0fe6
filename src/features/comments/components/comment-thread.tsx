import { useState } from 'react';
import type { Comment } from '../../../../shared/schemas/comments';
import type { UserRef } from '../../../../shared/schemas/common';
import type { Thread } from '../model/threads';
import { splitMentions } from '../model/mentions';
import type { CommentRights } from '../model/permissions';
import { CommentComposer } from './comment-composer';

export interface CommentThreadProps {
  thread: Thread;
  me: UserRef | null;
  rights: CommentRights;
  members: readonly UserRef[];
  selected: boolean;
  onSeek: (tS: number) => void;
  onReply: (parent: Comment, body: string, mentions: UserRef[]) => void;
  onEdit: (c: Comment, body: string, mentions: UserRef[]) => void;
  onResolve: (c: Comment, resolved: boolean) => void;
  onDelete: (c: Comment) => void;
}

const when = (iso: string) => {
  const d = new Date(iso);
  return Number.isNaN(d.getTime())
    ? ''
    : d.toLocaleString('en-GB', {
        day: 'numeric',
        month: 'short',
        hour: '2-digit',
        minute: '2-digit',
      });
};

function Body({ c }: { c: Comment }) {
  if (c.deleted) return <p className="text-sm italic text-ink-faint">comment deleted</p>;
  return (
    <p className="whitespace-pre-wrap break-words text-sm text-ink">
      {splitMentions(
        c.body,
        c.mentions.map((m) => m.name),
      ).map((part, i) =>
        part.mention ? (
          <span key={i} className="rounded bg-accent-soft px-0.5 font-medium text-ink">
            {part.text}
          </span>
        ) : (
          <span key={i}>{part.text}</span>
        ),
      )}
    </p>
  );
}

function Entry({
  c,
  me,
  rights,
  members,
  onEdit,
  onDelete,
}: {
  c: Comment;
  me: UserRef | null;
  rights: CommentRights;
  members: readonly UserRef[];
  onEdit: CommentThreadProps['onEdit'];
  onDelete: CommentThreadProps['onDelete'];
}) {
  const [editing, setEditing] = useState(false);
  const mine = me !== null && c.author.id === me.id;
  const canEdit = mine && rights.canEditOwn;
  const canDelete = (mine && rights.canDeleteOwn) || rights.canDeleteAny;
  return (
    <div>
      <p className="flex items-baseline gap-2 text-xs text-ink-faint">
        <span className="font-medium text-ink-soft">{c.author.name}</span>
        <span>{when(c.createdAt)}</span>
        {c.editedAt && <span>(edited)</span>}
      </p>
      {editing ? (
        <CommentComposer
          label="Edit comment"
          atS={null}
          members={members}
          initial={c.body}
          submitLabel="Save"
          onSubmit={(body, mentions) => {
            onEdit(c, body, mentions);
            setEditing(false);
          }}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <Body c={c} />
      )}
      {!c.deleted && !editing && (canEdit || canDelete) && (
        <p className="mt-0.5 flex gap-3 text-xs">
          {canEdit && (
            <button
              type="button"
              className="text-ink-faint hover:text-ink"
              onClick={() => setEditing(true)}
            >
              Edit
            </button>
          )}
          {canDelete && (
            <button
              type="button"
              className="text-ink-faint hover:text-sev-act"
              onClick={() => onDelete(c)}
            >
              Delete
            </button>
          )}
        </p>
      )}
    </div>
  );
}

/** One pinned comment and its replies: the moment it is about, resolve / reopen, reply. */
export function CommentThread(props: CommentThreadProps) {
  const { thread, rights, members, selected, onSeek, onReply, onResolve } = props;
  const [replying, setReplying] = useState(false);
  const { root, replies } = thread;
  const resolved = root.resolvedAt !== null;
  return (
    <article
      id={`comment-${root.id}`}
      aria-label={`Comment by ${root.author.name} at ${root.tS.toFixed(2)} s${resolved ? ', resolved' : ''}`}
      className={
        'rounded border px-3 py-2 ' +
        (selected ? 'border-accent bg-accent-soft/40 ' : 'border-line bg-paper-raised ') +
        (resolved ? 'border-dashed' : '')
      }
    >
      <div className="mb-1 flex items-center gap-2">
        <button
          type="button"
          onClick={() => onSeek(root.tS)}
          className="num rounded bg-paper-sunk px-1.5 py-0.5 text-xs text-slate-brand hover:bg-accent-soft"
          aria-label={`Move the cursor to ${root.tS.toFixed(2)} s`}
        >
          {root.tS.toFixed(2)} s
        </button>
        {root.channel && <span className="num text-xs text-ink-faint">{root.channel}</span>}
        {resolved && (
          <span className="text-xs text-ok">
            resolved{root.resolvedBy ? ` by ${root.resolvedBy.name}` : ''}
          </span>
        )}
        {rights.canResolve && !root.deleted && (
          <button
            type="button"
            onClick={() => onResolve(root, !resolved)}
            className="ml-auto rounded border border-line px-1.5 py-0.5 text-xs text-ink-soft hover:bg-paper-sunk"
          >
            {resolved ? 'Reopen' : 'Resolve'}
          </button>
        )}
      </div>
      <Entry c={root} {...props} />
      {replies.length > 0 && (
        <ol className="mt-2 flex flex-col gap-2 border-l-2 border-line pl-3" aria-label="Replies">
          {replies.map((r) => (
            <li key={r.id}>
              <Entry c={r} {...props} />
            </li>
          ))}
        </ol>
      )}
      {rights.canComment && !replying && (
        <button
          type="button"
          onClick={() => setReplying(true)}
          className="mt-1 text-xs text-slate-brand hover:underline"
        >
          Reply
        </button>
      )}
      {rights.canComment && replying && (
        <div className="mt-2">
          <CommentComposer
            label="Reply"
            atS={null}
            members={members}
            submitLabel="Reply"
            onSubmit={(body, mentions) => {
              onReply(root, body, mentions);
              setReplying(false);
            }}
            onCancel={() => setReplying(false)}
          />
        </div>
      )}
    </article>
  );
}
