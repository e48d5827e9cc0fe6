import { useState } from 'react';
import type { DevMail } from '../../../../shared/schemas/mail';
import { Empty, Loading } from '../../../components/ui/panel';
import { ErrorNote } from '../../../components/ui/alert';
import { useDevMail } from '../../../api/mail';

/** Links in a plain-text body, made clickable; everything else stays text (no HTML is rendered). */
function Linked({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return (
    <>
      {parts.map((part, i) =>
        /^https?:\/\//.test(part) ? (
          <a key={i} href={toLocal(part)} className="break-all text-accent-ink underline">
            {part}
          </a>
        ) : (
          <span key={i}>{part}</span>
        ),
      )}
    </>
  );
}

/** Open links to this app in this tab's origin, so a link mailed for another port still works here. */
function toLocal(href: string): string {
  try {
    const url = new URL(href);
    return url.pathname.startsWith('/api/') ? href : url.pathname + url.search + url.hash;
  } catch {
    return href;
  }
}

/** Every message the local fake SMTP server caught, newest first. */
export function DevInbox() {
  const inbox = useDevMail();
  const [openId, setOpenId] = useState<string | null>(null);
  if (inbox.isPending) return <Loading what="the inbox" />;
  if (inbox.isError) return <ErrorNote error={inbox.error} />;
  if (inbox.data === null)
    return <Empty>This server sends real e-mail; there is no local inbox to show.</Empty>;
  if (inbox.data.messages.length === 0) return <Empty>No messages caught yet.</Empty>;
  return (
    <ul
      className="divide-y divide-line rounded-md border border-line bg-paper-raised"
      aria-label="Messages"
    >
      {inbox.data.messages.map((m: DevMail) => {
        const open = openId === m.id || (openId === null && m === inbox.data!.messages[0]);
        return (
          <li key={m.id}>
            <button
              type="button"
              aria-expanded={open}
              onClick={() => setOpenId(open ? '' : m.id)}
              className="flex w-full items-baseline gap-3 px-4 py-2 text-left text-sm hover:bg-paper-sunk"
            >
              <span className="font-medium text-ink">{m.subject}</span>
              <span className="truncate text-xs text-ink-soft">to {m.to.join(', ')}</span>
              <span className="num ml-auto shrink-0 text-xs text-ink-faint">
                {new Date(m.receivedAt).toLocaleTimeString()}
              </span>
            </button>
            {open && (
              <div className="border-t border-line/60 bg-paper px-4 py-3">
                <p className="mb-2 text-xs text-ink-faint">from {m.from}</p>
                <pre className="font-sans text-sm whitespace-pre-wrap text-ink">
                  <Linked text={m.text} />
                </pre>
              </div>
            )}
          </li>
        );
      })}
    </ul>
  );
}
