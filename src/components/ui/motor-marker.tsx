import { motorColor } from '../charts/palette';
import { palette } from './palette';

/**
 * A motor's colour drawn as a little prop (a disc with a blade across it), outlined in ink.
 * A plain coloured dot beside a finding reads as a status light (green for good), and several
 * Okabe–Ito colours sit under 3:1 on paper; the shape and the outline fix both, and the motor
 * colour stays the one the charts and the top view use.
 */
export function MotorMarker({ motor, size = 10 }: { motor: number; size?: number }) {
  return (
    <svg
      aria-hidden
      data-motor-marker={motor}
      viewBox="-6 -6 12 12"
      width={size}
      height={size}
      className="inline-block shrink-0"
    >
      <circle r={5.25} fill={motorColor(motor)} stroke={palette.ink.DEFAULT} strokeWidth={1.1} />
      <ellipse rx={4.6} ry={1.15} transform="rotate(-35)" fill={palette.ink.DEFAULT} />
    </svg>
  );
}
