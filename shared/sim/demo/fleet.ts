import { presetAirframe } from '../../airframe/presets';
import type { Airframe } from '../../schemas/airframe';

export interface DemoAircraft {
  key: 'kite' | 'heron' | 'osprey';
  name: string;
  /** One line for the fleet card. */
  about: string;
  airframe: Airframe;
  /** Parts as a tuner would list them, no makes or models. */
  components: { part: string; detail: string }[];
  /** Flight controllers on bigger rigs often log per-ESC current. */
  logsMotorCurrent: boolean;
}

export const demoFleet: DemoAircraft[] = [
  {
    key: 'kite',
    name: 'Kite',
    about: '5-inch freestyle quad X, 4S.',
    airframe: presetAirframe('quad-x', { name: 'Kite', armMm: 110, massG: 610 }),
    components: [
      { part: 'Frame', detail: '5-inch true X, 220 mm motor to motor' },
      { part: 'Motors', detail: '2306, 1950 kV, 14 poles' },
      { part: 'Props', detail: '5.1 × 3.6 tri-blade' },
      { part: 'ESC', detail: '4-in-1, 45 A per channel' },
      { part: 'Battery', detail: '4S 1300 mAh LiPo' },
    ],
    logsMotorCurrent: false,
  },
  {
    key: 'heron',
    name: 'Heron',
    about: 'Wide-front cinematic quad carrying a camera, 6S.',
    airframe: presetAirframe('wide-front-x', {
      name: 'Heron',
      armMm: 125,
      massG: 920,
      frontArmScale: 1.2,
    }),
    components: [
      { part: 'Frame', detail: 'Wide-front X, front arms 1.2× the rear' },
      { part: 'Camera', detail: 'Full-size action camera on a soft mount' },
      { part: 'Motors', detail: '2207, 1700 kV' },
      { part: 'Props', detail: '6 × 3.5 tri-blade' },
      { part: 'Battery', detail: '6S 2000 mAh LiPo' },
    ],
    logsMotorCurrent: false,
  },
  {
    key: 'osprey',
    name: 'Osprey',
    about: 'Hexacopter survey rig on 10-inch props, 6S.',
    airframe: presetAirframe('hex-x', { name: 'Osprey', armMm: 300, massG: 2800 }),
    components: [
      { part: 'Frame', detail: 'Hex X, folding carbon arms, 600 mm motor to motor' },
      { part: 'Payload', detail: 'Mapping camera on a fixed nadir mount' },
      { part: 'Motors', detail: '4010, 400 kV' },
      { part: 'Props', detail: '10 × 4.5 two-blade' },
      { part: 'ESC', detail: 'Individual 40 A with current telemetry' },
      { part: 'Battery', detail: '6S 6000 mAh Li-ion pack' },
    ],
    logsMotorCurrent: true,
  },
];

/** The aircraft with this key; throws for an unknown key. */
export function demoAircraft(key: string): DemoAircraft {
  const found = demoFleet.find((a) => a.key === key);
  if (!found) throw new RangeError(`no demo aircraft "${key}"`);
  return found;
}
