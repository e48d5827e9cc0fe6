import type { ReactNode } from 'react';
import { ApiError } from '../../lib/api-fetch';

const tones = {
  error: 'border-sev-act/40 bg-sev-act/5 text-sev-act',
  info: 'border-sev-note/30 bg-sev-note/5 text-ink',
  ok: 'border-ok/40 bg-ok/5 text-ok',
} as const;

export function Alert({
  tone = 'info',
  children,
}: {
  tone?: keyof typeof tones;
  children: ReactNode;
}) {
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={'rounded border px-3 py-2 text-sm ' + tones[tone]}
    >
      {children}
    </div>
  );
}

/** Plain words for an error from the API, the network or a bug. */
export function describeError(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof TypeError)
    return 'The server cannot be reached. Check the connection and try again.';
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}

/** Shows an error where the data would have been. */
export function ErrorNote({ error }: { error: unknown }) {
  return <Alert tone="error">{describeError(error)}</Alert>;
}
