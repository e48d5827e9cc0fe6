import { forwardRef, useImperativeHandle, useLayoutEffect, useRef, useState } from 'react';
import type { UserRef } from '../../../../shared/schemas/common';
import { insertMention, matchMembers, mentionQuery, mentionedIn } from '../model/mentions';

export interface ComposerHandle {
  focus: () => void;
  /** Put back a comment that could not be saved, ahead of anything typed since. */
  restore: (body: string) => void;
}

export interface CommentComposerProps {
  label: string;
  /** The moment the comment will be pinned to, shown beside the box; null for replies. */
  atS: number | null;
  members: readonly UserRef[];
  submitLabel: string;
  busy?: boolean;
  initial?: string;
  onSubmit: (body: string, mentions: UserRef[]) => void;
  onCancel?: () => void;
}

/** A text box that suggests team members after `@`; Enter with Ctrl/⌘ sends. */
export const CommentComposer = forwardRef<ComposerHandle, CommentComposerProps>(
  function CommentComposer(
    { label, atS, members, submitLabel, busy = false, initial = '', onSubmit, onCancel },
    ref,
  ) {
    const [text, setText] = useState(initial);
    const [caret, setCaret] = useState(0);
    const [active, setActive] = useState(0);
    const [error, setError] = useState<string | null>(null);
    const area = useRef<HTMLTextAreaElement>(null);
    // Where focus was when something sent it here (the `c` key on the strip, say): it goes
    // back there once the comment is sent or the box is left with Escape.
    const cameFrom = useRef<HTMLElement | null>(null);
    useImperativeHandle(ref, () => ({
      focus: () => {
        const from = document.activeElement;
        cameFrom.current = from instanceof HTMLElement && from !== area.current ? from : null;
        area.current?.focus();
      },
      restore: (body) => setText((now) => (now.trim() === '' ? body : `${body}\n${now}`)),
    }));
    const giveFocusBack = () => {
      const to = cameFrom.current;
      cameFrom.current = null;
      if (to?.isConnected && to !== document.body) to.focus();
    };

    const mq = mentionQuery(text, caret);
    const suggestions = mq ? matchMembers(members, mq.query) : [];
    const open = suggestions.length > 0;

    const pick = (m: UserRef) => {
      if (!mq) return;
      const next = insertMention(text, mq.start, caret, m);
      pendingCaret.current = next.caret;
      setText(next.text);
      setCaret(next.caret);
    };

    // Place the caret after the picked name in the same commit: a deferred frame let the
    // next keystrokes land before it moved, scrambling fast typing.
    const pendingCaret = useRef<number | null>(null);
    useLayoutEffect(() => {
      const at = pendingCaret.current;
      if (at === null) return;
      pendingCaret.current = null;
      area.current?.focus();
      area.current?.setSelectionRange(at, at);
    });

    const submit = () => {
      const body = text.trim();
      if (body === '') {
        setError('Write something first.');
        return;
      }
      setError(null);
      onSubmit(body, mentionedIn(body, members));
      setText('');
      setCaret(0);
      giveFocusBack();
    };

    return (
      <form
        className="flex flex-col gap-1.5"
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
      >
        <label className="flex items-baseline justify-between text-xs text-ink-soft">
          <span>{label}</span>
          {atS !== null && <span className="num text-ink">at {atS.toFixed(2)} s</span>}
        </label>
        <div className="relative">
          <textarea
            ref={area}
            aria-label={label}
            rows={3}
            value={text}
            className="w-full resize-y rounded border border-line-strong bg-paper-raised px-2 py-1.5 text-sm"
            placeholder="What did you see? @name to ask someone"
            aria-autocomplete="list"
            aria-controls={open ? 'mention-list' : undefined}
            aria-activedescendant={open ? `mention-${active}` : undefined}
            onChange={(e) => {
              setText(e.target.value);
              setCaret(e.target.selectionStart);
              setActive(0);
            }}
            onSelect={(e) => setCaret(e.currentTarget.selectionStart)}
            onKeyDown={(e) => {
              if (open && (e.key === 'ArrowDown' || e.key === 'ArrowUp')) {
                e.preventDefault();
                setActive(
                  (a) =>
                    (a + (e.key === 'ArrowDown' ? 1 : suggestions.length - 1)) % suggestions.length,
                );
              } else if (open && (e.key === 'Enter' || e.key === 'Tab')) {
                e.preventDefault();
                pick(suggestions[active] ?? suggestions[0]!);
              } else if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) {
                e.preventDefault();
                submit();
              } else if (e.key === 'Escape' && onCancel) {
                onCancel();
              } else if (e.key === 'Escape' && cameFrom.current) {
                e.preventDefault();
                giveFocusBack();
              }
            }}
          />
          {open && (
            <ul
              id="mention-list"
              role="listbox"
              aria-label="Team members"
              className="absolute left-0 right-0 z-10 mt-0.5 rounded border border-line bg-paper-raised py-1 text-sm shadow"
            >
              {suggestions.map((m, i) => (
                <li
                  key={m.id}
                  id={`mention-${i}`}
                  role="option"
                  aria-selected={i === active}
                  className={'cursor-pointer px-2 py-1 ' + (i === active ? 'bg-accent-soft' : '')}
                  onMouseDown={(e) => {
                    e.preventDefault();
                    pick(m);
                  }}
                >
                  {m.name}
                </li>
              ))}
            </ul>
          )}
        </div>
        {error && <p className="text-xs text-sev-act">{error}</p>}
        <div className="flex gap-2">
          <button
            type="submit"
            disabled={busy}
            className="rounded bg-slate-brand px-3 py-1 text-xs font-medium text-paper disabled:opacity-50"
          >
            {submitLabel}
          </button>
          {onCancel && (
            <button
              type="button"
              onClick={onCancel}
              className="rounded border border-line-strong px-2 py-1 text-xs text-ink-soft"
            >
              Cancel
            </button>
          )}
        </div>
      </form>
    );
  },
);
