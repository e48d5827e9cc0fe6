import type { ParsedLog } from '../../log/types';
import { simulate } from '../simulate';
import type { GroundTruth, Scenario } from '../types';
import { demoMembers } from './crew';
import { demoAircraft } from './fleet';
import type { DemoFlight } from './flights';

/** The synthesiser's scenario behind a demo flight. */
export function demoFlightScenario(flight: DemoFlight): Scenario {
  const aircraft = demoAircraft(flight.aircraft);
  return {
    name: `demo-${flight.aircraft}-${flight.index}`,
    describe: `${aircraft.name}: ${flight.title}`,
    airframe: aircraft.airframe,
    faults: flight.faults,
    logMotorCurrent: aircraft.logsMotorCurrent,
    seconds: flight.seconds,
    rateHz: flight.rateHz,
  };
}

/** Synthesises a demo flight's log (deterministic from its seed) and the truth behind it. */
export function demoFlightLog(flight: DemoFlight): { log: ParsedLog; truth: GroundTruth } {
  const { log, truth } = simulate(demoFlightScenario(flight), {
    seconds: flight.seconds,
    rateHz: flight.rateHz,
    seed: flight.seed,
  });
  const pilot = demoMembers.find((m) => m.key === flight.pilot);
  log.metadata = {
    ...log.metadata,
    aircraft: demoAircraft(flight.aircraft).name,
    pilot: pilot?.name ?? flight.pilot,
    date: flight.date,
    title: flight.title,
  };
  return { log, truth };
}
