import type { BenchRunInput } from '../../schemas/aircraft';
import type { DemoAircraft } from './fleet';

export interface DemoBenchRun {
  aircraft: DemoAircraft['key'];
  /** Member key of who ran it. */
  author: string;
  run: BenchRunInput;
}

/**
 * A thrust-stand table for Kite's 2306 motors on 5.1-inch tri-blades, 4S: thrust rising with
 * about the square of throttle, current a little faster. Invented for the demo, in the range such
 * a motor and prop give; `wear` scales thrust down and current up, as rough bearings do.
 */
function kiteTable(wear: { thrust: number; current: number; rpm: number }) {
  return [0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1].map((throttle) => ({
    throttle,
    thrustG: Math.round(1380 * throttle ** 1.9 * wear.thrust),
    currentA: Math.round(36 * throttle ** 2.6 * wear.current * 10) / 10,
    rpm: Math.round(27_500 * throttle ** 0.95 * wear.rpm),
    voltageV: Math.round((16.4 - 1.3 * throttle) * 100) / 100,
  }));
}

/** The bench runs the service log cites: Kite's worn motor 3 beside a healthy motor of the set. */
export const demoBenchRuns: DemoBenchRun[] = [
  {
    aircraft: 'kite',
    author: 'maren',
    run: {
      date: '2026-10-13',
      motor: 'Motor 1 (2306, 1950 kV), for reference',
      prop: '5.1 × 3.6 tri-blade',
      note: 'Props on the stand only; stand clamped, behind the shield.',
      rows: kiteTable({ thrust: 1, current: 1, rpm: 1 }),
    },
  },
  {
    aircraft: 'kite',
    author: 'maren',
    run: {
      date: '2026-10-13',
      motor: 'Motor 3 (2306, 1950 kV), as removed',
      prop: '5.1 × 3.6 tri-blade',
      note: 'About 13 % less thrust for more current than motor 1; bearings rough by hand.',
      rows: kiteTable({ thrust: 0.87, current: 1.08, rpm: 0.95 }),
    },
  },
];
