import { z } from 'zod';
import { Thresholds } from '../analysis/thresholds';
import { IsoDateTime } from './common';

/** `PUT /api/teams/:teamId/thresholds` body: the full set (the editor starts from the current one). */
export const ThresholdsInput = Thresholds;
export type ThresholdsInput = z.infer<typeof ThresholdsInput>;

/** The team's thresholds; defaults fill anything never set. */
export const TeamThresholds = z.object({
  thresholds: Thresholds,
  /** True while the team has never saved its own. */
  isDefault: z.boolean(),
  updatedAt: IsoDateTime.nullable(),
});
export type TeamThresholds = z.infer<typeof TeamThresholds>;
