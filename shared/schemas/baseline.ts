import { z } from 'zod';
import { Id, IsoDate, IsoDateTime } from './common';
import { ServiceKind } from './aircraft';

/**
 * The few numbers of one flight that drift compares (shared/analysis/drift.ts): what a baseline
 * flight contributes, small enough to send ten of them and to keep beside each stored flight.
 */
export const DriftSample = z.object({
  /** Seconds of steady hover; balance is judged only from flights with enough of it. */
  hoverS: z.number().min(0),
  /** Per motor, % against the airframe's expected hover output (`balance.deviationPct`). */
  deviationPct: z.array(z.number()),
  asymmetryPct: z.number(),
  cg: z.object({ xMm: z.number(), yMm: z.number() }).nullable(),
  /** Band RMS per vibration channel, in channel units. */
  bandRms: z.record(z.string(), z.number()),
  internalResistanceOhm: z.number().nullable(),
  lagMs: z
    .object({
      roll: z.number().nullable(),
      pitch: z.number().nullable(),
      yaw: z.number().nullable(),
    })
    .nullable(),
});
export type DriftSample = z.infer<typeof DriftSample>;

/** The service-log entry a baseline starts after: the latest change of configuration. */
export const BaselineCut = z.object({
  date: IsoDate,
  kind: ServiceKind,
  motor: z.number().int().nullable(),
  note: z.string(),
});
export type BaselineCut = z.infer<typeof BaselineCut>;

export const BaselineFlight = z.object({
  flightId: Id,
  recordedAt: IsoDateTime,
  sample: DriftSample,
});
export type BaselineFlight = z.infer<typeof BaselineFlight>;

/** `GET /api/aircraft/:id/baseline?before=…&exclude=…`: the query. */
export const BaselineQuery = z.object({
  /** The flight being judged was recorded at this time; only earlier flights count. */
  before: IsoDateTime,
  /** The flight being judged, left out when it shares the time with another. */
  exclude: Id.optional(),
});
export type BaselineQuery = z.infer<typeof BaselineQuery>;

/**
 * The aircraft's recent flights before a given time, since its latest configuration change,
 * with enough hover by the team's thresholds; oldest first, at most the team's
 * `driftMaxFlights`.
 */
export const AircraftBaseline = z.object({
  aircraftId: Id,
  aircraftName: z.string(),
  since: BaselineCut.nullable(),
  flights: z.array(BaselineFlight),
  /** Earlier flights since the cut that were left out for too little hover. */
  shortHover: z.number().int().min(0),
});
export type AircraftBaseline = z.infer<typeof AircraftBaseline>;
