/**
 * LiPo per-cell voltages the power analysis judges against. The charge and nominal voltages
 * are cell-datasheet figures; the in-flight warning and land-now levels are trade practice.
 */
export const LIPO = {
  /** CC-CV end of charge, V per cell (Li-polymer cell specifications). */
  fullV: 4.2,
  /** Average voltage at 0.2 C, V per cell (cell specifications). */
  nominalV: 3.7,
  /** Under load, below this the pack is working hard, V per cell (common practice). */
  warnUnderLoadV: 3.5,
  /** Land now; below this cells age fast and can be damaged, V per cell (common practice). */
  landNowV: 3.3,
  /** Highest resting voltage a healthy cell shows, with a little meter tolerance, V. */
  maxRestV: 4.25,
} as const;

/** Pack voltage when full (4.20 V per cell) and nominal (3.7 V per cell), V. */
export function packVoltages(cells: number): { fullV: number; nominalV: number } {
  return { fullV: LIPO.fullV * cells, nominalV: LIPO.nominalV * cells };
}

/**
 * Cell count from a resting pack voltage, V: the fewest cells that keep every cell at or under
 * 4.25 V. Right for packs resting between about 3.6 and 4.25 V per cell up to 6S (a flight
 * starts on a charged pack); returns null for a voltage below one cell's floor.
 */
export function inferCells(restV: number): number | null {
  if (!(restV > 2.5)) return null;
  return Math.max(1, Math.ceil(restV / LIPO.maxRestV - 1e-9));
}
