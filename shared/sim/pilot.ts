import type { Phase } from './types';

/** Height the scripted pilot cruises at, m. */
export const CRUISE_ALT_M = 3;

/** What the pilot asks for at one moment of a phase. */
export interface PilotCommand {
  /** Target height, m, and climb rate, m/s, for the altitude hold. */
  hT: number;
  vT: number;
  /** Throttle held regardless of height (0–1), or −1 to fly the altitude hold. */
  throttleOverride: number;
  /** How much of the thumbs' wobble and levelling reaches the sticks, 0–1. */
  thumbs: number;
  /** Scripted rate setpoints, deg/s. */
  spR: number;
  spP: number;
  spY: number;
}

/** Smooth 0→1 ramp on [0, 1] with zero slope at both ends. */
export function smoothstep(x: number): number {
  const c = x <= 0 ? 0 : x >= 1 ? 1 : x;
  return c * c * (3 - 2 * c);
}

/**
 * The pilot's command at fraction `x` (0–1) through phase `ph`, into `out` (reused: this runs at
 * every integration step). `startAlt` is the height when the phase began.
 */
export function pilotCommand(
  out: PilotCommand,
  ph: Phase,
  x: number,
  startAlt: number,
  punchThrottle: number,
): void {
  out.hT = CRUISE_ALT_M;
  out.vT = 0;
  out.throttleOverride = -1;
  out.thumbs = 1;
  out.spR = 0;
  out.spP = 0;
  out.spY = 0;
  const span = ph.t1 - ph.t0;
  switch (ph.kind) {
    case 'idle':
      out.throttleOverride = 0;
      out.thumbs = 0;
      break;
    case 'take-off':
      out.hT = CRUISE_ALT_M * smoothstep(x);
      out.vT = (CRUISE_ALT_M * 6 * x * (1 - x)) / span;
      out.thumbs = smoothstep(x);
      break;
    case 'roll':
      out.spR = 45 * Math.sin(2 * Math.PI * x);
      break;
    case 'pitch':
      out.spP = 45 * Math.sin(2 * Math.PI * x);
      break;
    case 'yaw':
      out.spY = 90 * Math.sin(Math.PI * x) ** 2;
      break;
    case 'punch-out':
      out.throttleOverride = punchThrottle;
      break;
    case 'recover':
      out.hT = startAlt + (CRUISE_ALT_M - startAlt) * smoothstep(x);
      out.vT = ((CRUISE_ALT_M - startAlt) * 6 * x * (1 - x)) / span;
      break;
    case 'landing':
      out.hT = startAlt + (-0.5 - startAlt) * smoothstep(x);
      out.vT = ((-0.5 - startAlt) * 6 * x * (1 - x)) / span;
      out.thumbs = 1 - smoothstep(x);
      break;
    case 'hover':
      break;
  }
}
