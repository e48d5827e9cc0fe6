import { Link } from 'react-router-dom';
import type { ImportJob } from '../model/import-jobs';

const mb = (bytes: number) => (bytes / 1048576).toFixed(bytes < 10 * 1048576 ? 1 : 0);

export interface JobRowProps {
  job: ImportJob;
  onCancel: () => void;
  onRetry: () => void;
  onRemove: () => void;
  onOpenMap: () => void;
}

/** One dropped file: its progress, its outcome, and what can be done about it. */
export function JobRow({ job, onCancel, onRetry, onRemove, onOpenMap }: JobRowProps) {
  const { file, status } = job;
  const size = file.size;
  const fraction =
    status.kind === 'reading'
      ? Math.min(1, size > 0 ? status.bytes / size : 0)
      : status.kind === 'analysing'
        ? 1
        : 0;
  const busy = status.kind === 'reading' || status.kind === 'analysing';
  return (
    <li
      className="rounded border border-line bg-paper-raised px-3 py-2"
      aria-label={`Import of ${file.name}`}
    >
      <div className="flex flex-wrap items-center gap-3">
        <span className="num min-w-0 flex-1 truncate text-sm text-ink">{file.name}</span>
        <span className="num text-xs text-ink-faint">{mb(size)} MB</span>
        {busy && (
          <button
            type="button"
            onClick={onCancel}
            className="rounded border border-line px-2 py-0.5 text-xs text-ink-soft"
          >
            Cancel
          </button>
        )}
        {(status.kind === 'failed' || status.kind === 'cancelled') && (
          <button
            type="button"
            onClick={onRetry}
            className="rounded border border-line px-2 py-0.5 text-xs text-ink-soft"
          >
            Try again
          </button>
        )}
        {!busy && status.kind !== 'queued' && (
          <button
            type="button"
            onClick={onRemove}
            className="px-1 text-xs text-ink-faint hover:text-ink"
            aria-label={`Remove ${file.name} from the list`}
          >
            ✕
          </button>
        )}
      </div>
      {(busy || status.kind === 'queued') && (
        <div className="mt-2">
          <div
            role="progressbar"
            aria-label={`Reading ${file.name}`}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={Math.round(fraction * 100)}
            className="h-1.5 overflow-hidden rounded bg-paper-sunk"
          >
            <div
              className="h-full bg-slate-brand transition-[width]"
              style={{ width: `${fraction * 100}%` }}
            />
          </div>
          <p className="num mt-1 text-xs text-ink-soft" aria-live="polite">
            {status.kind === 'queued' && 'waiting'}
            {status.kind === 'reading' &&
              `reading · ${mb(status.bytes)} of ${mb(size)} MB · ${status.rows.toLocaleString('en')} rows`}
            {status.kind === 'analysing' && `analysing ${status.rows.toLocaleString('en')} rows`}
          </p>
        </div>
      )}
      {status.kind === 'done' && (
        <p className="mt-1 text-sm text-ink-soft">
          Read and analysed ·{' '}
          <span className="num">
            {status.findings} finding{status.findings === 1 ? '' : 's'}
          </span>{' '}
          · kept on this device ·{' '}
          <Link
            to={`/flights/${status.flightId}`}
            className="font-medium text-slate-brand underline"
          >
            Open the review
          </Link>
        </p>
      )}
      {status.kind === 'cancelled' && (
        <p className="mt-1 text-sm text-ink-faint">Cancelled; nothing was kept.</p>
      )}
      {status.kind === 'failed' && (
        <div
          role="alert"
          className="mt-2 rounded border-l-2 border-sev-act bg-paper-sunk px-3 py-2 text-sm"
        >
          <p className="text-ink">{status.problem.message}</p>
          {(status.problem.line !== undefined || status.problem.column !== undefined) && (
            <p className="num mt-1 text-xs text-ink-soft">
              {status.problem.line !== undefined && <>line {status.problem.line}</>}
              {status.problem.column !== undefined && <>, column {status.problem.column}</>}
              {status.problem.header && <> ({status.problem.header})</>}
            </p>
          )}
          <p className="mt-1 text-xs text-ink-faint">
            Your file is unchanged. Fix it, or read it with a column map.
          </p>
          {status.canMap && (
            <button
              type="button"
              onClick={onOpenMap}
              className="mt-2 rounded border border-line bg-paper-raised px-2 py-0.5 text-xs"
            >
              Map the columns
            </button>
          )}
        </div>
      )}
      {status.kind === 'needs-map' && (
        <p className="mt-1 text-sm text-accent-ink">
          The header is not ours; confirm its columns in the column map on this page.
        </p>
      )}
    </li>
  );
}
