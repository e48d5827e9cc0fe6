import { z } from 'zod';

/**
 * The flight report: what `npm run analyze -- --json` prints, what the worker hands the review
 * and what the server stores as a flight's summary. Field meanings are set out in
 * shared/README.md §7; extra sections (traces, spectra) live beside these and are optional so
 * the core stays small.
 */
export const REPORT_VERSION = 1;

/** Least to most severe: the one order every verdict, badge, filter and stored rank uses. */
export const Severity = z.enum(['note', 'watch', 'act']);
export type Severity = z.infer<typeof Severity>;
export const SEVERITIES: readonly Severity[] = Severity.options;

/** 0 for `note` up to 2 for `act`. */
export function severityRank(s: Severity): number {
  return SEVERITIES.indexOf(s);
}

/** Sort comparator: most severe first (stable sorts keep the engine's order within a severity). */
export function mostSevereFirst(a: { severity: Severity }, b: { severity: Severity }): number {
  return severityRank(b.severity) - severityRank(a.severity);
}

export const FindingCode = z.enum([
  'motor-working-hard',
  'cg-offset',
  'torque-split',
  'vibration-peak',
  'rotor-harmonic',
  'frame-resonance',
  'motor-saturation',
  'esc-overcurrent',
  'battery-sag',
  'tracking-lag',
  'log-gap',
]);
export type FindingCode = z.infer<typeof FindingCode>;

export const Finding = z.object({
  code: FindingCode,
  severity: Severity,
  /** 1-based motor number of the airframe. */
  motor: z.number().int().min(1).optional(),
  axis: z.string().optional(),
  /** Moment in the flight, s, that shows the finding best. */
  tS: z.number().optional(),
  /** Plain-language: what it is and what to check on the bench. */
  message: z.string(),
});
export type Finding = z.infer<typeof Finding>;

export const PeakLabel = z.enum(['rotor-1x', 'rotor-2x', 'blade-pass', 'frame']).nullable();
export type PeakLabel = z.infer<typeof PeakLabel>;

export const Peak = z.object({
  hz: z.number(),
  /** 10·log10 of the one-sided PSD in (channel unit)²/Hz. */
  db: z.number(),
  label: PeakLabel,
  /** 1-based motor whose 1× or 2× order the peak follows, when rpm per motor is logged. */
  motor: z.number().int().min(1).optional(),
  /** Where the tone really is, Hz, when it lies above Nyquist and folded down to `hz`. */
  aliasOfHz: z.number().optional(),
});
export type Peak = z.infer<typeof Peak>;

const AxisTracking = z.object({ rmsDegS: z.number(), lagMs: z.number().nullable() });

export const FlightReport = z.object({
  version: z.literal(REPORT_VERSION),
  durationS: z.number(),
  sampleRateHz: z.number(),
  rows: z.number().int(),
  motorCount: z.number().int(),
  channels: z.array(z.string()),
  warnings: z.array(z.string()),
  /** Name of the airframe used, and whether it was assumed rather than given. */
  airframe: z.object({ name: z.string(), assumed: z.boolean() }),
  segments: z.object({
    hoverS: z.number(),
    hover: z.array(z.tuple([z.number(), z.number()])),
  }),
  balance: z.object({
    expectedShare: z.array(z.number()),
    measuredShare: z.array(z.number()),
    deviationPct: z.array(z.number()),
  }),
  torqueSplit: z.object({
    cwShare: z.number(),
    ccwShare: z.number(),
    asymmetryPct: z.number(),
  }),
  cg: z.object({ xMm: z.number(), yMm: z.number() }).nullable(),
  vibration: z.record(z.string(), z.object({ bandRms: z.number(), peaks: z.array(Peak).max(8) })),
  power: z
    .object({
      cells: z.number().int(),
      restCellV: z.number(),
      minCellV: z.number(),
      sagCellV: z.number(),
      internalResistanceOhm: z.number().nullable(),
      mAh: z.number().nullable(),
      wh: z.number().nullable(),
    })
    .nullable(),
  headroom: z.object({
    saturationS: z.number(),
    saturationEvents: z.array(
      z.object({ t0: z.number(), t1: z.number(), motor: z.number().int().min(1) }),
    ),
    escPeakA: z.number().nullable(),
    escOverS: z.number(),
  }),
  tracking: z.object({ roll: AxisTracking, pitch: AxisTracking, yaw: AxisTracking }).nullable(),
  findings: z.array(Finding),
});
export type FlightReport = z.infer<typeof FlightReport>;
