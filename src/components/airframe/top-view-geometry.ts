import type { Motor } from '../../../shared/schemas/airframe';

/** Millimetres per inch (exact, by definition of the inch). */
export const MM_PER_INCH = 25.4;

/** Top view in screen terms: x forward is up, y right is right, so screen (sx, sy) = (y, −x). */
export const toScreen = (m: { x: number; y: number }) => ({ sx: m.y, sy: -m.x });

/** Half-size of a square view that holds every prop disc with a margin, mm. */
export function viewExtent(motors: readonly Motor[], propRadiusMm: number): number {
  let r = 0;
  for (const m of motors) r = Math.max(r, Math.abs(m.x), Math.abs(m.y));
  return Math.max(60, (r + propRadiusMm) * 1.12);
}

/** Pairs of motors (1-based) whose prop discs overlap: the props would strike each other. */
export function overlappingProps(
  motors: readonly Motor[],
  propRadiusMm: number,
): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < motors.length; i++)
    for (let j = i + 1; j < motors.length; j++) {
      const a = motors[i]!;
      const b = motors[j]!;
      if (Math.hypot(a.x - b.x, a.y - b.y) < 2 * propRadiusMm) out.push([i + 1, j + 1]);
    }
  return out;
}

/**
 * SVG path of a spin arrow on a prop disc centred at (cx, cy) in screen units: an arc of
 * `sweepDeg` and the point where its head goes. Clockwise seen from above is clockwise on screen.
 */
export function spinArc(
  cx: number,
  cy: number,
  radius: number,
  spin: Motor['spin'],
  sweepDeg = 120,
) {
  const dir = spin === 'cw' ? 1 : -1;
  const start = (-90 - (dir * sweepDeg) / 2) * (Math.PI / 180);
  const end = start + dir * sweepDeg * (Math.PI / 180);
  const p0 = { x: cx + radius * Math.cos(start), y: cy + radius * Math.sin(start) };
  const p1 = { x: cx + radius * Math.cos(end), y: cy + radius * Math.sin(end) };
  const path = `M ${p0.x} ${p0.y} A ${radius} ${radius} 0 0 ${dir === 1 ? 1 : 0} ${p1.x} ${p1.y}`;
  // Head: a small triangle pointing along the tangent at the end of the arc.
  const tangent = end + (dir * Math.PI) / 2;
  const size = radius * 0.28;
  const back = { x: p1.x - size * Math.cos(tangent), y: p1.y - size * Math.sin(tangent) };
  const normal = tangent + Math.PI / 2;
  const w = size * 0.55;
  const head = `M ${p1.x} ${p1.y} L ${back.x + w * Math.cos(normal)} ${back.y + w * Math.sin(normal)} L ${back.x - w * Math.cos(normal)} ${back.y - w * Math.sin(normal)} Z`;
  return { path, head };
}

/** A round scale-bar length (1, 2 or 5 × 10ⁿ mm) near a fifth of the view width. */
export function scaleBarMm(extentMm: number): number {
  const target = (extentMm * 2) / 5;
  const p = 10 ** Math.floor(Math.log10(target));
  for (const m of [5, 2, 1]) if (m * p <= target) return m * p;
  return p;
}
