import { presetAirframe } from '../airframe/presets';
import type { Fault, Scenario } from './types';

const kite5 = presetAirframe('quad-x', { name: '5-inch quad X' });

function scenario(
  name: string,
  describe: string,
  rest: Omit<Scenario, 'name' | 'describe'>,
): Scenario {
  return { name, describe, seconds: 60, rateHz: 1000, ...rest };
}

/** Named flights with known faults: for tests, the sample-flight button and benchmarks. */
export const scenarios: Record<string, Scenario> = {
  'clean-quad-x': scenario(
    'clean-quad-x',
    'Healthy 5-inch quad X, 600 g, 4S: the baseline every other scenario differs from.',
    {
      airframe: kite5,
      faults: [],
    },
  ),
  'weak-motor': scenario(
    'weak-motor',
    'Motor 3 (rear-left) gives 12 % less thrust per output²: worn bearings or a tired magnet.',
    {
      airframe: kite5,
      faults: [{ kind: 'weak-motor', motor: 3, efficiency: 0.88 }],
    },
  ),
  'cg-offset': scenario(
    'cg-offset',
    'Battery strapped 15 mm forward: the front motors carry more, with no yaw part.',
    {
      airframe: kite5,
      faults: [{ kind: 'cg-offset', dxMm: 15, dyMm: 0 }],
    },
  ),
  'spin-mismatch': scenario(
    'spin-mismatch',
    'The clockwise props make 10 % more reaction torque (a different prop model on one spin set): the ccw set works harder to hold yaw.',
    { airframe: kite5, faults: [{ kind: 'spin-mismatch', spin: 'cw', torqueScale: 1.1 }] },
  ),
  'tilted-motor': scenario(
    'tilted-motor',
    'Motor 2 tilted 4° about its arm after a crash: a steady yaw push the spin sets must cancel.',
    {
      airframe: kite5,
      faults: [{ kind: 'tilted-motor', motor: 2, deg: 4 }],
    },
  ),
  'rotor-imbalance': scenario(
    'rotor-imbalance',
    'Chipped prop on motor 2: unbalance 2 g·mm, a strong line at that rotor’s 1× frequency.',
    {
      airframe: kite5,
      faults: [{ kind: 'rotor-imbalance', motor: 2, unbalanceGmm: 2 }],
    },
  ),
  'frame-resonance': scenario(
    'frame-resonance',
    'Loose arm: a 290 Hz structural mode that stays put whatever the throttle (between the rotors’ 1× and 2× lines in a hover).',
    {
      airframe: kite5,
      faults: [{ kind: 'frame-resonance', hz: 290, q: 15, rmsDegS: 6 }],
    },
  ),
  'tired-battery': scenario(
    'tired-battery',
    'Old pack: 3.5× the internal resistance and 70 % of the capacity; deep sag in the punch-out.',
    {
      airframe: kite5,
      faults: [{ kind: 'tired-battery', resistanceScale: 3.5, capacityScale: 0.7 }],
    },
  ),
  'esc-overcurrent': scenario(
    'esc-overcurrent',
    '8 A ESCs on a build that pulls about 10 A per motor in a punch-out; per-ESC current logged.',
    {
      airframe: kite5,
      faults: [{ kind: 'esc-overcurrent', escMaxA: 8 }],
      logMotorCurrent: true,
    },
  ),
  underpowered: scenario(
    'underpowered',
    'Motors with 30 % of the thrust the frame was built for: hover above 80 % output, manoeuvres hit the top.',
    {
      airframe: kite5,
      faults: [{ kind: 'underpowered', maxThrustScale: 0.3 }],
    },
  ),
  'tracking-delay': scenario(
    'tracking-delay',
    '40 ms extra between the pilot’s sticks and the controller (a slow radio link).',
    {
      airframe: kite5,
      faults: [{ kind: 'tracking-delay', delayMs: 40 }],
    },
  ),
  'slow-loop': scenario(
    'slow-loop',
    'A soft tune: rate-loop gains and feedforward at 70 % of a good tune, so the aircraft trails the sticks by 15–20 ms.',
    {
      airframe: kite5,
      faults: [{ kind: 'slow-loop', gainScale: 0.7 }],
    },
  ),
  'quiet-frame-line': scenario(
    'quiet-frame-line',
    'A 260 Hz frame mode on the roll axis, under the absolute gyro limit yet most of that axis’s vibration: a loose camera plate.',
    {
      airframe: kite5,
      faults: [{ kind: 'frame-resonance', hz: 260, q: 20, rmsDegS: 3, axis: 'roll' }],
    },
  ),
  'wide-front-healthy': scenario(
    'wide-front-healthy',
    'Healthy wide-front cinematic quad, front arms 1.2× the rear: unequal expected outputs that are not a fault.',
    { airframe: presetAirframe('wide-front-x', { name: 'Wide-front X' }), faults: [] },
  ),
  'stretched-healthy': scenario(
    'stretched-healthy',
    'Healthy stretched X (fore-aft spacing 1.3× the width).',
    {
      airframe: presetAirframe('stretched-x', { name: 'Stretched X' }),
      faults: [],
    },
  ),
  'quad-plus': scenario('quad-plus', 'Healthy quad + with motor 1 on the nose.', {
    airframe: presetAirframe('quad-plus', { name: 'Quad +' }),
    faults: [],
  }),
  'hex-clean': scenario('hex-clean', 'Healthy 2.8 kg hex X survey rig on 10-inch props, 6S.', {
    airframe: presetAirframe('hex-x', { name: 'Hex X survey rig' }),
    faults: [],
    rateHz: 500,
  }),
  'hex-weak-motor': scenario(
    'hex-weak-motor',
    'Hex survey rig whose motor 5 prop makes 15 % less thrust per rpm² (a chipped blade pair): the hex spreads the correction, so its output rises only a few %.',
    {
      airframe: presetAirframe('hex-x', { name: 'Hex X survey rig' }),
      faults: [{ kind: 'weak-motor', motor: 5, efficiency: 0.85, cause: 'prop' }],
      rateHz: 500,
    },
  ),
  'octo-clean': scenario('octo-clean', 'Healthy 4.5 kg octo X on 12-inch props, 6S.', {
    airframe: presetAirframe('octo-x', { name: 'Octo X heavy lift' }),
    faults: [],
    rateHz: 500,
  }),
};

/** Scenario names in listing order. */
export const scenarioNames = Object.keys(scenarios);

/** The same aircraft with extra faults added, for combined cases. */
export function withFaults(
  base: Scenario,
  faults: Fault[],
  name = `${base.name}+${faults.map((f) => f.kind).join('+')}`,
): Scenario {
  return { ...base, name, faults: [...base.faults, ...faults] };
}
