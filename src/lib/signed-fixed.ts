/** "+9.2", "−1.4", "0.0": a signed figure with a true minus sign and no "−0.0" after rounding. */
export function signedFixed(v: number, digits = 1): string {
  if (!Number.isFinite(v)) return '—';
  const text = Math.abs(v).toFixed(digits);
  if (Number(text) === 0) return text;
  return (v > 0 ? '+' : '−') + text;
}
