import { useState } from 'react';
import type { Preset } from '../../../../shared/schemas/presets';
import { useReloadPresets, useUpdatePreset } from '../../../api/presets';
import { ErrorNote } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { unlessConflict, VersionConflict } from '../../../components/ui/version-conflict';

/**
 * Renames one import preset. The save names the version the name was read at, so a rename made
 * meanwhile on another device is offered back (reload or overwrite) instead of being lost. The
 * parent keys this form by the preset's version: a reload remounts it with the current name.
 */
export function PresetRename({
  teamId,
  preset,
  onDone,
}: {
  teamId: string;
  preset: Preset;
  onDone: () => void;
}) {
  const update = useUpdatePreset(teamId);
  const reload = useReloadPresets(teamId);
  const [name, setName] = useState(preset.name);
  const save = (version: number) =>
    update.mutate({ id: preset.id, patch: { name }, version }, { onSuccess: onDone });
  return (
    <form
      className="mt-2 space-y-2"
      aria-label={`Rename ${preset.name}`}
      onSubmit={(e) => {
        e.preventDefault();
        save(preset.version);
      }}
    >
      <div className="flex items-end gap-2">
        <TextField
          label="Preset name"
          value={name}
          maxLength={80}
          onChange={(e) => setName(e.target.value)}
          className="min-w-0 flex-1"
        />
        <Button type="submit" size="sm" tone="primary" disabled={update.isPending || !name.trim()}>
          Save name
        </Button>
        <Button size="sm" onClick={onDone}>
          Cancel
        </Button>
      </div>
      {unlessConflict(update.error) ? <ErrorNote error={update.error} /> : null}
      <VersionConflict
        error={update.error}
        what="this preset"
        busy={update.isPending}
        onReload={() => void reload()}
        onOverwrite={save}
      />
    </form>
  );
}
