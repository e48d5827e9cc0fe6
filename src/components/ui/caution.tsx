import type { ReactNode } from 'react';

/** A safety caution where the work described can hurt someone. */
export function Caution({ title, children }: { title: string; children: ReactNode }) {
  return (
    <aside
      aria-label={`Caution: ${title}`}
      className="flex gap-3 rounded border border-accent/50 bg-accent-soft/50 px-3 py-2 text-xs text-ink"
    >
      <span aria-hidden className="mt-0.5 font-mono font-semibold text-accent-ink">
        !
      </span>
      <div>
        <p className="font-semibold">{title}</p>
        <div className="mt-0.5 text-ink-soft">{children}</div>
      </div>
    </aside>
  );
}
