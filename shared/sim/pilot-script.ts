import type { Phase, PhaseKind } from './types';

/** Shortest flight the script can fly: idle, take-off, a hover, landing. */
export const MIN_FLIGHT_S = 10;

const LEAD_S = 1.5;
const TAKE_OFF_S = 2.5;
const LANDING_S = 3;
const TAIL_S = 1;
const MANOEUVRES: [PhaseKind, number][] = [
  ['roll', 2],
  ['pitch', 2],
  ['yaw', 2.5],
  ['punch-out', 0.5],
  ['recover', 5],
];
const MANOEUVRE_S = MANOEUVRES.reduce((s, [, d]) => s + d, 0);
/** Hovers per block: before roll, pitch, yaw and the punch-out, and one after the recovery. */
const HOVERS = 5;
const MIN_HOVER_S = 1.5;
const BLOCK_S = 45;

/**
 * The scripted pilot's plan for a flight of `seconds`: idle, take-off, blocks of steady hovers
 * between gentle rolls, pitches, yaws and a punch-out, landing, idle. Too short for a block:
 * one long hover. Phases tile [0, seconds] without gaps.
 */
export function buildPhases(seconds: number): Phase[] {
  if (!(seconds >= MIN_FLIGHT_S)) {
    throw new RangeError(`a scripted flight needs at least ${MIN_FLIGHT_S} s, got ${seconds}`);
  }
  const phases: Phase[] = [];
  let t = 0;
  const push = (kind: PhaseKind, d: number) => {
    phases.push({ kind, t0: t, t1: t + d });
    t += d;
  };
  push('idle', LEAD_S);
  push('take-off', TAKE_OFF_S);
  const core = seconds - LEAD_S - TAKE_OFF_S - LANDING_S - TAIL_S;
  if (core < MANOEUVRE_S + HOVERS * MIN_HOVER_S) {
    push('hover', core);
  } else {
    const blocks = Math.max(1, Math.floor(core / BLOCK_S));
    const hover = (core / blocks - MANOEUVRE_S) / HOVERS;
    for (let b = 0; b < blocks; b++) {
      for (const [kind, d] of MANOEUVRES) {
        if (kind !== 'recover') push('hover', hover);
        push(kind, d);
      }
      push('hover', hover);
    }
  }
  push('landing', LANDING_S);
  push('idle', seconds - t);
  // Floating-point sums: pin the last edge to the flight's end exactly.
  phases[phases.length - 1]!.t1 = seconds;
  return phases;
}
