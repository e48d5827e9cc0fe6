import type { ReactNode } from 'react';

/** A titled block of a page. */
export function Panel({
  title,
  actions,
  children,
  className = '',
}: {
  title?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  return (
    <section className={'rounded-md border border-line bg-paper-raised ' + className}>
      {(title || actions) && (
        <header className="flex items-center justify-between gap-3 border-b border-line px-4 py-2">
          {title && <h2 className="text-sm font-semibold text-slate-brand">{title}</h2>}
          {actions}
        </header>
      )}
      <div className="p-4">{children}</div>
    </section>
  );
}

export function Empty({ children }: { children: ReactNode }) {
  return (
    <p className="rounded border border-dashed border-line px-4 py-6 text-center text-sm text-ink-soft">
      {children}
    </p>
  );
}

export function Loading({ what }: { what: string }) {
  return (
    <p role="status" className="py-6 text-center text-sm text-ink-faint">
      Loading {what}…
    </p>
  );
}
