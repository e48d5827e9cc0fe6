import type { ReactNode } from 'react';

export function PageHeader({
  title,
  lead,
  actions,
}: {
  title: string;
  lead?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <div className="mb-6 flex items-end justify-between gap-4">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight text-slate-brand">{title}</h1>
        {lead && <p className="mt-1 max-w-2xl text-sm text-ink-soft">{lead}</p>}
      </div>
      {actions}
    </div>
  );
}
