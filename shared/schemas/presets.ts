import { z } from 'zod';
import { ColumnMap } from '../log/column-map';
import { Id, IsoDateTime, UserRef } from './common';

/** An import preset: a saved column map for a log layout the team meets often. */
export const PresetInput = z.object({
  name: z.string().trim().min(1, 'name the preset').max(80),
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
});
export type Preset = z.infer<typeof Preset>;
export const PresetList = z.object({ presets: z.array(Preset) });
export type PresetList = z.infer<typeof PresetList>;
