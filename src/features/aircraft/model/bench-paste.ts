import type { BenchRow } from '../../../../shared/schemas/aircraft';

/**
 * Readings pasted from a spreadsheet or a stand's export: one per line, numbers split by tab,
 * comma, semicolon or spaces, in the order throttle, thrust g, current A, rpm, voltage V.
 * Throttle above 1 is read as a percentage. A header line is skipped. Returns a message naming
 * the line on anything it cannot read.
 */
export function parseBenchPaste(text: string): BenchRow[] | string {
  const lines = text.split(/\r?\n/);
  const rows: BenchRow[] = [];
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!.trim();
    if (!line) continue;
    const cells = line.split(/[\t;,]|\s+/).filter((c) => c !== '');
    const values = cells.map((c) => Number(c.replace('%', '')));
    if (values.some((v) => Number.isNaN(v))) {
      if (rows.length === 0 && values.every((v) => Number.isNaN(v))) continue; // header
      return `Line ${i + 1}: "${line}" is not a list of numbers.`;
    }
    if (values.length < 2) return `Line ${i + 1}: needs at least throttle and thrust.`;
    const [throttle, thrustG, currentA, rpm, voltageV] = values as [number, number, ...number[]];
    rows.push({
      throttle: throttle > 1 ? throttle / 100 : throttle,
      thrustG,
      ...(currentA !== undefined ? { currentA } : {}),
      ...(rpm !== undefined ? { rpm } : {}),
      ...(voltageV !== undefined ? { voltageV } : {}),
    });
  }
  if (rows.length === 0) return 'Nothing to read: paste one reading per line.';
  return rows;
}
