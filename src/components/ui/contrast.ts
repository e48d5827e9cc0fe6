/**
 * WCAG 2.1, "relative luminance" and "contrast ratio" (definitions used by success criteria
 * 1.4.3 Contrast (Minimum) and 1.4.11 Non-text Contrast): sRGB channels linearised with the
 * 0.03928 knee (W3C has since noted 0.04045 is the sRGB figure; no 8-bit value lies between
 * them), L = 0.2126 R + 0.7152 G + 0.0722 B, ratio = (L1 + 0.05) / (L2 + 0.05).
 */
function channel(c8: number): number {
  const c = c8 / 255;
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** The 0–255 channels of a `#rrggbb` colour. */
export function rgb(hex: string): [number, number, number] {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  return [parseInt(m[1]!, 16), parseInt(m[2]!, 16), parseInt(m[3]!, 16)];
}

function luminance([r, g, b]: [number, number, number]): number {
  return 0.2126 * channel(r) + 0.7152 * channel(g) + 0.0722 * channel(b);
}

/** The WCAG contrast ratio of two `#rrggbb` colours, 1 to 21, whichever is lighter. */
export function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(rgb(a)), luminance(rgb(b))].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}
