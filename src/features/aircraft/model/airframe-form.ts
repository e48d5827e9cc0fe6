import { z } from 'zod';
import { expectedHoverShares } from '../../../../shared/airframe/allocation';
import {
  layoutPresets,
  presetAirframe,
  type LayoutPreset,
} from '../../../../shared/airframe/presets';
import { AircraftName } from '../../../../shared/schemas/aircraft';
import { Airframe } from '../../../../shared/schemas/airframe';

/** What the editor edits: the aircraft's name and its airframe. */
export const AirframeForm = z.object({ name: AircraftName, airframe: Airframe });
export type AirframeForm = z.infer<typeof AirframeForm>;

export const presetIds = Object.keys(layoutPresets) as LayoutPreset[];

/** Empty inputs are "not given" (undefined), never 0 or NaN. */
export const optionalNumber = (v: unknown) => {
  if (v === '' || v === null || v === undefined) return undefined;
  const n = typeof v === 'number' ? v : Number(String(v).replace(',', '.'));
  return n;
};

/** A new aircraft starts as a typical quad X; the pilot picks another preset or edits the table. */
export function newAirframeForm(name = ''): AirframeForm {
  return { name, airframe: presetAirframe('quad-x', { name: 'Quad X' }) };
}

/** Expected hover shares for the table, or null while the geometry cannot hover (too few, collinear). */
export function sharesOrNull(
  airframe: Pick<Airframe, 'motors' | 'massG'> & Partial<Airframe>,
): number[] | null {
  const parsed = Airframe.safeParse({
    name: 'x',
    prop: { diameterIn: 5, pitchIn: 4, blades: 2 },
    ...airframe,
  });
  if (!parsed.success) return null;
  try {
    const shares = expectedHoverShares(parsed.data);
    return shares.every(Number.isFinite) ? shares : null;
  } catch {
    return null;
  }
}
