import { isVersionConflict } from '../../lib/api-fetch';
import { Button } from './button';

/**
 * Someone else saved first (412): offer both ways out instead of overwriting silently. Reload
 * takes their version into the form; overwrite sends ours again against the version the server
 * holds now. Renders nothing for any other error.
 */
export function VersionConflict({
  error,
  what,
  busy = false,
  onReload,
  onOverwrite,
}: {
  error: unknown;
  /** What was changed, as it reads mid-sentence: "this aircraft", "the thresholds". */
  what: string;
  busy?: boolean;
  onReload: () => void;
  onOverwrite: (currentVersion: number) => void;
}) {
  if (!isVersionConflict(error)) return null;
  return (
    <div
      role="alert"
      className="flex flex-wrap items-center gap-x-3 gap-y-2 rounded border border-sev-watch/50 bg-sev-watch/10 px-3 py-2 text-sm text-ink"
    >
      <span className="min-w-0 flex-1">
        Changed by someone else since you opened {what} — reload to see their change, or overwrite
        it with yours.
      </span>
      <Button size="sm" disabled={busy} onClick={onReload}>
        Reload
      </Button>
      <Button
        size="sm"
        tone="danger"
        disabled={busy}
        onClick={() => onOverwrite(error.currentVersion)}
      >
        Overwrite
      </Button>
    </div>
  );
}

/** The error to show as a plain message: null for a conflict, which VersionConflict shows. */
export function unlessConflict<E>(error: E | null | undefined): E | null {
  return error == null || isVersionConflict(error) ? null : error;
}
