import { NoDataYet } from '../../../components/ui/no-data-yet';
import { ErrorNote } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Empty } from '../../../components/ui/panel';
import { useState } from 'react';
import { useDeletePreset, usePresets } from '../../../api/presets';
import { PresetRename } from './preset-rename';

/** Column maps the team saved while importing logs with unfamiliar headers. */
export function PresetsList({
  teamId,
  canEdit = false,
  canDelete,
}: {
  teamId: string;
  canEdit?: boolean;
  canDelete: boolean;
}) {
  const presets = usePresets(teamId);
  const remove = useDeletePreset(teamId);
  const [renaming, setRenaming] = useState<string | null>(null);
  if (!presets.data) return <NoDataYet query={presets} what="import presets" />;
  if (presets.data.presets.length === 0)
    return (
      <Empty>
        No import presets yet. Importing a log with unfamiliar headers offers to save its column map
        here.
      </Empty>
    );
  return (
    <div className="space-y-2">
      {remove.isError && <ErrorNote error={remove.error} />}
      <ul className="divide-y divide-line/70" aria-label="Import presets">
        {presets.data.presets.map((p) => {
          const columns = Object.entries(p.columnMap.columns);
          return (
            <li key={p.id} className="py-2 text-sm">
              <details>
                <summary className="flex cursor-pointer items-center gap-3">
                  <span className="font-medium">{p.name}</span>
                  <span className="num text-xs text-ink-faint">{columns.length} columns</span>
                  <span className="text-xs text-ink-faint">by {p.createdBy.name}</span>
                  {canEdit && (
                    <Button
                      size="sm"
                      className="ml-auto"
                      aria-label={`Rename ${p.name}`}
                      onClick={(e) => {
                        e.preventDefault();
                        setRenaming(p.id);
                      }}
                    >
                      Rename
                    </Button>
                  )}
                  {canDelete && (
                    <Button
                      size="sm"
                      tone="danger"
                      className={canEdit ? '' : 'ml-auto'}
                      disabled={remove.isPending}
                      onClick={(e) => {
                        e.preventDefault();
                        if (window.confirm(`Delete the preset "${p.name}"?`)) remove.mutate(p.id);
                      }}
                    >
                      Delete
                    </Button>
                  )}
                </summary>
                <table className="mt-2 w-full text-xs">
                  <tbody>
                    {columns.map(([header, entry]) => (
                      <tr key={header} className="border-b border-line/50">
                        <td className="py-0.5 pr-2 font-mono">{header}</td>
                        <td className="py-0.5 pr-2">→ {entry.channel}</td>
                        <td className="num py-0.5 text-ink-soft">
                          {entry.unit ?? ''}
                          {entry.min !== undefined && entry.max !== undefined
                            ? ` ${entry.min}…${entry.max}`
                            : ''}
                          {entry.scale !== undefined ? ` ×${entry.scale}` : ''}
                          {entry.offset !== undefined ? ` +${entry.offset}` : ''}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </details>
              {renaming === p.id && (
                <PresetRename
                  key={p.version}
                  teamId={teamId}
                  preset={p}
                  onDone={() => setRenaming(null)}
                />
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
