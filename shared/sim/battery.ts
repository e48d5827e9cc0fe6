/**
 * LiPo pack model: open-circuit voltage from state of charge, terminal voltage V = V_oc − I·R.
 * The curve is a typical LiPo discharge shape (common practice; 4.20 V full and 3.7 V nominal
 * per tests/REFERENCES.md §12), not a particular cell's datasheet.
 */
const SOC = [0, 0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95, 1];
const OCV = [3.27, 3.61, 3.69, 3.73, 3.77, 3.8, 3.84, 3.87, 3.95, 4.02, 4.11, 4.15, 4.2];

/** Open-circuit cell voltage, V, for a state of charge 0–1 (clamped). */
export function cellOpenCircuitV(charge: number): number {
  if (charge <= 0) return OCV[0]!;
  if (charge >= 1) return OCV[OCV.length - 1]!;
  let i = 1;
  while (SOC[i]! < charge) i++;
  const s0 = SOC[i - 1]!;
  const s1 = SOC[i]!;
  const f = (charge - s0) / (s1 - s0);
  return OCV[i - 1]! + f * (OCV[i]! - OCV[i - 1]!);
}

/**
 * Terminal voltage, V, of a pack with open-circuit voltage `ocv` (V) and resistance `r` (Ω)
 * delivering `powerW` to the motors plus a constant `extraA` to the avionics: the root of
 * V² − (ocv − extraA·r)·V + P·r = 0 on the stable branch. A pack that cannot deliver the power
 * browns out to half its open-circuit voltage.
 */
export function terminalVoltage(ocv: number, r: number, powerW: number, extraA: number): number {
  const b = ocv - extraA * r;
  const disc = b * b - 4 * powerW * r;
  if (disc <= 0) return b / 2;
  return (b + Math.sqrt(disc)) / 2;
}
