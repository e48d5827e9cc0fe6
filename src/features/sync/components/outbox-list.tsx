import { useQueryClient } from '@tanstack/react-query';
import { commentKeys } from '../../../api/comments';
import { Button } from '../../../components/ui/button';
import {
  listOutbox,
  overwriteOutboxConflict,
  removeOutboxEntry,
  type OutboxEntry,
} from '../../../lib/local-db';
import { syncEngine } from '../sync-engine';
import { useLocalLiveQuery } from '../../../lib/local-store-status';

const describe = (e: OutboxEntry) =>
  e.label ?? (e.method === 'PUT' ? 'New comment' : `${e.method} ${e.path}`);

const stateText = (e: OutboxEntry) =>
  e.state === 'conflict'
    ? 'changed by someone else since you edited it offline'
    : e.state === 'failed'
      ? 'refused'
      : e.lastError
        ? 'retrying'
        : 'waiting';

/**
 * Changes made offline that the server has not taken yet. One that someone else overtook (the
 * server holds a newer version) is never sent over theirs silently: the pilot either overwrites
 * theirs with this change or keeps theirs and drops this one.
 */
export function OutboxList() {
  const queryClient = useQueryClient();
  const entries = useLocalLiveQuery(listOutbox, [], []);
  if (!entries || entries.length === 0) return null;
  return (
    <ul className="divide-y divide-line/70 text-sm" aria-label="Changes on this device">
      {entries.map((e) => (
        <li key={e.seq} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-1.5">
          <span>{describe(e)}</span>
          <span
            className={
              'text-xs ' +
              (e.state === 'conflict'
                ? 'text-sev-watch'
                : e.state === 'failed'
                  ? 'text-sev-act'
                  : 'text-accent-ink')
            }
          >
            {stateText(e)}
          </span>
          {e.state === 'failed' && e.lastError && (
            <span className="text-xs text-ink-soft">{e.lastError}</span>
          )}
          {e.state === 'conflict' && e.seq !== undefined && (
            <span className="ml-auto flex gap-2">
              <Button
                size="sm"
                onClick={() =>
                  void removeOutboxEntry(e.seq!).then(() =>
                    queryClient.invalidateQueries({ queryKey: commentKeys.all }),
                  )
                }
              >
                Keep theirs
              </Button>
              <Button
                size="sm"
                tone="danger"
                onClick={() => void overwriteOutboxConflict(e.seq!).then(() => syncEngine().kick())}
              >
                Overwrite with mine
              </Button>
            </span>
          )}
        </li>
      ))}
    </ul>
  );
}
