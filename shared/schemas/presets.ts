import { z } from 'zod';
import { ColumnMap } from '../log/column-map';
import { DisplayName, Id, IsoDateTime, UserRef } from './common';

/** An import preset: a saved column map for a log layout the team meets often. */
export const PresetInput = z.object({
  name: DisplayName(80, 'name the preset'),
  columnMap: ColumnMap,
});
export type PresetInput = z.infer<typeof PresetInput>;

export const PresetPatch = z
  .object({ name: PresetInput.shape.name.optional(), columnMap: ColumnMap.optional() })
  .refine((v) => Object.keys(v).length > 0, 'nothing to change');
export type PresetPatch = z.infer<typeof PresetPatch>;

export const Preset = z.object({
  id: Id,
  teamId: Id,
  name: z.string(),
  columnMap: ColumnMap,
  createdBy: UserRef,
  createdAt: IsoDateTime,
  updatedAt: IsoDateTime,
  /** Adds one on every write; send it back in If-Match to refuse overwriting a newer one. */
  version: z.number().int().positive(),
});
export type Preset = z.infer<typeof Preset>;
export const PresetList = z.object({ presets: z.array(Preset) });
export type PresetList = z.infer<typeof PresetList>;
