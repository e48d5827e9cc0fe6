import { z } from 'zod';
import { Airframe } from './airframe';
import { DisplayName, Id, IsoDate, IsoDateTime, UserRef } from './common';
import { Severity } from './report';

const Text = (max: number) => z.string().trim().max(max);

/** The parts fitted to an aircraft, as the builder writes them down. */
export const Components = z.object({
  motors: Text(120).optional(),
  motorKv: z.number().int().positive().max(100_000).optional(),
  props: Text(120).optional(),
  esc: Text(120).optional(),
  /** Continuous current per ESC channel, A. */
  escRatingA: z.number().positive().max(1000).optional(),
  battery: Text(120).optional(),
  batteryCells: z.number().int().min(1).max(24).optional(),
  batteryMah: z.number().int().positive().max(1_000_000).optional(),
  /** Continuous C rating printed on the pack. */
  batteryC: z.number().positive().max(1000).optional(),
  frame: Text(120).optional(),
  flightController: Text(120).optional(),
});
export type Components = z.infer<typeof Components>;

export const AircraftName = DisplayName(80);

export const AircraftInput = z.object({
  name: AircraftName,
  airframe: Airframe,
  components: Components.default({}),
  notes: Text(4000).default(''),
});
export type AircraftInput = z.input<typeof AircraftInput>;

export const AircraftPatch = z
  .object({
    name: AircraftName.optional(),
    airframe: Airframe.optional(),
    components: Components.optional(),
    notes: Text(4000).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'nothing to change');
export type AircraftPatch = z.infer<typeof AircraftPatch>;

export const Aircraft = z.object({
  id: Id,
  teamId: Id,
  name: z.string(),
  airframe: Airframe,
  components: Components,
  notes: z.string(),
  /** Adds one on every write; send it back in If-Match to refuse overwriting a newer one. */
  version: z.number().int().positive(),
  flightCount: z.number().int(),
  /** Most recent flight, for the fleet card: when, worst severity, open comment threads. */
  lastFlight: z
    .object({
      id: Id,
      recordedAt: IsoDateTime,
      worstSeverity: Severity.nullable(),
      findingCount: z.number().int(),
    })
    .nullable(),
  awaitingReview: z.number().int(),
  createdAt: IsoDateTime,
  updatedAt: IsoDateTime,
});
export type Aircraft = z.infer<typeof Aircraft>;
export const AircraftList = z.object({ aircraft: z.array(Aircraft) });
export type AircraftList = z.infer<typeof AircraftList>;

export const ServiceKind = z.enum([
  'repair',
  'part-swap',
  'prop-change',
  'crash',
  'inspection',
  'tune',
  'other',
]);
export type ServiceKind = z.infer<typeof ServiceKind>;

export const ServiceEntryInput = z.object({
  date: IsoDate,
  kind: ServiceKind,
  /** 1-based motor of the airframe the work was on, when it was on one. */
  motor: z.number().int().min(1).max(16).optional(),
  note: Text(4000).min(1, 'say what was done'),
});
export type ServiceEntryInput = z.infer<typeof ServiceEntryInput>;

export const ServiceEntry = ServiceEntryInput.extend({
  id: Id,
  aircraftId: Id,
  motor: z.number().int().nullable(),
  by: UserRef,
  createdAt: IsoDateTime,
  /** Whether the caller may delete it: their role, and for a pilot whether they added it. */
  canDelete: z.boolean(),
});
export type ServiceEntry = z.infer<typeof ServiceEntry>;
export const ServiceLog = z.object({ entries: z.array(ServiceEntry) });
export type ServiceLog = z.infer<typeof ServiceLog>;

/** One thrust-stand reading. */
export const BenchRow = z.object({
  /** Command as a 0–1 fraction. */
  throttle: z.number().min(0).max(1),
  thrustG: z.number().min(-100_000).max(1_000_000),
  currentA: z.number().min(0).max(2000).optional(),
  rpm: z.number().min(0).max(500_000).optional(),
  voltageV: z.number().min(0).max(200).optional(),
});
export type BenchRow = z.infer<typeof BenchRow>;

export const BenchRunInput = z.object({
  date: IsoDate,
  motor: Text(120).min(1, 'name the motor'),
  prop: Text(120).min(1, 'name the prop'),
  note: Text(4000).default(''),
  rows: z
    .array(BenchRow)
    .min(2, 'a bench run needs at least two readings')
    .max(1000)
    .refine(
      (rows) => rows.every((r, i) => i === 0 || r.throttle > rows[i - 1]!.throttle),
      'readings must go up in throttle',
    ),
});
export type BenchRunInput = z.input<typeof BenchRunInput>;

export const BenchRun = z.object({
  id: Id,
  aircraftId: Id,
  date: IsoDate,
  motor: z.string(),
  prop: z.string(),
  note: z.string(),
  rows: z.array(BenchRow),
  by: UserRef,
  createdAt: IsoDateTime,
  /** Whether the caller's role may delete it. */
  canDelete: z.boolean(),
});
export type BenchRun = z.infer<typeof BenchRun>;
export const BenchRunList = z.object({ runs: z.array(BenchRun) });
export type BenchRunList = z.infer<typeof BenchRunList>;

/** One flight's point on the aircraft's trend charts, taken from its stored summary. */
export const TrendPoint = z.object({
  flightId: Id,
  recordedAt: IsoDateTime,
  /** Per motor, % against the airframe's expected hover output. */
  deviationPct: z.array(z.number()),
  asymmetryPct: z.number(),
  cg: z.object({ xMm: z.number(), yMm: z.number() }).nullable(),
  /** RMS from 50 Hz to Nyquist per vibration channel, in channel units. */
  bandRms: z.record(z.string(), z.number()),
  sagCellV: z.number().nullable(),
  minCellV: z.number().nullable(),
  internalResistanceOhm: z.number().nullable(),
  saturationS: z.number(),
  worstSeverity: Severity.nullable(),
  /** Seconds of steady hover and lag per axis, which drift reads; absent for flights stored before. */
  hoverS: z.number().optional(),
  lagMs: z
    .object({
      roll: z.number().nullable(),
      pitch: z.number().nullable(),
      yaw: z.number().nullable(),
    })
    .nullable()
    .optional(),
});
export type TrendPoint = z.infer<typeof TrendPoint>;
/** Oldest first, so charts draw left to right. */
export const Trends = z.object({ aircraftId: Id, points: z.array(TrendPoint) });
export type Trends = z.infer<typeof Trends>;
