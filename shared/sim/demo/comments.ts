import { buildPhases } from '../pilot-script';
import type { PhaseKind } from '../types';
import { demoFlights } from './flights';

export interface DemoComment {
  /** Index into demoFlights. */
  flight: number;
  /** Member key */
  author: string;
  /** Seconds into the flight the comment is pinned to. */
  tS: number;
  body: string;
  /** Member keys mentioned in the body with @. */
  mentions?: string[];
  /** Member key of who resolved the thread, if resolved. */
  resolvedBy?: string;
  replies?: { author: string; body: string }[];
}

/** Middle of the n-th phase of a kind in a demo flight's script, s (0.1 s resolution). */
function moment(flight: number, kind: PhaseKind, nth = 0): number {
  const f = demoFlights[flight];
  if (!f) throw new RangeError(`no demo flight ${flight}`);
  const found = buildPhases(f.seconds).filter((p) => p.kind === kind)[nth];
  if (!found) throw new RangeError(`demo flight ${flight} has no ${kind} #${nth}`);
  return Math.round(((found.t0 + found.t1) / 2) * 10) / 10;
}

export const demoComments: DemoComment[] = [
  {
    flight: 3,
    author: 'wren',
    tS: moment(3, 'punch-out'),
    body: 'Clean punch-out, plenty of headroom left on all four motors.',
  },
  {
    flight: 8,
    author: 'wren',
    tS: moment(8, 'hover', 1),
    body: 'Drift caught it: motor 3 works about 4 points harder than in Kite’s three flights before, though still under the fixed limits. Worth feeling the bearings and checking the prop nut before the next session.',
    replies: [{ author: 'tobin', body: 'It was warmer than the others after the last pack.' }],
  },
  {
    flight: 7,
    author: 'wren',
    tS: moment(7, 'hover', 0),
    body: 'The front pair works harder with no yaw part: that reads as the CG moving forward with the new camera, roughly 14 mm. @maren can the battery go back a little?',
    mentions: ['maren'],
    replies: [{ author: 'maren', body: 'Will move the tray after the client shoot.' }],
  },
  {
    flight: 9,
    author: 'wren',
    tS: moment(9, 'hover', 1),
    body: 'New peak near 140 Hz on roll and pitch that stays put while the throttle changes: frame, not rotor. Check the clamp on the replaced arm.',
  },
  {
    flight: 10,
    author: 'wren',
    tS: moment(10, 'hover', 2),
    body: '@maren motor 3 is now about 7 % high. Please bench-run it before Kite flies again (props off on the bench).',
    mentions: ['maren'],
    resolvedBy: 'maren',
    replies: [{ author: 'maren', body: 'Bench run done, motor replaced. See the service log.' }],
  },
  {
    flight: 11,
    author: 'wren',
    tS: moment(11, 'yaw'),
    body: 'Same forward CG as last week; the yaw turn is fine, so the props are not the issue.',
  },
  {
    flight: 12,
    author: 'wren',
    tS: moment(12, 'hover', 0),
    body: 'Balance is back within a percent after the motor swap. Nice.',
  },
  {
    flight: 13,
    author: 'wren',
    tS: moment(13, 'hover', 0),
    body: 'The 140 Hz line is still there after re-torquing. Try a new clamp or shim the fold joint.',
    replies: [{ author: 'sol', body: 'Booked bench time for Thursday.' }],
  },
];
