import type { ServiceKind } from '../../schemas/aircraft';
import type { Fault } from '../types';
import type { DemoAircraft } from './fleet';

export interface DemoFlight {
  /** Position in demoFlights, 0-based; comments refer to flights by it. */
  index: number;
  aircraft: DemoAircraft['key'];
  /** Member key of who flew it. */
  pilot: string;
  /** ISO 8601, UTC. */
  date: string;
  title: string;
  /** What the synthesiser injects; the truth behind the story. */
  faults: Fault[];
  seed: number;
  seconds: number;
  rateHz: number;
  /** Name the log file would have had on the pilot's card. */
  fileName: string;
  /** The pilot asked this coach (member key) for a review; `outcome` once the coach closed it. */
  review?: { coach: string; outcome?: 'reviewed' | 'changes-requested'; note?: string };
}

/**
 * Kite's motor 3 bearings wear: healthy for three sessions, then thrust per output² falls until it
 * is replaced. The first worn flight (7 %) stays under the fixed limits and is caught by drift
 * against the three healthy ones; the next (13 %) crosses the fixed limits too.
 */
const kiteMotor3 = (efficiency: number): Fault[] =>
  efficiency < 1 ? [{ kind: 'weak-motor', motor: 3, efficiency, cause: 'motor' }] : [];
/** Heron's heavier camera sits forward of the design CG. */
const heronCamera = (dxMm: number): Fault[] =>
  dxMm !== 0 ? [{ kind: 'cg-offset', dxMm, dyMm: 0 }] : [];
/** Osprey's replacement arm rings at a fixed frequency. */
const ospreyArm: Fault[] = [{ kind: 'frame-resonance', hz: 140, q: 14, rmsDegS: 5 }];

type Draft = Omit<DemoFlight, 'index' | 'fileName'>;

const drafts: Draft[] = [
  {
    aircraft: 'kite',
    pilot: 'tobin',
    date: '2026-09-05T09:40:00Z',
    title: 'Season opener, warm-up pack',
    faults: kiteMotor3(1),
    seed: 101,
    seconds: 36,
    rateHz: 1000,
  },
  {
    aircraft: 'heron',
    pilot: 'sol',
    date: '2026-09-05T11:15:00Z',
    title: 'Orbit practice over the pond',
    faults: heronCamera(0),
    seed: 102,
    seconds: 36,
    rateHz: 500,
  },
  {
    aircraft: 'osprey',
    pilot: 'sol',
    date: '2026-09-12T08:30:00Z',
    title: 'Survey grid, north field',
    faults: [],
    seed: 103,
    seconds: 40,
    rateHz: 500,
  },
  {
    aircraft: 'kite',
    pilot: 'tobin',
    date: '2026-09-13T10:05:00Z',
    title: 'Power loops and dives',
    faults: kiteMotor3(1),
    seed: 104,
    seconds: 36,
    rateHz: 1000,
  },
  {
    aircraft: 'heron',
    pilot: 'sol',
    date: '2026-09-19T16:20:00Z',
    title: 'Evening light, slow reveals',
    faults: heronCamera(0),
    seed: 105,
    seconds: 36,
    rateHz: 500,
  },
  {
    aircraft: 'kite',
    pilot: 'sol',
    date: '2026-09-20T09:50:00Z',
    title: 'Borrowed for a line-of-sight session',
    faults: kiteMotor3(0.995),
    seed: 106,
    seconds: 34,
    rateHz: 1000,
  },
  {
    aircraft: 'osprey',
    pilot: 'sol',
    date: '2026-09-26T08:10:00Z',
    title: 'Survey grid, south field',
    faults: [],
    seed: 107,
    seconds: 40,
    rateHz: 500,
  },
  {
    aircraft: 'heron',
    pilot: 'sol',
    date: '2026-10-03T14:00:00Z',
    title: 'First flight with the new camera',
    faults: heronCamera(14),
    seed: 108,
    seconds: 36,
    rateHz: 500,
  },
  {
    aircraft: 'kite',
    pilot: 'tobin',
    date: '2026-10-04T10:30:00Z',
    title: 'Gap practice',
    faults: kiteMotor3(0.93),
    seed: 109,
    seconds: 36,
    rateHz: 1000,
  },
  {
    aircraft: 'osprey',
    pilot: 'sol',
    date: '2026-10-10T08:45:00Z',
    title: 'Check flight after the arm repair',
    faults: ospreyArm,
    seed: 110,
    seconds: 40,
    rateHz: 500,
  },
  {
    aircraft: 'kite',
    pilot: 'tobin',
    date: '2026-10-11T09:20:00Z',
    title: 'Freestyle session, motor felt hot after',
    review: {
      coach: 'wren',
      outcome: 'reviewed',
      note: 'Motor 3 is the one working hard; swap it before the next session.',
    },
    faults: kiteMotor3(0.87),
    seed: 111,
    seconds: 36,
    rateHz: 1000,
  },
  {
    aircraft: 'heron',
    pilot: 'sol',
    date: '2026-10-11T15:40:00Z',
    title: 'Client shoot, tracking shots',
    faults: heronCamera(14),
    seed: 112,
    seconds: 38,
    rateHz: 500,
  },
  {
    aircraft: 'kite',
    pilot: 'tobin',
    date: '2026-10-17T10:00:00Z',
    title: 'Shake-down with the new motor 3',
    review: { coach: 'wren' },
    faults: kiteMotor3(1),
    seed: 113,
    seconds: 36,
    rateHz: 1000,
  },
  {
    aircraft: 'osprey',
    pilot: 'sol',
    date: '2026-10-18T08:20:00Z',
    title: 'Survey grid, river bend',
    faults: ospreyArm,
    seed: 114,
    seconds: 40,
    rateHz: 500,
  },
  {
    aircraft: 'heron',
    pilot: 'sol',
    date: '2026-10-24T13:30:00Z',
    title: 'Rebalanced: battery tray moved back',
    faults: heronCamera(3),
    seed: 115,
    seconds: 36,
    rateHz: 500,
  },
];

