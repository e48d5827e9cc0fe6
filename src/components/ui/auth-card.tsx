import type { ReactNode } from 'react';

/** A narrow centred card for sign-in and the other account pages. */
export function AuthCard({
  title,
  lead,
  children,
  footer,
}: {
  title: string;
  lead?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}) {
  return (
    <div className="mx-auto w-full max-w-sm py-8">
      <h1 className="text-2xl font-semibold tracking-tight text-slate-brand">{title}</h1>
      {lead && <p className="mt-1 text-sm text-ink-soft">{lead}</p>}
      <div className="mt-5 rounded-md border border-line bg-paper-raised p-5">{children}</div>
      {footer && <div className="mt-4 space-y-1 text-sm text-ink-soft">{footer}</div>}
    </div>
  );
}