/** Fifteen flights over seven weeks, in date order. */
export const demoFlights: DemoFlight[] = drafts.map((d, index) => ({
  ...d,
  index,
  fileName: `${d.aircraft}-${d.date.slice(0, 10)}-${d.seed}.csv`,
}));

export interface DemoServiceEntry {
  aircraft: DemoAircraft['key'];
  /** ISO 8601 date */
  date: string;
  /** Member key */
  author: string;
  kind: ServiceKind;
  title: string;
  body: string;
  /** 1-based motor the entry concerns, if any. */
  motor?: number;
}

export const demoServiceLog: DemoServiceEntry[] = [
  {
    aircraft: 'kite',
    date: '2026-09-01',
    author: 'maren',
    kind: 'inspection',
    title: 'Pre-season check',
    body: 'New props all round, motor screws checked for length, bells spin free. Props off for the bench.',
  },
  {
    aircraft: 'heron',
    date: '2026-09-28',
    author: 'maren',
    kind: 'part-swap',
    title: 'Camera swapped for the full-size unit',
    body: 'Client wants higher bit-rate footage. The new camera is heavier and the mount sits further forward to keep the props out of frame.',
  },
  {
    aircraft: 'osprey',
    date: '2026-10-06',
    author: 'maren',
    kind: 'repair',
    title: 'Arm 4 replaced after a hard landing',
    body: 'Rear-left arm cracked at the fold joint. Fitted a spare arm and a new clamp; motor and prop re-used.',
  },
  {
    aircraft: 'kite',
    date: '2026-10-14',
    author: 'maren',
    kind: 'part-swap',
    title: 'Motor 3 replaced',
    body: 'Bench run on 13 Oct showed motor 3 drawing more current for less thrust than motor 1 (see Bench runs); bearings rough by hand. Fitted a new motor of the same type.',
    motor: 3,
  },
  {
    aircraft: 'heron',
    date: '2026-10-21',
    author: 'maren',
    kind: 'tune',
    title: 'Battery tray moved back 11 mm',
    body: 'Balances the heavier camera. Checked on a finger under the arm junction.',
  },
];
